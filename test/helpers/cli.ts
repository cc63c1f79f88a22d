/** Runs the command line in-process with files from a map; returns exit code, output and the files written. */
import { runCli } from '../../cli/src/run.js';

export function runWithFiles(argv: string[], files: Record<string, string> = {}, options: { terminal?: boolean } = {}): { code: number; stdout: string; stderr: string; written: Record<string, string> } {
  let stdout = '';
  let stderr = '';
  const written: Record<string, string> = {};
  const code = runCli(argv, {
    stdout: (t) => (stdout += typeof t === 'string' ? t : new TextDecoder().decode(t)),
    stderr: (t) => (stderr += t),
    readFile: (p) => {
      if (p in files) return files[p];
      throw new Error('no such file');
    },
    // Folders are the path prefixes of the files in the map.
    listFolder: (p) => {
      const prefix = p.replace(/\/$/, '') + '/';
      const names = new Map<string, boolean>();
      for (const f of Object.keys(files)) {
        if (!f.startsWith(prefix)) continue;
        const rest = f.slice(prefix.length);
        const slash = rest.indexOf('/');
        names.set(slash < 0 ? rest : rest.slice(0, slash), slash >= 0);
      }
      return names.size ? [...names].map(([name, folder]) => ({ name, folder })) : null;
    },
    writeFile: (p, text) => {
      written[p] = text;
    },
    stderrIsTerminal: options.terminal === true,
  });
  return { code, stdout, stderr, written };
}
