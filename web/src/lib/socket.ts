import { io, type Socket } from 'socket.io-client';
import { createRoomCounter } from './socket-rooms';

import type {
  AlertObject,
  ClientToServerEvents,
  LoopStatusChange,
  ServerToClientEvents,
  TwinSample,
} from '@shadowloop/simulator/events';

export type { AlertObject, LoopStatusChange, TwinSample };
export type AlertEventKind = 'raised' | 'updated';
export type TwinSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
export type ConnectionState = 'connecting' | 'live' | 'reconnecting';

/** The one live connection of the app: rooms are joined while someone watches them. */
export interface TwinSocketClient {
  /** Joins the loop's room (once, however many watchers) and hands its samples to `onSample`. */
  watchLoop(loopId: string, onSample: (sample: TwinSample) => void): () => void;
  /** Joins the area's room and hands its loops' status changes to `onStatus`. */
  watchArea(areaId: string, onStatus: (change: LoopStatusChange) => void): () => void;
  /** Hands `alert:raised` and `alert:updated` (the alerts room, which the server joins for every socket) to `onAlert`. */
  watchAlerts(onAlert: (alert: AlertObject, kind: AlertEventKind) => void): () => void;
  /** Called after a dropped connection is back and its rooms are joined again: time to backfill. */
  onReconnect(listener: () => void): () => void;
  state(): ConnectionState;
  subscribeState(listener: () => void): () => void;
}

type Listeners<T> = Map<string, Set<(payload: T) => void>>;

function addListener<T>(map: Listeners<T>, key: string, listener: (payload: T) => void): () => void {
  const set = map.get(key) ?? new Set();
  set.add(listener);
  map.set(key, set);
  return () => {
    set.delete(listener);
    if (set.size === 0) map.delete(key);
  };
}

export function createTwinSocketClient(connect: () => TwinSocket): TwinSocketClient {
  let socket: TwinSocket | null = null;
  let state: ConnectionState = 'connecting';
  let everConnected = false;
  const samples: Listeners<TwinSample> = new Map();
  const statuses: Listeners<LoopStatusChange> = new Map();
  const alertListeners = new Set<(alert: AlertObject, kind: AlertEventKind) => void>();
  const reconnectListeners = new Set<() => void>();
  const stateListeners = new Set<() => void>();
  const setState = (next: ConnectionState) => {
    if (next === state) return;
    state = next;
    stateListeners.forEach((listener) => listener());
  };

  // While disconnected nothing is sent: every 'connect' joins all held rooms afresh.
  const rooms = createRoomCounter({
    join: (room) => {
      if (socket?.connected) emitRoom(socket, room, 'watch');
    },
    leave: (room) => {
      if (socket?.connected) emitRoom(socket, room, 'unwatch');
    },
  });

  const ensureSocket = (): TwinSocket => {
    if (socket) return socket;
    const created = connect();
    socket = created;
    created.on('twin:sample', (sample) => samples.get(sample.loopId)?.forEach((listener) => listener(sample)));
    created.on('loop:status', (change) => statuses.get(change.area)?.forEach((listener) => listener(change)));
    created.on('alert:raised', (alert) => alertListeners.forEach((listener) => listener(alert, 'raised')));
    created.on('alert:updated', (alert) => alertListeners.forEach((listener) => listener(alert, 'updated')));
    created.on('connect', () => {
      rooms.active().forEach((room) => emitRoom(created, room, 'watch'));
      setState('live');
      if (everConnected) reconnectListeners.forEach((listener) => listener());
      everConnected = true;
    });
    created.on('disconnect', (reason) => {
      setState('reconnecting');
      // The server closed this socket on purpose (e.g. a restart): socket.io leaves reconnecting to us.
      if (reason === 'io server disconnect') created.connect();
    });
    return created;
  };

  return {
    watchLoop(loopId, onSample) {
      ensureSocket();
      const stopListening = addListener(samples, loopId, onSample);
      const release = rooms.hold(`loop:${loopId}`);
      return () => {
        stopListening();
        release();
      };
    },
    watchArea(areaId, onStatus) {
      ensureSocket();
      const stopListening = addListener(statuses, areaId, onStatus);
      const release = rooms.hold(`area:${areaId}`);
      return () => {
        stopListening();
        release();
      };
    },
    watchAlerts(onAlert) {
      ensureSocket();
      alertListeners.add(onAlert);
      return () => void alertListeners.delete(onAlert);
    },
    onReconnect(listener) {
      reconnectListeners.add(listener);
      return () => reconnectListeners.delete(listener);
    },
    state: () => state,
    subscribeState(listener) {
      stateListeners.add(listener);
      return () => stateListeners.delete(listener);
    },
  };
}

/** Rooms are held as `loop:<id>` or `area:<id>`, the server's own room names. */
function emitRoom(socket: TwinSocket, room: string, verb: 'watch' | 'unwatch'): void {
  const colon = room.indexOf(':');
  const [kind, id] = [room.slice(0, colon), room.slice(colon + 1)];
  if (kind === 'loop') socket.emit(verb === 'watch' ? 'loop:watch' : 'loop:unwatch', { loopId: id });
  else socket.emit(verb === 'watch' ? 'area:watch' : 'area:unwatch', { areaId: id });
}

let shared: TwinSocketClient | null = null;

/**
 * The app's shared connection: same origin, the session cookie, reconnecting by itself. WebSocket
 * only: samples are sent volatile, and a polling-to-WebSocket upgrade window would drop them.
 */
export function twinSocket(): TwinSocketClient {
  shared ??= createTwinSocketClient(() => io({ path: '/socket.io', withCredentials: true, transports: ['websocket'] }));
  return shared;
}

/** Tests put a stand-in in place of the real connection. */
export function replaceTwinSocketForTests(client: TwinSocketClient | null): void {
  shared = client;
}
