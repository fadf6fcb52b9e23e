/** Detection and normal-form kernels called by the continuation (src/trace/). */
export { locateRoot, type RootOptions, type RootResult, type RootStatus } from './locateRoot.js';
export { complexUnstableCount, criticalPair, hopfBetween, hopfTest, isNeutralSaddle } from './hopfTest.js';
export {
  lyapunovCoefficient, type CoefficientStatus, type LyapunovDiagnostics, type LyapunovOptions, type LyapunovResult,
} from './hopfCoefficient.js';
export { foldCoefficient, type FoldDiagnostics, type FoldOptions, type FoldResult, type FoldStatus } from './foldCoefficient.js';
export type { Complex, ComplexVector } from './complexAlgebra.js';
