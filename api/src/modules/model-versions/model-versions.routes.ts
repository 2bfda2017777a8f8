import { z } from 'zod';
import {
  AnalysisQuerySchema,
  CreateModelVersionBodySchema,
  ExploreBodySchema,
  ExploreResultSchema,
  ExportQuerySchema,
  ModelAnalysisSchema,
  ModelVersionSchema,
  UploadedModelSchema,
} from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { getLoop } from '../loops/loops.service.js';
import { exportVersion } from './model-export.js';
import { createDraft, getVersion, listVersions, loadVersion } from './model-versions.service.js';
import { receiveFiles } from './upload-files.js';
import { readModelUpload } from './upload.service.js';
import { exploreVersion, versionAnalysis } from './version-tools.service.js';

export function registerModelVersionRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId/model-versions',
      access: 'signed-in',
      tag: 'model versions',
      summary: "A loop's model versions, newest first",
      response: z.array(ModelVersionSchema),
    },
    ({ req }) => listVersions(db, String(req.params.loopId)),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/model-versions',
      access: ['engineer'],
      tag: 'model versions',
      status: 201,
      summary:
        "Save a draft from A, B (C, D) or from a continuous Ac, Bc (zero-order hold at the loop's sample period), with its analysis; 400 invalid_model lists every problem as {field, message}",
      body: CreateModelVersionBodySchema,
      response: ModelVersionSchema,
    },
    ({ user, req, body }) => createDraft(db, user, String(req.params.loopId), body),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/model-uploads',
      access: ['engineer'],
      tag: 'model versions',
      summary:
        'Read uploaded matrices for the editor (multipart/form-data: one JSON file, or A.csv, B.csv, C.csv, D.csv / Ac.csv, Bc.csv; ≤ 1 MB each, ≤ 6 files); nothing is stored; 400 invalid_upload lists {file, row, column, message}',
      response: UploadedModelSchema,
    },
    async ({ req, res }) => {
      const loop = await getLoop(db, String(req.params.loopId));
      return readModelUpload(loop, await receiveFiles(req, res));
    },
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/model-versions/:id',
      access: 'signed-in',
      tag: 'model versions',
      summary: 'One model version with its stored analysis',
      response: ModelVersionSchema,
    },
    ({ req }) => getVersion(db, String(req.params.id)),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/model-versions/:id/analysis',
      access: 'signed-in',
      tag: 'model versions',
      summary: "The version's analysis recomputed with a step response of stepSamples samples (at most 5000)",
      query: AnalysisQuerySchema,
      response: ModelAnalysisSchema,
    },
    ({ req, query }) => versionAnalysis(db, String(req.params.id), query.stepSamples),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/model-versions/:id/explore',
      access: 'signed-in',
      tag: 'model versions',
      summary:
        'State transition explorer: A^k, the free response from x0 (deviation from the operating point) and its split into modes',
      body: ExploreBodySchema,
      response: ExploreResultSchema,
    },
    ({ req, body }) => exploreVersion(db, String(req.params.id), body),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/model-versions/:id/export',
      access: 'signed-in',
      tag: 'model versions',
      summary:
        'Download the version: JSON (matrices plus "about"; can be uploaded again) or CSV (one block per matrix, header line first)',
      query: ExportQuerySchema,
    },
    async ({ req, res, query }) => {
      const version = await loadVersion(db, String(req.params.id));
      const file = exportVersion(await getLoop(db, version.loopId), version, query.format);
      res.attachment(file.filename).type(file.contentType).send(file.content);
    },
  );
}
