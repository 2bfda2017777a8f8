import { ALERTS_ROOM, areaRoom, loopRoom, type LoopStatusChange, type TwinSample } from '@shadowloop/simulator/events';
import type { Alert } from '../contracts/alerts.js';
import type { RealtimeServer } from './realtime-types.js';

/** What the api's services send to watching browsers (through every api process, by the adapter). */
export interface TwinPublisher {
  /** The newest sample of a loop, to its room; volatile: only the latest matters. */
  sample(sample: TwinSample): void;
  /** A loop's tracking status changed, to its area's room. */
  statusChanged(change: LoopStatusChange): void;
  /** A new alert, to every signed-in socket (the alerts room). */
  alertRaised(alert: Alert): void;
  /** An alert changed (state, clear, re-raise, escalation), to the alerts room. */
  alertUpdated(alert: Alert): void;
}

/**
 * The publisher exists before the socket.io server (the app is built before the HTTP server it
 * serves); it sends nothing until the realtime server attaches itself.
 */
export function createTwinPublisher(): TwinPublisher & { attach(io: RealtimeServer | null): void } {
  let io: RealtimeServer | null = null;
  return {
    attach: (server) => {
      io = server;
    },
    sample: (sample) => {
      io?.to(loopRoom(sample.loopId)).volatile.emit('twin:sample', sample);
    },
    statusChanged: (change) => {
      io?.to(areaRoom(change.area)).emit('loop:status', change);
    },
    alertRaised: (alert) => {
      io?.to(ALERTS_ROOM).emit('alert:raised', alert);
    },
    alertUpdated: (alert) => {
      io?.to(ALERTS_ROOM).emit('alert:updated', alert);
    },
  };
}
