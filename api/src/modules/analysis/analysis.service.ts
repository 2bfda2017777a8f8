import { analyzeModel, validateModel, type Matrix, type ModelAnalysis } from '@shadowloop/simulator/engine';
import type { z } from 'zod';
import type { AnalysisBodySchema } from '../../contracts/registry.js';
import { fromEngineProblem, invalidModel } from '../model-versions/model-problems.js';
import { stepHorizon } from '../model-versions/step-horizon.js';

/** The engine's analysis of a submitted model, after the engine's own validation (every problem listed). */
export function analyzeSubmittedModel(body: z.infer<typeof AnalysisBodySchema>): ModelAnalysis {
  const { stepSamples, ...model } = body;
  const problems = validateModel(model).map((problem) => fromEngineProblem(problem));
  if (problems.length) throw invalidModel(problems);
  const { A, B, C, D, samplePeriodS } = model as {
    A: Matrix;
    B: Matrix;
    C?: Matrix;
    D?: Matrix;
    samplePeriodS: number;
  };
  return analyzeModel(
    { A, B, C, D, samplePeriodS },
    { stepSamples: stepHorizon(C?.length ?? A.length, B[0].length, stepSamples) },
  );
}
