// npm run demo: the most complete job branchtrace does, on a bundled model.
// Sweeps the Damkohler number of the cooled tank reactor (two folds, a Hopf point), lists the
// equilibria at the nominal design value, and draws the phase portrait there. Outputs go to out/.
import { spawnSync } from 'node:child_process';

const model = 'models/cooled-tank-reactor.yaml';
const steps = [
  ['equilibria', model],
  ['sweep', model, '--vary', 'Da', '--from', '0.02', '--to', '0.2', '--out', 'out/demo-sweep'],
  ['portrait', model, '--at', 'Da=0.1', '--out', 'out/demo-portrait'],
];
for (const args of steps) {
  process.stdout.write(`\n$ branchtrace ${args.join(' ')}\n`);
  const r = spawnSync(process.execPath, ['dist/cli.js', ...args], { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
process.stdout.write('\nOpen out/demo-sweep/diagram.html and out/demo-portrait/portrait.html in a browser; ' +
  'out/demo-sweep/report.md is the written report.\n');
