import { z } from 'zod';
import {
  OnCallNowQuerySchema,
  OnCallNowSchema,
  RotaPersonSchema,
  SaveShiftBodySchema,
  ShiftListQuerySchema,
  ShiftSchema,
  SwapShiftBodySchema,
} from '../../contracts/alerts.js';
import type { RouteTable } from '../../http/route.js';
import type { AlertRouteDeps } from '../alert.routes.js';
import { findOnCallEverywhere } from './oncall-lookup.js';
import { registerRotaSettingsRoutes } from './rota-settings.routes.js';
import { listPeopleWithRole, ROTA_ROLES } from './rota-people.js';
import { createShift, listShifts, removeShift, replaceShift, swapShifts } from './shifts.service.js';

const TAG = 'on-call rota';
/** Administrators and on-call engineers manage the rota; an on-call engineer may edit any shift. */
const ROTA_EDITORS = ['admin', 'oncall'] as const;

/** The on-call rota (shifts, who is on call, who may take shifts), area engineers and alert settings. */
export function registerOnCallRoutes(routes: RouteTable, deps: AlertRouteDeps): void {
  const { db } = deps;
  routes.add(
    {
      method: 'get',
      path: '/api/v1/oncall/shifts',
      access: 'signed-in',
      tag: TAG,
      summary: 'Shifts that overlap [from, to) (at most 366 days), earliest first, with each person',
      query: ShiftListQuerySchema,
      response: z.array(ShiftSchema),
    },
    ({ query }) => listShifts(db, query),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/oncall/shifts',
      access: ROTA_EDITORS,
      tag: TAG,
      status: 201,
      summary:
        'Add a shift (area null: plant-wide; at most 31 days); the person must hold the oncall or admin role; 409 names the shift of the same position and area it would overlap',
      body: SaveShiftBodySchema,
      response: ShiftSchema,
    },
    ({ user, body }) => createShift(db, user, body),
  );

  routes.add(
    {
      method: 'put',
      path: '/api/v1/oncall/shifts/:id',
      access: ROTA_EDITORS,
      tag: TAG,
      summary: 'Replace a shift (any on-call engineer may edit any shift); same rules as adding one',
      body: SaveShiftBodySchema,
      response: ShiftSchema,
    },
    ({ user, req, body }) => replaceShift(db, user, String(req.params.id), body),
  );

  routes.add(
    {
      method: 'delete',
      path: '/api/v1/oncall/shifts/:id',
      access: ROTA_EDITORS,
      tag: TAG,
      summary: 'Remove a shift',
    },
    async ({ user, req }) => {
      await removeShift(db, user, String(req.params.id));
    },
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/oncall/shifts/:id/swap',
      access: ROTA_EDITORS,
      tag: TAG,
      summary: 'Swap with: the two shifts exchange their people at once (times, areas and positions stay)',
      body: SwapShiftBodySchema,
      response: z.array(ShiftSchema),
    },
    ({ user, req, body }) => swapShifts(db, user, String(req.params.id), body.withShiftId),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/oncall/now',
      access: 'signed-in',
      tag: TAG,
      summary: "Who is on call now (or at `at`): plant-wide, and per area (an area's own shift wins over plant-wide)",
      query: OnCallNowQuerySchema,
      response: OnCallNowSchema,
    },
    ({ query }) => findOnCallEverywhere(db, query.at ? new Date(query.at) : new Date()),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/oncall/people',
      access: 'signed-in',
      tag: TAG,
      summary: 'People who may take shifts (holding the oncall or admin role), by name',
      response: z.array(RotaPersonSchema),
    },
    () => listPeopleWithRole(db, ROTA_ROLES),
  );

  registerRotaSettingsRoutes(routes, deps);
}
