/**
 * Fixture manuscripts (test/fixtures/manuscripts, an invented survey and its people-free
 * scenario) with hand-written expected claims beside them (`*.expected.json`: the truth, written
 * by reading the manuscript, never generated). For each file the test prints precision and recall
 * of the extracted claims (kind, text and redshift must all agree) and fails below 0.95 / 0.90.
 *
 * Beside them, `*.extraction.json` is the full current output, kept so that review sees every
 * change as a diff. Regenerate it with `npm run fixtures:update` and read the diff.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { extractProject, type FileExtraction } from '../../shared/src/index.js';
import { fileJson } from '../../cli/src/extractCommand.js';

const ROOT = new URL('../fixtures/manuscripts/', import.meta.url).pathname;
const UPDATE = process.env.UPDATE_FIXTURES === '1';

interface ExpectedClaim {
  kind: string;
  text: string;
  z?: number | null;
  file?: string;
}
interface Expected {
  declarations?: Array<{ origin: string; role: string; parameters?: Record<string, unknown>; preset?: string; incomplete?: boolean }>;
  claims: ExpectedClaim[];
}

function fixtures(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? fixtures(join(dir, e.name)) : e.name.endsWith('.expected.json') ? [join(dir, e.name)] : []));
}

function manuscriptOf(expectedPath: string): string {
  const base = expectedPath.replace(/\.expected\.json$/, '');
  const found = ['.tex', '.md', '.txt'].map((ext) => base + ext).find((p) => existsSync(p));
  if (!found) throw new Error(`no manuscript beside ${expectedPath}`);
  return found;
}

const resolver = (fromUri: string, path: string) => {
  for (const candidate of [path, `${path}.tex`]) {
    const full = join(dirname(fromUri), candidate);
    if (existsSync(full)) return { uri: full, text: readFileSync(full, 'utf8') };
  }
  return null;
};

const summary: string[] = [];

describe('fixture manuscripts', () => {
  for (const expectedPath of fixtures(ROOT)) {
    const manuscript = manuscriptOf(expectedPath);
    const name = relative(ROOT, manuscript);
    const expected = JSON.parse(readFileSync(expectedPath, 'utf8')) as Expected;
    const project = extractProject({ uri: manuscript, text: readFileSync(manuscript, 'utf8') }, resolver);

    it(`${name}: claims found with precision ≥ 0.95 and recall ≥ 0.90`, () => {
      const extracted = project.files.flatMap((f: FileExtraction) =>
        f.claims.map((c) => ({ file: relative(ROOT, f.uri), kind: c.kind, text: f.reading.reading.text.slice(c.start, c.end), z: c.zRange ? c.zRange[1] : c.z })),
      );
      const unmatched = [...extracted];
      let matched = 0;
      const missed: ExpectedClaim[] = [];
      for (const e of expected.claims) {
        const i = unmatched.findIndex((x) => x.kind === e.kind && x.text === e.text && (e.z === undefined || x.z === e.z) && (!e.file || x.file === e.file));
        if (i >= 0) {
          matched++;
          unmatched.splice(i, 1);
        } else missed.push(e);
      }
      const precision = extracted.length ? matched / extracted.length : 1;
      const recall = expected.claims.length ? matched / expected.claims.length : 1;
      summary.push(`  ${name.padEnd(40)} claims ${String(expected.claims.length).padStart(3)}  found ${String(extracted.length).padStart(3)}  precision ${precision.toFixed(3)}  recall ${recall.toFixed(3)}`);
      const detail = `missed: ${JSON.stringify(missed)}\nspurious: ${JSON.stringify(unmatched)}`;
      expect(precision, detail).toBeGreaterThanOrEqual(0.95);
      expect(recall, detail).toBeGreaterThanOrEqual(0.9);
    });

    it(`${name}: declarations as expected`, () => {
      const found = project.files.flatMap((f) => f.declarations);
      for (const d of expected.declarations ?? []) {
        const hit = found.find(
          (x) =>
            x.origin === d.origin &&
            x.role === d.role &&
            (d.preset === undefined || x.preset === d.preset) &&
            (d.incomplete === undefined || (x.incomplete !== null) === d.incomplete) &&
            Object.entries(d.parameters ?? {}).every(([k, v]) => (x.input as Record<string, unknown>)[k] === v),
        );
        expect(hit, `declaration ${JSON.stringify(d)} among ${JSON.stringify(found.map((x) => ({ origin: x.origin, role: x.role, input: x.input })))}`).toBeDefined();
      }
      expect(found.length).toBe((expected.declarations ?? []).length);
    });

    it(`${name}: the full extraction matches ${relative(ROOT, expectedPath.replace('.expected.json', '.extraction.json'))}`, () => {
      const snapshotPath = expectedPath.replace('.expected.json', '.extraction.json');
      const current = JSON.stringify(
        project.files.map((f) => ({ ...fileJson(f, readFileSync(f.uri, 'utf8')), path: relative(ROOT, f.uri) })),
        null,
        1,
      );
      if (UPDATE || !existsSync(snapshotPath)) writeFileSync(snapshotPath, current + '\n');
      expect(readFileSync(snapshotPath, 'utf8'), 'the extraction changed: run `npm run fixtures:update` and review the diff').toBe(current + '\n');
    });
  }

  it('prints precision and recall per fixture', () => {
    console.log(`Claim extraction on the fixture manuscripts:\n${summary.join('\n')}`);
    expect(summary.length).toBeGreaterThanOrEqual(8);
  });
});
