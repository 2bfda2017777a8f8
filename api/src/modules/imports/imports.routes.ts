import { z } from 'zod';
import {
  ImportFieldsSchema,
  ImportPreviewSchema,
  ImportProgressSchema,
  INGEST_LIMITS,
} from '../../contracts/ingest.js';
import { notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import type { RouteTable } from '../../http/route.js';
import { requireLiveLoop } from '../readings/live-loop.js';
import { receiveCsv } from './csv-upload.js';
import { findImport } from './import-progress.repository.js';
import { previewCsv } from './import-preview.js';
import { importCsv, type ImportDeps } from './import.service.js';

export function registerImportRoutes(routes: RouteTable, deps: ImportDeps): void {
  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/readings/import/preview',
      access: ['engineer'],
      tag: 'readings',
      summary: `multipart/form-data with a CSV "file": its header, the first ${INGEST_LIMITS.previewRows} rows and a suggested column mapping; nothing is stored`,
      multipart: { fields: z.object({}), file: 'file' },
      response: ImportPreviewSchema,
    },
    async ({ req, res }) => {
      const loop = await requireLiveLoop(deps.db, String(req.params.loopId));
      return receiveCsv(req, res, deps.maxFileBytes, (csv) => previewCsv(deps.db, loop.id, csv.stream));
    },
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/readings/import',
      access: ['engineer'],
      tag: 'readings',
      summary:
        'Import historical readings from a CSV (multipart/form-data: fields "mapping" = JSON {"t": column, "u": [columns], "y": [columns]} by header name or zero-based position, ' +
        'optional "importId" = a UUID to follow progress at GET /api/v1/imports/{id}, then the "file"). Slots and duplicates as for POST …/readings; ' +
        `answers accepted, duplicates, rejected and the first ${INGEST_LIMITS.reportedBadRows} bad rows with their line (the header is line 1)`,
      multipart: { fields: ImportFieldsSchema, file: 'file' },
      response: ImportProgressSchema,
    },
    ({ req, res, user }) => importCsv(deps, user, String(req.params.loopId), req, res),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/imports/:id',
      access: ['engineer'],
      tag: 'readings',
      summary:
        'Progress of a CSV import while it runs (rowsRead, accepted, duplicates, rejected, done), and its tally afterwards',
      response: ImportProgressSchema,
    },
    async ({ req }) => {
      const id = String(req.params.id);
      const progress = isUuid(id) ? await findImport(deps.db, id) : undefined;
      if (!progress) throw notFound(`Import ${id}`);
      return progress;
    },
  );
}
