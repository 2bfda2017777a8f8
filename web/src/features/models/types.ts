import type {
  ExploreResult,
  ModelProblem,
  ModelVersion,
  UploadedModel,
  UploadProblem,
} from '@shadowloop/api/contracts';
import type { Complex, Mode, ModelAnalysis, Stability } from '@shadowloop/simulator/engine';

export type { Complex, Mode, ModelAnalysis, ModelProblem, Stability, UploadedModel, UploadProblem };

/** A model version as the api sends it, its stored analysis typed as the engine's result. */
export type Version = Omit<ModelVersion, 'analysis'> & { analysis: ModelAnalysis };

export type VersionStatus = ModelVersion['status'];

export type CorrectionMode = ModelVersion['correction']['mode'];

export type MatrixName = 'A' | 'B' | 'C' | 'D';

export type Exploration = ExploreResult;

/** One mode's share of the free response; row k of `contribution` is its part of x(k). */
export type ModalPart = NonNullable<ExploreResult['modal']>[number];
