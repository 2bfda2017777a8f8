import { AnalysisBodySchema, ModelAnalysisSchema } from '../../contracts/registry.js';
import type { RouteTable } from '../../http/route.js';
import { analyzeSubmittedModel } from './analysis.service.js';

export function registerAnalysisRoutes(routes: RouteTable): void {
  routes.add(
    {
      method: 'post',
      path: '/api/v1/analysis',
      access: ['engineer'],
      tag: 'analysis',
      summary: 'Analyse A, B (C, D) at a sample period without storing anything; 400 invalid_model lists every problem',
      body: AnalysisBodySchema,
      response: ModelAnalysisSchema,
    },
    ({ body }) => analyzeSubmittedModel(body),
  );
}
