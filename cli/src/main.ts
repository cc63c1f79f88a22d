/** Entry point of the `comove` command: the only place that touches the process and the file system. */

import { readdirSync, readFileSync, readSync, statSync, writeFileSync } from 'node:fs';
import { runCli } from './run.js';

/**
 * All of standard input. A pipe may be non-blocking (EAGAIN while the writer is slow), so the
 * read waits a millisecond and tries again rather than failing.
 */
function readStandardInput(): string {
  const chunks: Buffer[] = [];
  const buffer = Buffer.alloc(1 << 16);
  const pause = new Int32Array(new SharedArrayBuffer(4));
  for (;;) {
    let n: number;
    try {
      n = readSync(0, buffer, 0, buffer.length, null);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code === 'EAGAIN') {
        Atomics.wait(pause, 0, 0, 1);
        continue;
      }
      if (code === 'EOF') break;
      throw e;
    }
    if (n === 0) break;
    chunks.push(Buffer.from(buffer.subarray(0, n)));
  }
  return Buffer.concat(chunks).toString('utf8');
}

const code = runCli(process.argv.slice(2), {
  stdout: (t) => process.stdout.write(t),
  stderr: (t) => process.stderr.write(t),
  readFile: (path) => {
    try {
      return path === '-' ? readStandardInput() : readFileSync(path, 'utf8');
    } catch (e) {
      const err = e as NodeJS.ErrnoException;
      throw new Error(err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'it is a folder' : err.message);
    }
  },
  listFolder: (path) => {
    try {
      if (path === '-' || !statSync(path).isDirectory()) return null;
      return readdirSync(path, { withFileTypes: true }).map((e) => ({ name: e.name, folder: e.isDirectory() }));
    } catch {
      return null;
    }
  },
  writeFile: (path, text) => writeFileSync(path, text, 'utf8'),
  stderrIsTerminal: process.stderr.isTTY === true,
});
process.exitCode = code;
