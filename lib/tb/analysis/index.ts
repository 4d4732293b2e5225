export { HBAR2_OVER_ME, HBAR2_OVER_2ME, type EnergySolver, type LevelList, type SpinDegeneracy } from "./constants";
export { monkhorstPackMesh, type KMesh, type MeshOptions } from "./mesh";
export { computeDos, computeDosOnMesh, integrateDos, DEFAULT_DOS_SIGMA, type DosOptions, type DosResult } from "./dos";
export { findFermiLevel, type FermiMethod, type FermiOptions, type FermiResult } from "./fermi";
export { findBandGap, computeBandwidths, sameKPoint, TOUCH_TOLERANCE, type GapResult, type GapInput, type BandEdge, type Bandwidth } from "./gaps";
export { computeEffectiveMass, computeEdgeMasses, DEFAULT_MASS_STEP, type MassOptions, type MassResult } from "./masses";
export { compareFreeElectron, type FreeElectronInput, type FreeElectronResult } from "./free-electron";
export { compareBandSets, type BandDifference } from "./compare";
export {
  compareWithReference,
  computeAlignmentShift,
  selectReferencePairs,
  referenceBandsSchema,
  type Alignment,
  type BandError,
  type ReferenceBands,
  type ReferenceCompareOptions,
  type ReferenceComparison,
  type ReferencePair,
} from "./compare-reference";
export {
  compareDocuments,
  compareDocumentWithReference,
  compareDocumentFreeElectron,
  computeDocumentDos,
  findDocumentFermiLevel,
  type MeshChoice,
} from "./document-bands";
export { createEnergySolver, spinDegeneracyOf, defaultMeshDivisions } from "./model-solver";
export { LevelShiftSolver } from "./hellmann-feynman";
export {
  buildDerivativeModels,
  computeBandDerivatives,
  computeSensitivity,
  summariseSensitivity,
  type BandDerivatives,
  type DerivativeModel,
  type SensitivityResult,
} from "./sensitivity";
export { estimateParameterChange, type ParameterChangeEffect, type ShiftPeak } from "./parameter-change";
export { checkGaugeChange, type GaugeVerdict, type OrbitalFlip } from "./gauge";
export { solveSignFlips, type SignConstraint, type SignSolution } from "./gauge-parity";
export { type CheckResult, type CheckStatus } from "./check-result";
export { checkHermiticity, checkTimeReversal, checkTraceSumRule, checkDegeneracies, type DeclaredDegeneracy } from "./checks-symmetry";
export { checkHoppingDecay, checkOutermostShell, withoutOutermostShell } from "./checks-shells";
export { runDocumentChecks, onsiteTrace, type CheckOptions } from "./checks";
export {
  ACCEPTANCE_CRITERION_SCHEMA,
  ACCEPTANCE_CRITERIA_SCHEMA,
  evaluateAcceptance,
  type AcceptanceCriterion,
  type AcceptanceCriterionInput,
} from "./acceptance";
export { createDocumentMetrics, type DocumentMetrics } from "./metrics";
export { minimiseLeastSquares, type LeastSquaresProblem, type LmOptions, type LmProgress, type LmResult, type LmStatus } from "./levenberg-marquardt";
export { fitBandModel, type FitModel, type FitResult } from "./fit";
export { FitInputError, validateFitInput, type BandFitOptions } from "./fit-input";
export { computeFitStatistics, type FitStatistics } from "./fit-statistics";
export { fitDocument, previewDocumentFit, type DocumentFitOptions, type DocumentFitPreview, type DocumentFitResult } from "./fit-document";
