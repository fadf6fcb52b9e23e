/**
 * Vitest global setup: bundle the CLI once before the tests, so the end-to-end and browser tests
 * always run the current source through dist/cli.js (type declarations are not needed here).
 */
import { execFileSync } from 'node:child_process';

export default function setup(): void {
  execFileSync(process.execPath, ['scripts/build.mjs', '--bundle-only'], { stdio: 'inherit' });
}
