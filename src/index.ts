/**
 * The library: `import { loadModel, findEquilibria, sweep } from 'branchtrace'`.
 * Stages in pipeline order; each takes the previous stage's output.
 */
export { loadModel, readModelFile } from './model/loadModel.js';
export { parseExpression, symbolsOf } from './model/expr.js';
export { formatExpression } from './model/formatExpression.js';
export { compileModel, type CompiledSystem } from './compile/compileModel.js';
export { checkJacobian, type JacobianCheck } from './compile/checkJacobian.js';
export { prepare, type Overrides, type Prepared } from './setup.js';
export {
  findEquilibria, type EquilibriumSearch, type EquilibriumSearchDiagnostics, type FindEquilibriaOptions,
} from './equilibria/findEquilibria.js';
export { classifyEquilibrium } from './equilibria/classify.js';
export { equilibriaAt, type EquilibriaAtOptions } from './equilibriaAt.js';
export { traceBranches } from './trace/traceBranches.js';
export { traceSettings } from './trace/traceSettings.js';
export { sweep, type SweepOptions, type SweepResult } from './sweep.js';
export { buildReport, type ReportOptions } from './report/buildReport.js';
export { renderJson } from './report/renderJson.js';
export { renderMarkdown } from './report/renderMarkdown.js';
export { renderCsv } from './report/renderCsv.js';
export { sweepFiles, portraitFiles } from './report/outputFiles.js';
export { writeOutputs, type OutputFile } from './report/writeFiles.js';
export { portraitAt, type PortraitRequest } from './portraitAt.js';
export {
  BranchtraceError, MarginError, ModelError, NumericalError, UsageError,
} from './errors.js';
export { VERSION } from './version.js';
export type * from './types.js';
