/** Entry point of the `comove` command: the only place that touches the process and the file system. */

import { readFileSync } from 'node:fs';
import { runCli } from './run.js';

const code = runCli(process.argv.slice(2), {
  stdout: (t) => process.stdout.write(t),
  stderr: (t) => process.stderr.write(t),
  readFile: (path) => {
    try {
      return readFileSync(path === '-' ? 0 : path, 'utf8');
    } catch (e) {
      const err = e as NodeJS.ErrnoException;
      throw new Error(err.code === 'ENOENT' ? 'no such file' : err.message);
    }
  },
});
process.exitCode = code;
