/** The socket.io event contract shared by the api, the simulator and the web app (API.md, Realtime). */
export type TrackingStatus = 'in_step' | 'drifting' | 'diverged' | 'stale' | 'no_twin';

/** Rooms: one per loop, one per plant area, and one for every signed-in user's alerts. */
export const loopRoom = (loopId: string) => `loop:${loopId}`;
export const areaRoom = (areaId: string) => `area:${areaId}`;
export const ALERTS_ROOM = 'alerts';

/**
 * One sample of a loop's twin, at slot time `t` = k·T (ISO 8601 UTC). `predicted` is empty when
 * the twin had no prediction for the slot; `measured` and `residual` are null when no reading
 * has arrived for it (yet).
 */
export interface TwinSample {
  loopId: string;
  t: string;
  k: number;
  predicted: number[];
  measured: number[] | null;
  residual: number[] | null;
  status: TrackingStatus;
}

/** A loop's tracking status changed; sent to the room of the loop's area. */
export interface LoopStatusChange {
  loopId: string;
  area: string;
  status: TrackingStatus;
  previousStatus: TrackingStatus;
  /** When the change was seen (ISO 8601 UTC). */
  at: string;
  lastReadingAt: string | null;
  /** max_i |r_i| / band_i of the newest residual; null while no band is known. */
  worstBandFraction: number | null;
}

/** The answer to a watch request: ok, or why the server refused it. */
export type WatchAck = { ok: true } | { ok: false; error: { code: string; message: string } };

export interface ClientToServerEvents {
  'loop:watch': (payload: { loopId: string }, ack?: (result: WatchAck) => void) => void;
  'loop:unwatch': (payload: { loopId: string }, ack?: (result: WatchAck) => void) => void;
  'area:watch': (payload: { areaId: string }, ack?: (result: WatchAck) => void) => void;
  'area:unwatch': (payload: { areaId: string }, ack?: (result: WatchAck) => void) => void;
}

/**
 * An alert as the api's REST answers carry it (api/src/contracts/alerts.ts, AlertSchema); the
 * fields every listener relies on are named here.
 */
export interface AlertObject {
  id: string;
  number: number;
  loopId: string;
  area: string;
  state: string;
  priority: number;
  active: boolean;
  [field: string]: unknown;
}

export interface ServerToClientEvents {
  'twin:sample': (sample: TwinSample) => void;
  'loop:status': (change: LoopStatusChange) => void;
  /** A new alert (to the alerts room, which every signed-in socket joins). */
  'alert:raised': (alert: AlertObject) => void;
  /** An alert changed state, cleared, re-raised, escalated (to the alerts room). */
  'alert:updated': (alert: AlertObject) => void;
}
