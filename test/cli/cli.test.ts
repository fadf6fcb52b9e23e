/**
 * The command line end to end, through the bundled dist/cli.js: what a user types and sees.
 * Values checked here are analytic or published (named beside each assertion).
 */
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { message } from '../../src/errors.js';
import { CAUTION } from '../../src/report/caution.js';
import { oneLineError, runCli, tempDir } from './runCli.js';

const TOGGLE = 'models/genetic-toggle-switch.yaml';
const REACTOR = 'models/cooled-tank-reactor.yaml';

/** x' = λ + x − x³, y' = −y: an S-shaped branch with folds at λ = ±2/(3√3) (analytic: dλ/dx = 3x² − 1 = 0). */
const S_CURVE = `title: S-shaped test branch
about: demo only (invented numbers); folds at lambda = +-2/(3*sqrt(3)) by hand
states:
  x: -1.2
  y: 0
parameters:
  lambda: { value: 0.3, unit: "-" }
equations:
  x: lambda + x - x^3
  y: -y
`;

function writeModel(text: string, name = 'model.yaml'): string {
  const file = join(tempDir('model'), name);
  writeFileSync(file, text);
  return file;
}

describe('branchtrace check', () => {
  it('prints states, parameters, the residual at the start guess and a tiny Jacobian mismatch', () => {
    const r = runCli(['check', REACTOR]);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/conversion/);
    expect(r.stdout).toMatch(/Damkohler number/);
    const mismatch = Number(/largest relative mismatch (\S+)/.exec(r.stdout)?.[1]);
    expect(mismatch).toBeLessThan(1e-6); // common practice bound, also the model-file issue's
  });

  it('shows the bounds a state is given', () => {
    const r = runCli(['check', join(process.cwd(), 'models/predator-prey-enrichment.yaml')]);
    expect(r.stdout).toMatch(/^algae\s+1\s+>= 0\s+mg\/L/m);
    const file = writeModel('states:\n  a: { start: 0.5, min: -1, max: 1 }\nequations:\n  a: -a\n');
    expect(runCli(['check', file]).stdout).toMatch(/^a\s+0\.5\s+−1 to 1\s/m);
  });
});

describe('branchtrace equilibria', () => {
  it('--json lists the three equilibria of the bistable toggle switch with the documented keys', () => {
    // Gardner, Cantor & Collins (2000), Nature 403:339: bistable at alpha1 = alpha2 = 10, cooperativity 2.
    const r = runCli(['equilibria', TOGGLE, '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { equilibria: { state: Record<string, number>; type: string; stable: boolean; unstableDimension: number; residual: number; eigenvalues: { re: number; im: number }[] }[] };
    expect(out.equilibria.map((e) => e.type).sort()).toEqual(['saddle', 'stable node', 'stable node']);
    const saddle = out.equilibria.find((e) => e.type === 'saddle')!;
    // Analytic: by symmetry the saddle has u = v with u = 10/(1 + u²), i.e. u³ + u − 10 = 0, u = 2.
    expect(saddle.state['u']).toBeCloseTo(2, 10);
    expect(saddle.state['v']).toBeCloseTo(2, 10);
    expect(saddle.unstableDimension).toBe(1);
    for (const e of out.equilibria) expect(e.residual).toBeLessThanOrEqual(1e-10);
    expect((out as unknown as { caution: string }).caution).toBe(CAUTION);
  });

  it('--set changes a parameter: with alpha1 = 1 the switch has one stable state', () => {
    // Gardner et al. (2000), Fig. 1b: strongly unbalanced synthesis rates give a single steady state.
    const r = runCli(['equilibria', TOGGLE, '--set', 'alpha1=1', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { equilibria: { stable: boolean }[] };
    expect(out.equilibria).toHaveLength(1);
    expect(out.equilibria[0]!.stable).toBe(true);
  });

  it('a focus reports its sense of rotation and a readable table without --json', () => {
    // Brusselator (Prigogine & Lefever 1968) at a = 1, b = 1.5 < 1 + a²: equilibrium (a, b/a), a stable focus
    // (trace b − 1 − a² = −0.5, determinant a² = 1, trace² < 4·det).
    const r = runCli(['equilibria', 'models/brusselator.yaml', '--set', 'a=1', '--set', 'b=1.5']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/stable focus, turning (counter)?clockwise/);
    expect(r.stdout.trimEnd().endsWith(CAUTION)).toBe(true);
  });
});

describe('branchtrace sweep', () => {
  it('follows an S-shaped branch from --from -1 (a negative value) through both folds and writes every file', () => {
    const dir = tempDir('sweep');
    const r = runCli(['sweep', writeModel(S_CURVE), '--vary', 'lambda', '--from', '-1', '--to', '1', '--out', dir, '--json']);
    expect(r.status, r.stderr).toBe(0);
    for (const f of ['report.json', 'report.md', 'points.csv', 'diagram.html', 'diagram.vl.json', 'diagram.svg']) {
      expect(existsSync(join(dir, f)), f).toBe(true);
    }
    const report = JSON.parse(readFileSync(join(dir, 'report.json'), 'utf8')) as {
      branches: { stopped: string; points: { parameter: number }[] }[]; events: { type: string; parameter: number }[];
    };
    expect(JSON.parse(r.stdout)).toEqual(report);
    const folds = report.events.filter((e) => e.type === 'fold').map((e) => e.parameter).sort((a, b) => a - b);
    const analytic = 2 / (3 * Math.sqrt(3)); // analytic, see S_CURVE
    expect(folds).toHaveLength(2);
    expect(Math.abs(folds[0]! + analytic)).toBeLessThan(1e-10 * analytic);
    expect(Math.abs(folds[1]! - analytic)).toBeLessThan(1e-10 * analytic);
    expect(report.branches).toHaveLength(1);
    expect(report.branches[0]!.stopped).toBe('left range');
    const ends = [report.branches[0]!.points[0]!.parameter, report.branches[0]!.points.at(-1)!.parameter].sort();
    expect(ends).toEqual([-1, 1]);
    // No temporary files left behind by the atomic writes.
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('points.csv has one row per computed point with every state, stability and the largest real part', () => {
    const dir = tempDir('csv');
    expect(runCli(['sweep', writeModel(S_CURVE), '--vary', 'lambda', '--from', '-1', '--to', '1', '--out', dir]).status).toBe(0);
    const report = JSON.parse(readFileSync(join(dir, 'report.json'), 'utf8')) as { branches: { points: unknown[] }[] };
    const rows = readFileSync(join(dir, 'points.csv'), 'utf8').trim().split(/\r?\n/);
    expect(rows[0]).toMatch(/branch.*lambda.*x.*y.*stable/);
    expect(rows.length - 1).toBe(report.branches.reduce((s, b) => s + b.points.length, 0));
  });

  it('default output folder is out/<model file name>-<NAME>/ under the working directory', () => {
    const cwd = tempDir('cwd');
    const model = writeModel(S_CURVE, 'scurve.yaml');
    expect(runCli(['sweep', model, '--vary', 'lambda', '--from', '-1', '--to', '1'], cwd).status).toBe(0);
    expect(existsSync(join(cwd, 'out', 'scurve-lambda', 'report.json'))).toBe(true);
  });

  it('--fail-margin gates a design: exit status 3 with a one-line message, and the report is still written', () => {
    // Nominal lambda = 0.3 on the lower branch; the fold above it at 2/(3√3) ≈ 0.3849 is 28.3% away (analytic).
    const dir = tempDir('gate');
    const r = runCli(['sweep', writeModel(S_CURVE), '--vary', 'lambda', '--from', '-1', '--to', '1', '--out', dir, '--fail-margin', '0.5']);
    expect(r.status).toBe(3);
    const relative = (2 / (3 * Math.sqrt(3)) - 0.3) / 0.3;
    expect(oneLineError(r)).toBe(`branchtrace: ${message.marginFailed(relative, 0.5, 'lambda')}`);
    expect(existsSync(join(dir, 'report.md'))).toBe(true);
    const ok = runCli(['sweep', writeModel(S_CURVE), '--vary', 'lambda', '--from', '-1', '--to', '1', '--out', dir, '--fail-margin', '0.2']);
    expect(ok.status).toBe(0);
  });

  it('the summary numbers the special points and gives their state, so that two at one value differ', () => {
    // Lorenz (1963): the pitchfork at rho = 1 from the origin, and on the pair C± = (±√(b(ρ−1)), ±√(b(ρ−1)), ρ−1)
    // one subcritical Hopf point each at rho = σ(σ+b+3)/(σ−b−1) = 470/19 for σ = 10, b = 8/3.
    const r = runCli(['sweep', 'models/lorenz-convection.yaml', '--vary', 'rho', '--from', '0', '--to', '30', '--out', tempDir('lorenz'), '--no-diagram']);
    expect(r.status, r.stderr).toBe(0);
    const hopf = r.stdout.split('\n').filter((l) => /Hopf/.test(l) && /branch \d+\)/.test(l));
    expect(hopf).toHaveLength(2);
    const xy = Math.sqrt((8 / 3) * (470 / 19 - 1)).toPrecision(4); // 7.956
    expect(hopf[0]).toMatch(new RegExp(`^  2\\. Hopf \\(subcritical\\) at rho = 24\\.736842, X = ${xy}, Y = ${xy}, Z = 23\\.737 \\(branch 2\\)`));
    expect(hopf[1]).toMatch(new RegExp(`^  3\\. Hopf \\(subcritical\\) at rho = 24\\.736842, X = −${xy}, Y = −${xy}, Z = 23\\.737 \\(branch 2\\)`));
  });

  it('draws the norm of the state by default for a model of more than eight states, and the chosen states with --plot', () => {
    // Nine uncoupled states x_i' = p − x_i: the equilibrium is x_i = p, so ‖x‖ = 3|p| (analytic).
    const states = Array.from({ length: 9 }, (_, i) => `x${i + 1}`);
    const nine = writeModel([
      'title: nine uncoupled states', 'about: demo only (invented numbers)',
      'states:', ...states.map((x) => `  ${x}: 0`),
      'parameters:', '  p: 1',
      'equations:', ...states.map((x) => `  ${x}: p - ${x}`),
    ].join('\n'));
    type Spec = { vconcat: { layer: { mark: { type: string }; encoding: { y?: { field?: string } } }[] }[]; datasets: { branches: Record<string, number>[] } };
    const panels = (spec: Spec) => spec.vconcat.map((v) => v.layer.find((l) => l.mark.type === 'line')!.encoding.y!.field);
    const dir = tempDir('nine');
    const r = runCli(['sweep', nine, '--vary', 'p', '--from', '-1', '--to', '2', '--out', dir]);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/The diagram draws the norm of the state \(the model has 9 states\); --plot names the states to draw instead\./);
    const spec = JSON.parse(readFileSync(join(dir, 'diagram.vl.json'), 'utf8')) as Spec;
    expect(panels(spec)).toEqual(['norm', 'maxRealPart']);
    for (const row of spec.datasets.branches) expect(Math.abs(row['norm']! - 3 * Math.abs(row['parameter']!))).toBeLessThan(1e-9);
    const chosen = runCli(['sweep', nine, '--vary', 'p', '--from', '-1', '--to', '2', '--out', dir, '--plot', 'x1,x9']);
    expect(chosen.status, chosen.stderr).toBe(0);
    expect(chosen.stdout).not.toMatch(/draws the norm/);
    expect(panels(JSON.parse(readFileSync(join(dir, 'diagram.vl.json'), 'utf8')) as Spec)).toEqual(['v0', 'v8', 'maxRealPart']);
  });

  it('--warn-margin prints a warning in the summary when the nearest special point is close', () => {
    const dir = tempDir('warn');
    const r = runCli(['sweep', writeModel(S_CURVE), '--vary', 'lambda', '--from', '-1', '--to', '1', '--out', dir, '--warn-margin', '0.5']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/WARNING: the nearest special point is closer than the warning margin of 50%/);
  });
});

describe('bad input: one line, non-zero status, nothing written', () => {
  const cases: [string, string[], number, RegExp | string][] = [
    ['unknown parameter', ['sweep', REACTOR, '--vary', 'Dx', '--from', '0', '--to', '1'], 2,
      message.unknownParameter('Dx', ['Da', 'B', 'beta', 'coolant'])],
    ['from equal to to', ['sweep', REACTOR, '--vary', 'Da', '--from', '0.1', '--to', '0.1'], 2, message.emptyRange(0.1, 0.1)],
    ['a value that is not a number', ['sweep', REACTOR, '--vary', 'Da', '--from', 'abc', '--to', '1'], 2, message.badNumber('--from', 'abc')],
    ['--log over a range that is not positive', ['sweep', REACTOR, '--vary', 'Da', '--from', '0', '--to', '0.2', '--log'], 2, message.logRange(0, 0.2)],
    ['a negative --probes', ['sweep', REACTOR, '--vary', 'Da', '--from', '0', '--to', '1', '--probes', '-1'], 2, message.badInteger('--probes', '-1', 0)],
    ['a fractional --max-points', ['sweep', REACTOR, '--vary', 'Da', '--from', '0', '--to', '1', '--max-points', '2.5'], 2, message.badInteger('--max-points', '2.5', 1)],
    ['a malformed --set', ['equilibria', REACTOR, '--set', 'Da'], 2, message.badAssignment('--set', 'Da')],
    ['an unknown state in --box', ['equilibria', REACTOR, '--box', 'conversoin=0:1'], 2,
      message.unknownState('conversoin', ['conversion', 'temperature'])],
    ['a missing file', ['check', 'models/no-such-model.yaml'], 2, message.cannotRead('models/no-such-model.yaml', 'no such file')],
    ['an unknown option', ['sweep', REACTOR, '--vary', 'Da', '--from', '0', '--to', '1', '--colour', 'red'], 2, /unknown option '--colour'/],
    ['a missing required option', ['sweep', REACTOR, '--from', '0', '--to', '1'], 2, /--vary/],
  ];
  for (const [what, args, status, expected] of cases) {
    it(what, () => {
      const cwd = tempDir('bad');
      const r = runCli(args.map((a) => (a.startsWith('models/') ? join(process.cwd(), a) : a)), cwd);
      expect(r.status).toBe(status);
      const line = oneLineError(r);
      if (typeof expected === 'string') expect(line).toBe(`branchtrace: ${expected.replaceAll('models/', join(process.cwd(), 'models/'))}`);
      else expect(line).toMatch(expected);
      expect(existsSync(join(cwd, 'out'))).toBe(false);
    });
  }

  it('a model error names file, line and column', () => {
    const file = writeModel('states:\n  x: 1\nparameters:\n  k: 2\nequations:\n  x: -k*y\n');
    const r = runCli(['check', file]);
    expect(r.status).toBe(2);
    expect(oneLineError(r)).toMatch(new RegExp(`^branchtrace: ${file.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:6:\\d+: .*unknown name "y"`));
  });

  it('a model that conserves a sum of its states is refused by sweep with the sum named, and check warns about it', () => {
    // Kermack & McKendrick (1927) without births or deaths: S + I + R is constant (analytic).
    const file = writeModel('states: { S: 0.9, I: 0.1, R: 0 }\nparameters: { beta: 0.3, gamma: 0.1 }\nequations:\n' +
      '  S: -beta*S*I\n  I: beta*S*I - gamma*I\n  R: gamma*I\n');
    const cwd = tempDir('conserved');
    const r = runCli(['sweep', file, '--vary', 'beta', '--from', '0.1', '--to', '0.5'], cwd);
    expect(r.status).toBe(2);
    expect(oneLineError(r)).toBe(`branchtrace: ${message.conservedQuantity(`${file}:4:6`, ['S + I + R'])}`);
    expect(existsSync(join(cwd, 'out'))).toBe(false);
    const check = runCli(['check', file]);
    expect(check.status).toBe(0);
    expect(check.stdout).toMatch(/^warning: S \+ I \+ R is conserved: equilibria are not isolated/m);
  });

  it('no equilibrium at the start of the range is a numerical error (status 3)', () => {
    // x' = p − x² has no real equilibrium for p < 0 (analytic).
    const file = writeModel('states:\n  x: 1\nparameters:\n  p: 1\nequations:\n  x: p - x^2\n');
    const cwd = tempDir('noeq');
    const r = runCli(['sweep', file, '--vary', 'p', '--from', '-1', '--to', '1'], cwd);
    expect(r.status).toBe(3);
    expect(oneLineError(r)).toMatch(/^branchtrace: no equilibrium at p = -1: Newton stopped after \d+ iterations?/);
    expect(existsSync(join(cwd, 'out'))).toBe(false);
  });
});

describe('branchtrace equilibria --box', () => {
  it('reports only the equilibria inside the given ranges', () => {
    // Gardner et al. (2000) switch at alpha1 = alpha2 = 10: states (5 ± 2√6, 5 ∓ 2√6) and (2, 2)
    // (analytic: u + v = 10 and uv = 1 on the asymmetric pair). Only the high-u one has u in [5, 20].
    const r = runCli(['equilibria', TOGGLE, '--box', 'u=5:20', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { equilibria: { state: Record<string, number> }[] };
    expect(out.equilibria).toHaveLength(1);
    expect(out.equilibria[0]!.state['u']).toBeCloseTo(5 + 2 * Math.sqrt(6), 9);
  });
});

describe('branchtrace equilibria without --box', () => {
  it('reports equilibria Newton reaches beyond the default box: the three Lorenz states at rho = 28', () => {
    // Lorenz (1963), J. Atmos. Sci. 20:130: besides the origin, C± = (±√(b(ρ−1)), ±√(b(ρ−1)), ρ − 1);
    // with b = 8/3, ρ = 28: X = Y = ±√72 ≈ ±8.485, Z = 27, outside the default box |Z| ≤ 10 around the start 0.
    const r = runCli(['equilibria', 'models/lorenz-convection.yaml', '--set', 'rho=28', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { equilibria: { state: Record<string, number> }[] };
    const xs = out.equilibria.map((e) => e.state['X']!).sort((a, b) => a - b);
    expect(xs).toHaveLength(3);
    expect(xs[0]).toBeCloseTo(-Math.sqrt(72), 9);
    expect(xs[1]).toBeCloseTo(0, 12);
    expect(xs[2]).toBeCloseTo(Math.sqrt(72), 9);
    for (const e of out.equilibria.filter((q) => q.state['X'] !== 0)) expect(e.state['Z']).toBeCloseTo(27, 9);
  });
});
