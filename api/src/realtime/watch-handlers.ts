import { z } from 'zod';
import { ALERTS_ROOM, areaRoom, loopRoom, type WatchAck } from '@shadowloop/simulator/events';
import type { Db } from '../db/knex.js';
import { isUuid } from '../http/params.js';
import { areaExists } from '../modules/areas/areas.repository.js';
import type { RealtimeSocket } from './realtime-types.js';

const LoopWatchSchema = z.object({ loopId: z.string().refine(isUuid, 'loopId must be a loop id (UUID)') });
const AreaWatchSchema = z.object({ areaId: z.string().min(1).max(40) });

type Ack = ((result: WatchAck) => void) | undefined;
const refuse = (code: string, message: string): WatchAck => ({ ok: false, error: { code, message } });

async function loopExists(db: Db, id: string): Promise<boolean> {
  return Boolean(await db('loops').where({ id }).first('id'));
}

/** validate → check → join/leave → acknowledge; a failure answers the ack instead of throwing. */
function handle<S extends z.ZodType>(schema: S, act: (payload: z.infer<S>) => Promise<WatchAck>) {
  return (payload: unknown, ack: Ack) => {
    const reply = typeof ack === 'function' ? ack : () => undefined;
    const parsed = schema.safeParse(payload);
    if (!parsed.success)
      return reply(
        refuse(
          'validation_failed',
          parsed.error.issues.map((i) => `${i.path.join('.') || 'payload'}: ${i.message}`).join('; '),
        ),
      );
    act(parsed.data).then(reply, () => reply(refuse('internal', 'The server could not do that just now; try again.')));
  };
}

/**
 * Rooms a signed-in socket may join: a loop's (twin samples), an area's (status changes), and
 * the alerts room, which every signed-in socket joins on connection.
 */
export function registerWatchHandlers(socket: RealtimeSocket, db: Db): void {
  void socket.join(ALERTS_ROOM);
  socket.on(
    'loop:watch',
    handle(LoopWatchSchema, async ({ loopId }) => {
      if (!(await loopExists(db, loopId))) return refuse('not_found', `Loop ${loopId} was not found.`);
      await socket.join(loopRoom(loopId));
      return { ok: true };
    }),
  );
  socket.on(
    'loop:unwatch',
    handle(LoopWatchSchema, async ({ loopId }) => {
      await socket.leave(loopRoom(loopId));
      return { ok: true };
    }),
  );
  socket.on(
    'area:watch',
    handle(AreaWatchSchema, async ({ areaId }) => {
      if (!(await areaExists(db, areaId))) return refuse('not_found', `Area ${areaId} was not found.`);
      await socket.join(areaRoom(areaId));
      return { ok: true };
    }),
  );
  socket.on(
    'area:unwatch',
    handle(AreaWatchSchema, async ({ areaId }) => {
      await socket.leave(areaRoom(areaId));
      return { ok: true };
    }),
  );
}
