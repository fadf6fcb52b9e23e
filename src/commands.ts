/**
 * Command line: flags → pipeline → files and stdout (started by cli.ts). With runSweep.ts (a second
 * Ctrl-C exits at once), the only module that uses process.exit, stdout and stderr. Every failure prints one line
 * `branchtrace: <message>` with a non-zero exit status (2 usage or model, 3 numerics or a failed
 * margin gate, 130 interrupted, 1 internal error, with the stack only under BRANCHTRACE_DEBUG=1).
 */
import { Command, CommanderError, Option } from 'commander';
import { basename, extname, join } from 'node:path';
import { checkModel, checkText } from './checkModel.js';
import { equilibriaAt } from './equilibriaAt.js';
import { BranchtraceError, MarginError, message, UsageError } from './errors.js';
import { collect, parseAssignment, parseInterval, parseNumber, parseWholeNumber } from './cliArgs.js';
import { readModelFile } from './model/loadModel.js';
import { portraitAt } from './portraitAt.js';
import type { PortraitWindow } from './portrait/plane.js';
import { eventLabel } from './report/eventWords.js';
import { formatNumber } from './report/formatNumber.js';
import { marginSentences } from './report/marginText.js';
import { defaultPlot } from './report/diagramSpec.js';
import { diagramFiles, portraitFiles } from './report/outputFiles.js';
import { loadChartRuntime } from './report/renderPage.js';
import { equilibriaJson, equilibriaText } from './report/renderEquilibria.js';
import { writeOutputs } from './report/writeFiles.js';
import { runSweep, type Progress, type SweepWorker } from './runSweep.js';
import type { Report } from './types.js';
import { VERSION } from './version.js';

const assignments = (option: string, list: readonly string[] = []): Record<string, number> =>
  Object.fromEntries(list.map((text) => parseAssignment(option, text)));

interface Common {
  set?: string[];
  start?: string[];
}

function overrides(o: Common) {
  return { set: assignments('--set', o.set), start: assignments('--start', o.start) };
}

function stem(file: string): string {
  return basename(file, extname(file)) || 'model';
}

/** `X0:X1,Y0:Y1` → window. */
function parseWindow(text: string): PortraitWindow {
  const parts = text.split(',');
  const side = (s: string | undefined): [number, number] => {
    const [lo, hi, extra] = (s ?? '').split(':');
    const a = Number(lo?.trim());
    const b = Number(hi?.trim());
    if (extra !== undefined || lo === undefined || hi === undefined || lo.trim() === '' || hi.trim() === '' ||
      !Number.isFinite(a) || !Number.isFinite(b) || !(a < b)) {
      throw new UsageError(message.badWindow(text));
    }
    return [a, b];
  };
  if (parts.length !== 2) throw new UsageError(message.badWindow(text));
  return { x: side(parts[0]), y: side(parts[1]) };
}

function parsePlot(text: string | undefined): readonly string[] | 'norm' | undefined {
  if (text === undefined) return undefined;
  if (text.trim() === 'norm') return 'norm';
  return text.split(',').map((s) => s.trim()).filter((s) => s !== '');
}

/**
 * Progress on stderr: one status line rewritten in place when stderr is a terminal; with
 * `--progress` also when it is not (a log file, a CI job), one line per update.
 */
function progressLine(parameter: string, forced: boolean): ((p: Progress) => void) & { clear(): void } {
  const tty = process.stderr.isTTY === true;
  let shown = false;
  const show = (p: Progress) => {
    if (!tty && !forced) return;
    shown = true;
    const text = `sweeping: branch ${p.branch}, ${p.points} point${p.points === 1 ? '' : 's'}, ${parameter} = ` +
      `${formatNumber(p.parameter, 6)}, ${p.branchesDone} branch${p.branchesDone === 1 ? '' : 'es'} done`;
    process.stderr.write(tty ? `\r\x1b[2K${text}` : `${text}\n`);
  };
  return Object.assign(show, { clear: () => { if (shown && tty) process.stderr.write('\r\x1b[2K'); } });
}

/** Models with at most this many states show the state of each special point in the summary. */
const SUMMARY_STATES = 4;

function sweepSummary(report: Report, written: readonly string[], normByDefault: boolean): string {
  const lines = [
    `${report.model.title ?? report.model.file}: ${report.branches.length} branch${report.branches.length === 1 ? '' : 'es'}, ` +
      `${report.branches.reduce((s, b) => s + b.points.length, 0)} points, ${report.events.length} special point` +
      `${report.events.length === 1 ? '' : 's'}${report.interrupted ? ' (interrupted: partial results)' : ''}`,
  ];
  // The state tells apart points at one parameter value (the two symmetric Hopf points of a
  // pitchfork's branch); spelled out for small models, where it fits on the line.
  const names = report.model.states.map((s) => s.name);
  for (const e of report.events) {
    const state = names.length <= SUMMARY_STATES ? `, ${names.map((n) => `${n} = ${formatNumber(e.state[n] ?? Number.NaN, 5)}`).join(', ')}` : '';
    lines.push(`  ${e.id}. ${eventLabel(e.type, e.criticality)} at ${report.parameter} = ${formatNumber(e.parameter, 8)}${state} ` +
      `(branch ${e.branch}): ${e.meaning}`);
  }
  if (report.margin !== null) lines.push('', ...marginSentences(report.margin, report.events));
  for (const w of report.warnings) lines.push(`warning: ${w}`);
  lines.push('', `wrote ${written.join(', ')}`);
  if (normByDefault) {
    lines.push(`The diagram draws the norm of the state (the model has ${report.model.states.length} states); --plot names the states to draw instead.`);
  }
  lines.push('', report.caution);
  return lines.join('\n') + '\n';
}

interface SweepFlags extends Common {
  vary: string;
  from: string;
  to: string;
  out?: string;
  step?: string;
  maxStep?: string;
  maxPoints?: string;
  probes?: string;
  log?: boolean;
  warnMargin?: string;
  failMargin?: string;
  plot?: string;
  diagram?: boolean;
  progress?: boolean;
  json?: boolean;
}

async function sweepCommand(file: string, f: SweepFlags, worker: SweepWorker): Promise<number> {
  const opts = {
    vary: f.vary,
    from: parseNumber('--from', f.from),
    to: parseNumber('--to', f.to),
    ...overrides(f),
    ...(f.step !== undefined && { step: positive('--step', f.step) }),
    ...(f.maxStep !== undefined && { maxStep: positive('--max-step', f.maxStep) }),
    ...(f.maxPoints !== undefined && { maxPoints: parseWholeNumber('--max-points', f.maxPoints) }),
    ...(f.probes !== undefined && { probes: parseWholeNumber('--probes', f.probes, 0) }),
    ...(f.log === true && { log: true }),
    ...(f.warnMargin !== undefined && { warnMargin: fraction('--warn-margin', f.warnMargin) }),
    ...(f.failMargin !== undefined && { failMargin: fraction('--fail-margin', f.failMargin) }),
  };
  const plot = parsePlot(f.plot);
  if (opts.from === opts.to) throw new UsageError(message.emptyRange(opts.from, opts.to));
  // The model is read here (a bad file fails before any thread starts) and handed to the worker,
  // which then needs no YAML parser and starts faster.
  const model = readModelFile(file);
  for (const name of Array.isArray(plot) ? plot : []) {
    if (!model.states.some((s) => s.name === name)) throw new UsageError(message.unknownState(name, model.states.map((s) => s.name)));
  }
  const progress = progressLine(opts.vary, f.progress === true);
  const running = runSweep(worker, model, opts, progress);
  // Load the chart code while the worker computes (on another core); a failure shows up, with
  // its message, when the diagram is rendered.
  if (f.diagram !== false) loadChartRuntime().catch(() => undefined);
  const { report, reportFiles } = await running.finally(() => progress.clear());
  const dir = f.out ?? join('out', `${stem(file)}-${opts.vary}`);
  // The diagram renders here while the worker renders the report files.
  const diagram = f.diagram === false ? [] : await diagramFiles(report, plot);
  const files = [...await reportFiles, ...diagram];
  const written = await writeOutputs(dir, files);
  const normByDefault = f.diagram !== false && plot === undefined && defaultPlot(model.states.length) === 'norm';
  process.stdout.write(f.json === true ? files.find((x) => x.name === 'report.json')!.content : sweepSummary(report, written, normByDefault));
  const margin = report.margin;
  if (margin?.status === 'warn' && f.json === true) process.stderr.write(`warning: ${marginSentences(margin, report.events).at(-1)}\n`);
  if (report.interrupted) return 130;
  if (margin?.status === 'fail' && margin.nearestRelative !== null) {
    throw new MarginError(message.marginFailed(margin.nearestRelative, margin.failMargin, margin.parameter));
  }
  return 0;
}

function positive(option: string, text: string): number {
  const v = parseNumber(option, text);
  if (!(v > 0)) throw new UsageError(message.badPositive(option, text));
  return v;
}

function fraction(option: string, text: string): number {
  const v = parseNumber(option, text);
  if (!(v >= 0)) throw new UsageError(message.badPositive(option, text));
  return v;
}

function program(sweepWorker: () => SweepWorker): Command {
  const cmd = new Command('branchtrace')
    .description('Follow the steady states of an ODE model dx/dt = f(x, p) as one parameter moves: every branch, ' +
      'stable and unstable, with folds, Hopf, transcritical and pitchfork points located and classified.')
    .version(VERSION, '--version', 'print the version')
    .helpOption('-h, --help', 'show help')
    .showHelpAfterError(false)
    .exitOverride()
    .configureOutput({ outputError: () => {} });

  const setOption = () => new Option('--set <NAME=VALUE>', 'replace a parameter value (repeatable)').argParser(collect);
  const startOption = () => new Option('--start <NAME=VALUE>', 'replace a start guess of a state (repeatable)').argParser(collect);

  cmd.command('check')
    .description('load and compile a model; show the residual at the start guess and the exact Jacobian against finite differences')
    .argument('<model>', 'model file (YAML or JSON)')
    .addOption(setOption())
    .addOption(startOption())
    .action((file: string, f: Common) => {
      process.stdout.write(checkText(checkModel(readModelFile(file), overrides(f))));
    });

  cmd.command('equilibria')
    .description('find and classify every equilibrium in a box at fixed parameter values')
    .argument('<model>', 'model file (YAML or JSON)')
    .addOption(setOption())
    .addOption(startOption())
    .addOption(new Option('--box <NAME=LO:HI>', 'search range of a state (repeatable; default: around the start guess)').argParser(collect))
    .option('--json', 'print JSON instead of a table')
    .action((file: string, f: Common & { box?: string[]; json?: boolean }) => {
      const box = (f.box ?? []).map((t) => parseInterval('--box', t));
      const { system, params, search } = equilibriaAt(readModelFile(file), { ...overrides(f), box });
      process.stdout.write(f.json === true
        ? JSON.stringify(equilibriaJson(system.info, params, search), null, 2) + '\n'
        : equilibriaText(system.info, params, search));
    });

  cmd.command('sweep')
    .description('follow every equilibrium branch as one parameter moves; write report.json, report.md, points.csv and diagram.html/.vl.json/.svg')
    .argument('<model>', 'model file (YAML or JSON)')
    .requiredOption('--vary <NAME>', 'the parameter to move')
    .requiredOption('--from <A>', 'start of the range (negative values are fine: --from -0.5)')
    .requiredOption('--to <B>', 'end of the range')
    .option('--out <DIR>', 'output folder (default: out/<model file name>-<NAME>)')
    .addOption(setOption())
    .addOption(startOption())
    .option('--log', 'step the parameter on a logarithmic scale, for a range over decades (A and B positive; --step and --max-step then in decades)')
    .option('--step <H>', 'first step along the branch (parameter units; default 1% of the range)')
    .option('--max-step <H>', 'largest step along the branch (default 2% of the range)')
    .option('--max-points <N>', 'point budget per branch (default 2000)')
    .option('--probes <N>', 'search for equilibria also at N values spread over the range, to find branches that reach neither end (default 7; 3 for models of more than 20 states; 0: none)')
    .option('--warn-margin <F>', 'warn when the nearest special point is closer than this fraction of the nominal value (default 0.1)')
    .option('--fail-margin <F>', 'exit with status 3 when it is closer than this fraction (default 0: never)')
    .option('--plot <STATES>', 'states to draw, comma-separated, or "norm" (default: every state; the norm for more than eight states)')
    .option('--no-diagram', 'write only the report files, not diagram.html/.vl.json/.svg (faster, for CI gates)')
    .option('--progress', 'print progress lines on stderr even when it is not a terminal')
    .option('--json', 'print report.json to stdout instead of the summary')
    .action(async (file: string, f: SweepFlags) => {
      process.exitCode = await sweepCommand(file, f, sweepWorker());
    });

  cmd.command('portrait')
    .description('phase portrait at one parameter value: direction field, nullclines, equilibria, trajectories, saddle manifolds')
    .argument('<model>', 'model file (YAML or JSON)')
    .option('--at <NAME=VALUE>', 'the parameter value to draw at (default: the model values)')
    .addOption(setOption())
    .addOption(startOption())
    .option('--x <STATE>', 'state on the horizontal axis (default: the first)')
    .option('--y <STATE>', 'state on the vertical axis (default: the second)')
    .option('--window <X0:X1,Y0:Y1>', 'plotted ranges (default: around the equilibria)')
    .option('--out <DIR>', 'output folder (default: out/<model file name>-portrait)')
    .action(async (file: string, f: Common & { at?: string; x?: string; y?: string; window?: string; out?: string }) => {
      const model = readModelFile(file);
      const { data } = portraitAt(model, {
        ...overrides(f),
        ...(f.at !== undefined && { at: parseAssignment('--at', f.at) }),
        ...(f.x !== undefined && { x: f.x }),
        ...(f.y !== undefined && { y: f.y }),
        ...(f.window !== undefined && { window: parseWindow(f.window) }),
      });
      const dir = f.out ?? join('out', `${stem(file)}-portrait`);
      const written = await writeOutputs(dir, await portraitFiles(data));
      process.stdout.write(`${data.equilibria.length} equilibri${data.equilibria.length === 1 ? 'um' : 'a'} in the window; ` +
        `wrote ${written.join(', ')}\n`);
    });
  return cmd;
}

/** Runs the command line; `sweepWorker` gives the worker a sweep runs in (cli.ts may have started it early). */
export async function main(argv: string[], sweepWorker: () => SweepWorker): Promise<void> {
  try {
    await program(sweepWorker).parseAsync(argv);
  } catch (err) {
    process.exitCode = report(err);
  }
}

function report(err: unknown): number {
  if (err instanceof CommanderError) {
    if (err.code === 'commander.helpDisplayed' || err.code === 'commander.version' || err.code === 'commander.help') return 0;
    process.stderr.write(`branchtrace: ${err.message.replace(/^error: /, '')} (see branchtrace --help)\n`);
    return 2;
  }
  if (err instanceof BranchtraceError) {
    process.stderr.write(`branchtrace: ${err.message}\n`);
    return err.exitCode;
  }
  const e = err as NodeJS.ErrnoException;
  if (e?.code === 'EACCES' || e?.code === 'ENOSPC' || e?.code === 'EROFS' || e?.code === 'ENOTDIR' || e?.code === 'EEXIST') {
    process.stderr.write(`branchtrace: cannot write the output (${e.message})\n`);
    return 1;
  }
  process.stderr.write(`branchtrace: internal error: ${String(e?.message ?? err)}\n`);
  if (process.env['BRANCHTRACE_DEBUG'] === '1' && e?.stack) process.stderr.write(`${e.stack}\n`);
  return 1;
}

