// Build: bundle the CLI and the library with esbuild (start-up time: one file to load instead of
// hundreds), then emit type declarations for the library with tsc.
// Code splitting: vega and vega-lite (src/report/chartRuntime.ts, loaded with import() only when a
// chart is written) become a chunk of their own; bundled and minified, they load in about a
// quarter of the time they take from node_modules.
import { build } from 'esbuild';
import { execFileSync } from 'node:child_process';
import { chmodSync, readFileSync, rmSync, writeFileSync } from 'node:fs';

const pkg = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));
const common = {
  bundle: true,
  splitting: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  minifyWhitespace: true,
  minifySyntax: true,
  chunkNames: 'chunks/[name]-[hash]',
  banner: { js: "import { createRequire as __btCreateRequire } from 'node:module'; const require = __btCreateRequire(import.meta.url);" },
  define: { __BRANCHTRACE_VERSION__: JSON.stringify(pkg.version) },
  logLevel: 'warning',
};

const bundleOnly = process.argv.includes('--bundle-only');
if (!bundleOnly) rmSync(new URL('../dist', import.meta.url), { recursive: true, force: true });
// The sweep runs in a worker thread so that Ctrl-C can stop it cleanly (src/runSweep.ts); the
// worker and the CLI share chunks.
await build({ ...common, entryPoints: ['src/cli.ts', 'src/sweepWorker.ts'], outdir: 'dist' });
const cli = readFileSync('dist/cli.js', 'utf8');
writeFileSync('dist/cli.js', `#!/usr/bin/env node\n${cli}`);
chmodSync('dist/cli.js', 0o755);
await build({ ...common, entryPoints: ['src/index.ts'], outdir: 'dist/lib' });
// `--bundle-only` (used by the test setup) skips the type declarations, which only the library's users need.
if (!bundleOnly) {
  execFileSync(process.execPath, ['node_modules/typescript/bin/tsc', '-p', 'tsconfig.build.json'], { stdio: 'inherit' });
}
