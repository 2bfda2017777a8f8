import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents, WatchAck } from '../../simulator/src/events.js';

export type TwinSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

/** A socket.io client over WebSocket: with an access token, a session cookie, or nothing. */
export function twinSocket(
  url: string,
  credentials: { token?: string; cookie?: string; origin?: string } = {},
): TwinSocket {
  const headers = {
    ...(credentials.cookie ? { cookie: credentials.cookie } : {}),
    ...(credentials.origin ? { origin: credentials.origin } : {}),
  };
  return io(url, {
    transports: ['websocket'],
    reconnection: false,
    forceNew: true,
    ...(credentials.token ? { auth: { token: credentials.token } } : {}),
    ...(Object.keys(headers).length ? { extraHeaders: headers } : {}),
  });
}

/** Resolves on connect; rejects with the server's refusal. */
export function connected(socket: TwinSocket): Promise<void> {
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', (error) => reject(error));
  });
}

export function watchLoop(socket: TwinSocket, loopId: string): Promise<WatchAck> {
  return socket.timeout(3000).emitWithAck('loop:watch', { loopId });
}

/** Collects every event of one name into an array. */
export function collect<E extends keyof ServerToClientEvents>(
  socket: TwinSocket,
  event: E,
): Parameters<ServerToClientEvents[E]>[0][] {
  const seen: Parameters<ServerToClientEvents[E]>[0][] = [];
  socket.on(event, ((payload: Parameters<ServerToClientEvents[E]>[0]) => seen.push(payload)) as never);
  return seen;
}
