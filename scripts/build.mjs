// Build: bundle the CLI and the library with esbuild (start-up time: one file to load instead of
// hundreds), then emit type declarations for the library with tsc.
// vega and vega-lite stay external: they are loaded with import() only when a diagram is written.
import { build } from 'esbuild';
import { execFileSync } from 'node:child_process';
import { chmodSync, readFileSync, rmSync } from 'node:fs';

const pkg = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));
const common = {
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  external: ['vega', 'vega-lite'],
  banner: { js: "import { createRequire as __btCreateRequire } from 'node:module'; const require = __btCreateRequire(import.meta.url);" },
  define: { __BRANCHTRACE_VERSION__: JSON.stringify(pkg.version) },
  logLevel: 'warning',
};

const bundleOnly = process.argv.includes('--bundle-only');
if (!bundleOnly) rmSync(new URL('../dist', import.meta.url), { recursive: true, force: true });
await build({
  ...common,
  entryPoints: ['src/cli.ts'],
  outfile: 'dist/cli.js',
  banner: { js: '#!/usr/bin/env node\n' + common.banner.js },
});
chmodSync('dist/cli.js', 0o755);
// The sweep runs in a worker thread so that Ctrl-C can stop it cleanly (src/runSweep.ts).
await build({ ...common, entryPoints: ['src/sweepWorker.ts'], outfile: 'dist/sweepWorker.js' });
await build({ ...common, entryPoints: ['src/index.ts'], outfile: 'dist/lib/index.js' });
// `--bundle-only` (used by the test setup) skips the type declarations, which only the library's users need.
if (!bundleOnly) {
  execFileSync(process.execPath, ['node_modules/typescript/bin/tsc', '-p', 'tsconfig.build.json'], { stdio: 'inherit' });
}
