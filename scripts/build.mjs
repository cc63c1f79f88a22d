// Bundles the command-line tool (and, with --bench, the benchmarks) into dist/ with esbuild.
import { build } from 'esbuild';
import { chmodSync } from 'node:fs';

// Some dependencies are CommonJS and call require() for Node built-ins; an ES module bundle
// needs a require of its own for them.
const requireShim = "import { createRequire as __comoveCreateRequire } from 'node:module'; const require = __comoveCreateRequire(import.meta.url);";
const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  sourcemap: true,
  logLevel: 'warning',
  banner: { js: requireShim },
};

await build({
  ...common,
  entryPoints: ['cli/src/main.ts'],
  outfile: 'dist/cli.js',
  banner: { js: `#!/usr/bin/env node\n${requireShim}` },
});
chmodSync('dist/cli.js', 0o755);

// The language server, for `node dist/server.js --stdio` and the end-to-end tests.
await build({ ...common, entryPoints: ['server/src/main.ts'], outfile: 'dist/server.js' });

if (process.argv.includes('--bench')) {
  await build({ ...common, entryPoints: ['test/bench/engine.bench.ts'], outfile: 'dist/bench/engine.bench.js' });
  await build({ ...common, entryPoints: ['test/bench/reader.bench.ts'], outfile: 'dist/bench/reader.bench.js' });
  await build({ ...common, entryPoints: ['test/bench/check.bench.ts'], outfile: 'dist/bench/check.bench.js' });
  await build({ ...common, entryPoints: ['test/bench/server.bench.ts'], outfile: 'dist/bench/server.bench.js' });
}
