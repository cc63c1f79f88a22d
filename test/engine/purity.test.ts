/** The core is pure (ARCHITECTURE.md, invariants): no I/O modules, no protocol types, no process state. */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? sources(join(dir, e.name)) : e.name.endsWith('.ts') ? [join(dir, e.name)] : []));
}

describe('shared/ is pure', () => {
  const root = new URL('../../shared/src', import.meta.url).pathname;
  const files = sources(root);
  it('has source files', () => expect(files.length).toBeGreaterThan(10));
  for (const file of files) {
    it(`${file.slice(root.length + 1)} imports no I/O or protocol modules and reads no process state`, () => {
      const text = readFileSync(file, 'utf8');
      expect(text).not.toMatch(/from ['"](node:|fs|path|os|child_process|vscode)/);
      expect(text).not.toMatch(/\brequire\(/);
      expect(text).not.toMatch(/\bprocess\.|\bDate\.now\(|\bconsole\./);
    });
  }
});
