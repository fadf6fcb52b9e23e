import type {
  Branch, Eigenvalue, ModelInfo, Report, ReportBranch, ReportEvent, SpecialPoint, Trace, TracePoint,
} from '../types.js';
import { CAUTION } from './caution.js';
import { cornerMeaning, eventMeaning } from './eventWords.js';
import { computeMargin } from './margin.js';
import { stabilityIntervals } from './stabilityIntervals.js';

export interface ReportOptions {
  /** Name of the varied parameter. */
  parameter: string;
  version: string;
  warnMargin: number;
  failMargin: number;
  /** Design value of the varied parameter; defaults to its value in the model. */
  nominal?: number;
  /** Parameter values where equilibria were searched for (the branches' starts); default: the range's ends. */
  searchedAt?: readonly number[];
  /** How the parameter was stepped: in itself, or in its logarithm (--log). Default linear. */
  parameterScale?: 'linear' | 'log';
  /** The state the plant runs at, to pick the branch for the design margin (see computeMargin). */
  operatingState?: Float64Array;
}

/** What each test function is (src/trace/detectEvents.ts), in words. */
const TEST_QUANTITY: Record<SpecialPoint['type'], string> = {
  fold: 'parameter component of the unit tangent',
  hopf: 'real part of the critical complex eigenvalue pair',
  'branch-point': 'determinant of the bordered Jacobian [f_x f_p; tangent] (scaled)',
  transcritical: 'determinant of the bordered Jacobian [f_x f_p; tangent] (scaled)',
  pitchfork: 'determinant of the bordered Jacobian [f_x f_p; tangent] (scaled)',
};

/** Trace → Report: plain JSON with names instead of indices, stability intervals, meanings and the margin. */
export function buildReport(trace: Trace, info: ModelInfo, opts: ReportOptions): Report {
  const names = info.states.map((s) => s.name);
  const parameterInfo = info.parameters.find((p) => p.name === opts.parameter);
  const nominal = opts.nominal ?? parameterInfo?.value;
  const report: Report = {
    tool: 'branchtrace',
    version: opts.version,
    model: info,
    parameter: opts.parameter,
    range: { from: trace.settings.from, to: trace.settings.to },
    settings: {
      ...trace.settings, warnMargin: opts.warnMargin, failMargin: opts.failMargin,
      searchedAt: [...(opts.searchedAt ?? [trace.settings.from, trace.settings.to])],
      parameterScale: opts.parameterScale ?? 'linear',
    },
    branches: trace.branches.map((b) => reportBranch(b, trace.events, names)),
    events: trace.events.map((e) => reportEvent(e, names, touchesStable(e, trace.branches))),
    margin: nominal === undefined ? null : computeMargin(trace, {
      parameter: opts.parameter, nominal, warnMargin: opts.warnMargin, failMargin: opts.failMargin,
      ...(opts.operatingState === undefined ? {} : { operatingState: opts.operatingState }),
    }),
    warnings: [...trace.warnings],
    interrupted: trace.interrupted,
    caution: CAUTION,
  };
  if (parameterInfo?.unit !== undefined) report.unit = parameterInfo.unit;
  return report;
}

function stateRecord(state: Float64Array, names: readonly string[]): Record<string, number> {
  return Object.fromEntries(names.map((name, i) => [name, state[i] ?? Number.NaN]));
}

function reportBranch(branch: Branch, events: readonly SpecialPoint[], names: readonly string[]): ReportBranch {
  return {
    id: branch.id,
    stopped: branch.stopped,
    origin: branch.origin,
    points: branch.points.map((p: TracePoint) => ({
      index: p.index,
      parameter: p.parameter,
      state: stateRecord(p.state, names),
      stable: p.stable,
      maxRealPart: p.maxRealPart,
      residual: p.residual,
      iterations: p.iterations,
      step: p.step,
    })),
    stability: stabilityIntervals(branch, events),
  };
}

/** Whether the branch of a special point is stable at either neighbouring point. */
function touchesStable(e: SpecialPoint, branches: readonly Branch[]): boolean {
  const points = branches.find((b) => b.id === e.branch)?.points;
  if (points === undefined) return true;
  return e.between.some((k) => points[k]?.stable === true);
}

function reportEvent(e: SpecialPoint, names: readonly string[], nearStable: boolean): ReportEvent {
  const out: ReportEvent = {
    id: e.id,
    type: e.type,
    parameter: e.parameter,
    state: stateRecord(e.state, names),
    branch: e.branch,
    eigenvalues: e.eigenvalues.map((v: Eigenvalue) => ({ re: v.re, im: v.im })),
    meaning: e.corner === true ? cornerMeaning(e.type) : eventMeaning(e.type, e.criticality, nearStable),
    residual: e.residual,
    iterations: e.iterations,
    test: { quantity: TEST_QUANTITY[e.type], before: e.testBefore, after: e.testAfter },
  };
  if (e.corner === true) out.corner = true;
  if (e.foldCoefficient !== undefined) out.foldCoefficient = e.foldCoefficient;
  if (e.lyapunov !== undefined) out.lyapunov = e.lyapunov;
  if (e.criticality !== undefined) out.criticality = e.criticality;
  if (e.frequency !== undefined) out.frequency = e.frequency;
  if (e.period !== undefined) out.period = e.period;
  if (e.newBranches !== undefined) out.newBranches = [...e.newBranches];
  return out;
}
