/** Runs the command line in-process with files from a map; returns exit code and output. */
import { runCli } from '../../cli/src/run.js';

export function runWithFiles(argv: string[], files: Record<string, string> = {}): { code: number; stdout: string; stderr: string } {
  let stdout = '';
  let stderr = '';
  const code = runCli(argv, {
    stdout: (t) => (stdout += typeof t === 'string' ? t : new TextDecoder().decode(t)),
    stderr: (t) => (stderr += t),
    readFile: (p) => {
      if (p in files) return files[p];
      throw new Error('no such file');
    },
  });
  return { code, stdout, stderr };
}
