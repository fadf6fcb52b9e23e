/**
 * The data that flows through branchtrace, stage by stage:
 *
 *   model text ─parseModel→ Model ─compileModel→ System ─traceBranches→ Trace
 *              ─(detection inside tracing)→ SpecialPoint[] ─buildReport→ Report ─render*→ files
 *
 * Each stage takes the previous stage's type and nothing else; no stage reaches back.
 */

// ─── Stage 1: model text → Model ────────────────────────────────────────────

/** A place in a model file (1-based line and column). */
export interface SourceRef {
  file: string;
  line: number;
  column: number;
}

/** The functions a model expression may call: a closed set. */
export const FUNCTION_NAMES = [
  'exp', 'log', 'sqrt', 'sin', 'cos', 'tan', 'tanh', 'sinh', 'cosh', 'abs', 'min', 'max', 'pow',
] as const;
export type FunctionName = (typeof FUNCTION_NAMES)[number];
export function isFunctionName(s: string): s is FunctionName {
  return (FUNCTION_NAMES as readonly string[]).includes(s);
}

/** Named constants an expression may use; they become numbers when parsed. */
export const CONSTANTS: Readonly<Record<string, number>> = { pi: Math.PI, e: Math.E };

export const BINARY_OPERATORS = ['+', '-', '*', '/', '^'] as const;
export type BinaryOperator = (typeof BINARY_OPERATORS)[number];

/** Position of an expression node inside its expression text (1-based column within that text). */
export interface ExprPos {
  /** 1-based offset of the node's first character in the expression text. */
  offset: number;
}

/**
 * The whitelisted expression tree. Nothing outside these five node kinds can be represented,
 * so nothing else can ever be compiled.
 */
export type Expr =
  | { kind: 'num'; value: number; pos?: ExprPos }
  | { kind: 'sym'; name: string; pos?: ExprPos }
  | { kind: 'neg'; arg: Expr; pos?: ExprPos }
  | { kind: 'bin'; op: BinaryOperator; left: Expr; right: Expr; pos?: ExprPos }
  | { kind: 'call'; fn: FunctionName; args: Expr[]; pos?: ExprPos };

export interface StateDef {
  name: string;
  /** Start guess. */
  start: number;
  /** Bounds (a concentration cannot be negative): equilibria outside are not reported, branches end on them. */
  min?: number;
  max?: number;
  unit?: string;
  about?: string;
  where: SourceRef;
}

export interface ParameterDef {
  name: string;
  /** Nominal (design) value. */
  value: number;
  unit?: string;
  about?: string;
  where: SourceRef;
}

export interface DefinitionDef {
  name: string;
  expr: Expr;
  text: string;
  where: SourceRef;
}

export interface EquationDef {
  /** The state whose time derivative this is. */
  state: string;
  expr: Expr;
  text: string;
  where: SourceRef;
}

/** A checked model: every name resolves, definitions are in dependency order, one equation per state. */
export interface Model {
  file: string;
  title?: string;
  about?: string;
  states: StateDef[];
  parameters: ParameterDef[];
  /** In an order where each definition uses only earlier ones. */
  definitions: DefinitionDef[];
  /** In the same order as `states`. */
  equations: EquationDef[];
}

// ─── Stage 2: Model → System (compiled functions) ───────────────────────────

/**
 * dx/dt = f(x, p), compiled. All arrays are Float64Array; matrices are dense, row-major (n×n).
 * Every method writes into `out` and allocates nothing.
 */
export interface System {
  /** Names and metadata only (no expressions): what later stages may need to label results. */
  readonly info: ModelInfo;
  readonly n: number;
  readonly np: number;
  rhs(x: Float64Array, p: Float64Array, out: Float64Array): void;
  /** J[i*n + j] = ∂f_i/∂x_j. */
  jacobian(x: Float64Array, p: Float64Array, out: Float64Array): void;
  /** out[i] = ∂f_i/∂p_k. */
  paramDerivative(x: Float64Array, p: Float64Array, k: number, out: Float64Array): void;
  /** out = B(u, v), B_i(u, v) = Σ_jk ∂²f_i/∂x_j∂x_k u_j v_k (exact where the model allows). */
  secondDerivative(x: Float64Array, p: Float64Array, u: Float64Array, v: Float64Array, out: Float64Array): void;
  /** out = C(u, v, w), the third-order form Σ_jkl ∂³f_i/∂x_j∂x_k∂x_l u_j v_k w_l. */
  thirdDerivative(
    x: Float64Array, p: Float64Array, u: Float64Array, v: Float64Array, w: Float64Array, out: Float64Array,
  ): void;
  /** out = (∂/∂p_k J) v, the mixed derivative Σ_j ∂²f_i/∂x_j∂p_k v_j. */
  mixedDerivative(x: Float64Array, p: Float64Array, k: number, v: Float64Array, out: Float64Array): void;
}

export interface ModelInfo {
  file: string;
  title?: string;
  about?: string;
  states: { name: string; start: number; min?: number; max?: number; unit?: string; about?: string }[];
  parameters: { name: string; value: number; unit?: string; about?: string }[];
}

// ─── Numerical results with their own diagnostics ──────────────────────────

export type SolveStatus = 'converged' | 'max-iter' | 'singular' | 'non-finite' | 'stalled';

export interface NewtonResult {
  x: Float64Array;
  status: SolveStatus;
  iterations: number;
  /** ‖F(x)‖∞ at the returned x. */
  residual: number;
  /** ‖dx‖∞ of the last Newton step. */
  lastStep: number;
}

export interface Eigenvalue {
  re: number;
  im: number;
}

// ─── Equilibria at fixed parameters ─────────────────────────────────────────

export type EquilibriumType =
  | 'saddle'
  | 'stable node'
  | 'unstable node'
  | 'stable focus'
  | 'unstable focus'
  | 'centre-type'
  | 'degenerate'
  | 'stable'
  | 'unstable';

export interface Equilibrium {
  state: Float64Array;
  residual: number;
  iterations: number;
  eigenvalues: Eigenvalue[];
  stable: boolean;
  /** Number of eigenvalues with positive real part. */
  unstableDimension: number;
  /** Words of the trade. For n > 2: e.g. "saddle (2 stable, 1 unstable, 1 complex pair)". */
  type: string;
  /** Two states, focus only: sense of rotation in the (first state, second state) plane. */
  rotation?: 'clockwise' | 'counterclockwise';
  /** Saddles: real eigenvector directions (unit length). */
  stableDirections?: Float64Array[];
  unstableDirections?: Float64Array[];
}

// ─── Stage 3: System → Trace (branches and special points) ──────────────────

/** One computed point on a branch, in arclength order. */
export interface TracePoint {
  /** Position along the branch (0, 1, 2, ... in arclength order). */
  index: number;
  arclength: number;
  parameter: number;
  state: Float64Array;
  eigenvalues: Eigenvalue[];
  stable: boolean;
  unstableCount: number;
  /** Largest real part of the eigenvalues (the stability margin). */
  maxRealPart: number;
  /** ‖F‖∞ of the extended system after correction. */
  residual: number;
  /** Newton iterations of the corrector. */
  iterations: number;
  /** Step length that led to this point (0 for the first). */
  step: number;
}

export const STOP_REASONS = [
  'left range', 'state bound', 'closed loop', 'unbounded', 'point budget', 'corner', 'step too small', 'non-finite', 'interrupted',
] as const;
export type StopReason = (typeof STOP_REASONS)[number];

export interface Branch {
  id: number;
  /** Where it came from: a start equilibrium, or branch switching at a special point. */
  origin: { kind: 'start' } | { kind: 'switch'; branch: number; event: number };
  stopped: StopReason;
  points: TracePoint[];
}

export const EVENT_TYPES = ['fold', 'hopf', 'transcritical', 'pitchfork', 'branch-point'] as const;
export type EventType = (typeof EVENT_TYPES)[number];

export type Criticality = 'supercritical' | 'subcritical' | 'degenerate';

export interface SpecialPoint {
  /** Index in the trace's event list. */
  id: number;
  type: EventType;
  branch: number;
  parameter: number;
  state: Float64Array;
  eigenvalues: Eigenvalue[];
  /** Indices of the branch points on either side. */
  between: [number, number];
  /** Test-function values at those two points. */
  testBefore: number;
  testAfter: number;
  /** Residual of the located point and iterations used to locate it. */
  residual: number;
  iterations: number;
  /** Fold: quadratic normal-form coefficient a (Kuznetsov 3rd ed. §3.2 / §5.4: a = ½⟨p, B(q,q)⟩). */
  foldCoefficient?: number;
  /** Hopf: first Lyapunov coefficient l1 (Kuznetsov 3rd ed. §3.5, eq. 3.20). */
  lyapunov?: number;
  criticality?: Criticality;
  /** Hopf: angular frequency ω and period 2π/ω. */
  frequency?: number;
  period?: number;
  /** Branch points: the ids of the branches started here. */
  newBranches?: number[];
  /** At a corner of the model (an abs, min or max switches): the eigenvalues jump here; no coefficient. */
  corner?: boolean;
}

export interface TraceSettings {
  /** The varied parameter (index into the model's parameters). */
  parameterIndex: number;
  from: number;
  to: number;
  /** Initial, smallest and largest step length (in the scaled arclength). */
  ds: number;
  dsMin: number;
  dsMax: number;
  /** Point budget per branch. */
  maxPoints: number;
  /** Newton corrector. */
  absTol: number;
  maxIter: number;
  /** Most branches in total (branch switching can create many). */
  maxBranches: number;
}

export interface Trace {
  settings: TraceSettings;
  branches: Branch[];
  events: SpecialPoint[];
  warnings: string[];
  interrupted: boolean;
}

/** Hooks a long trace calls: progress for the terminal, and a cooperative stop (Ctrl-C). */
export interface TraceHooks {
  onProgress?: (p: { branch: number; points: number; parameter: number; branchesDone: number }) => void;
  shouldStop?: () => boolean;
}

// ─── Stage 4: Trace → Report (plain JSON; the file contract) ────────────────

export interface ReportPoint {
  /** Order along the branch. */
  index: number;
  parameter: number;
  state: Record<string, number>;
  stable: boolean;
  maxRealPart: number;
  /** How sure the point is: ‖f‖∞ after the corrector, its Newton iterations, and the scaled arclength step that led here (0 at the first point). */
  residual: number;
  iterations: number;
  step: number;
}

/** The test function whose sign change revealed a special point, at the two branch points around it. */
export interface ReportTest {
  /** In words: which quantity changes sign. */
  quantity: string;
  before: number;
  after: number;
}

export interface ReportBranch {
  id: number;
  stopped: StopReason;
  origin: Branch['origin'];
  points: ReportPoint[];
  /** Maximal parameter intervals over which the branch is stable / unstable, in arclength order. */
  stability: { stable: boolean; from: number; to: number; unstableCount: number }[];
}

export interface ReportEvent {
  id: number;
  type: EventType;
  parameter: number;
  state: Record<string, number>;
  branch: number;
  eigenvalues: Eigenvalue[];
  /** Plain words: what it means for the user. */
  meaning: string;
  residual: number;
  iterations: number;
  test: ReportTest;
  foldCoefficient?: number;
  lyapunov?: number;
  criticality?: Criticality;
  frequency?: number;
  period?: number;
  newBranches?: number[];
  /** At a corner of the model (an abs, min or max switches); see eventMeaning. */
  corner?: boolean;
}

export interface MarginSide {
  event: number;
  type: EventType;
  parameter: number;
  distance: number;
  /** distance / |nominal| (or distance when nominal is 0). */
  relative: number;
}

export interface Margin {
  parameter: string;
  nominal: number;
  /** The branch that holds the nominal operating state, or null when none passes the nominal value. */
  branch: number | null;
  /** Whether the operating state at the nominal value is stable (null without an operating branch). */
  operatingStable: boolean | null;
  /** Eigenvalues with positive real part there (null without an operating branch). */
  operatingUnstableCount: number | null;
  below: MarginSide | null;
  above: MarginSide | null;
  /** Smallest relative distance of the two sides (null if no special point on that branch). */
  nearestRelative: number | null;
  status: 'ok' | 'warn' | 'fail' | 'no special point' | 'nominal outside range';
  warnMargin: number;
  failMargin: number;
}

export interface Report {
  tool: 'branchtrace';
  version: string;
  model: ModelInfo;
  parameter: string;
  unit?: string;
  range: { from: number; to: number };
  /**
   * searchedAt: the parameter values where equilibria were searched for (starts of the branches);
   * parameterScale: 'log' when the steps (ds, dsMin, dsMax) were taken in log10 of the parameter (--log).
   */
  settings: TraceSettings & { warnMargin: number; failMargin: number; searchedAt: number[]; parameterScale: 'linear' | 'log' };
  branches: ReportBranch[];
  events: ReportEvent[];
  margin: Margin | null;
  warnings: string[];
  interrupted: boolean;
  caution: string;
}
