// Builds the installable VS Code extension offline: bundles the client (CommonJS, as VS Code
// loads it) and the server (an ES module) minified into a staging folder with the manifest,
// README, licence and grammar, then packs it with @vscode/vsce into dist/comove-VERSION.vsix.
import { build } from 'esbuild';
import { execFileSync } from 'node:child_process';
import { cpSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const stage = 'dist/vsix';
rmSync(stage, { recursive: true, force: true });
mkdirSync(`${stage}/dist`, { recursive: true });
const requireShim = "import { createRequire as __comoveCreateRequire } from 'node:module'; const require = __comoveCreateRequire(import.meta.url);";
const common = { bundle: true, platform: 'node', target: 'node20', minify: true, legalComments: 'none', logLevel: 'warning' };
await build({ ...common, entryPoints: ['client/src/extension.ts'], outfile: `${stage}/dist/extension.cjs`, format: 'cjs', external: ['vscode'] });
await build({ ...common, entryPoints: ['server/src/main.ts'], outfile: `${stage}/dist/server.mjs`, format: 'esm', banner: { js: requireShim } });

const manifest = JSON.parse(readFileSync('client/package.json', 'utf8'));
manifest.files = ['dist', 'syntaxes', 'README.md', 'LICENSE'];
writeFileSync(`${stage}/package.json`, JSON.stringify(manifest, null, 2));
cpSync('client/README.md', `${stage}/README.md`);
cpSync('LICENSE', `${stage}/LICENSE`);
cpSync('syntaxes', `${stage}/syntaxes`, { recursive: true, filter: (p) => !p.endsWith('README.md') });

const vsce = createRequire(import.meta.url).resolve('@vscode/vsce/vsce');
const out = `../comove-${manifest.version}.vsix`;
execFileSync(process.execPath, [vsce, 'package', '--no-dependencies', '--no-update-package-json', '--out', out], { cwd: stage, stdio: 'inherit' });
const size = (path) => (statSync(path).size / 1024).toFixed(0);
console.log(`extension.cjs ${size(`${stage}/dist/extension.cjs`)} kB, server.mjs ${size(`${stage}/dist/server.mjs`)} kB, dist/comove-${manifest.version}.vsix ${size(`dist/comove-${manifest.version}.vsix`)} kB`);
