// Bundles the command-line tool (and, with --bench, the benchmarks) into dist/ with esbuild.
import { build } from 'esbuild';
import { chmodSync } from 'node:fs';

const common = { bundle: true, platform: 'node', target: 'node20', format: 'esm', sourcemap: true, logLevel: 'warning' };

await build({
  ...common,
  entryPoints: ['cli/src/main.ts'],
  outfile: 'dist/cli.js',
  banner: { js: '#!/usr/bin/env node' },
});
chmodSync('dist/cli.js', 0o755);

if (process.argv.includes('--bench')) {
  await build({ ...common, entryPoints: ['test/bench/engine.bench.ts'], outfile: 'dist/bench/engine.bench.js' });
}
