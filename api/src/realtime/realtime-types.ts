import type { Server, Socket } from 'socket.io';
import type { ClientToServerEvents, ServerToClientEvents } from '@shadowloop/simulator/events';
import type { SignedInUser } from '../auth/user.js';

/** Per-socket data: the person behind the connection. */
export interface SocketData {
  user: SignedInUser;
  /** How it signed in: the session's id, or the access token's id. */
  credential: { kind: 'session'; sessionId: string } | { kind: 'token'; tokenId: string };
}

// eslint-disable-next-line @typescript-eslint/no-empty-object-type -- no server-to-server events
type InterServerEvents = {};
export type RealtimeServer = Server<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
export type RealtimeSocket = Socket<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
