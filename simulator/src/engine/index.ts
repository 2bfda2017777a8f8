/**
 * The state-space mathematics of Shadowloop: pure functions, no I/O. Used by the simulator (stepping),
 * the api (validation, analysis, backtests, forecasts) and the tests.
 */
export type { Complex, Matrix, StateSpaceModel } from './types.js';
export { transitionMatrix } from './transition.js';
export { stepResponse, stepResponseSeries, steadyStateGain, SINGULAR_RELATIVE_TOLERANCE } from './step-response.js';
export {
  analyzeModes,
  describeMode,
  STABILITY_TOLERANCE,
  type Mode,
  type ModeAnalysis,
  type Stability,
} from './modes.js';
export { DEFECTIVE_CONDITION } from './eigen.js';
export { modalDecomposition, type ModalContribution } from './modal-decomposition.js';
export {
  residualDirection,
  MOVING_SIGNAL_SHARE,
  PROCESS_MODE_SHARE,
  SENSOR_SIGNAL_SHARE,
  type ResidualDirectionInput,
  type ResidualDirectionResult,
  type ResidualPointer,
} from './residual-direction.js';
export { matrixExponential } from './expm.js';
export { discretizeZoh, type DiscreteModel } from './zoh.js';
export { controllabilityRank, observabilityRank, RANK_RELATIVE_TOLERANCE } from './structure.js';
export { steadyStateKalman, type SteadyStateKalman } from './kalman.js';
export { step, createStepper, type Stepper, type StepResult } from './step.js';
export { forecast, movePreview, type Forecast } from './forecast.js';
export {
  cusumStep,
  ewmaStep,
  nis,
  type CusumDesign,
  type CusumState,
  type DriftSignal,
  type EwmaDesign,
  type EwmaState,
} from './drift.js';
export { normalCdf, normalPdf, normalQuantile } from './normal.js';
export { chiSquareCdf, chiSquareQuantile } from './chi-square.js';
export { cusumArl, persistenceArl, type CusumArlQuery } from './run-length.js';
export { fitPercent, residualAutocorrelation, type ResidualAutocorrelation } from './fit.js';
export { modelAtOperatingPoint } from './model-shape.js';
export { validateModel, MAX_PROBLEMS, MAX_SIGNALS, MAX_STATES, type ModelProblem } from './validate.js';
export {
  analyzeModel,
  type AnalysisInput,
  type AnalysisOptions,
  type ModelAnalysis,
  type StepResponseChart,
} from './analysis.js';
