import { createAdapter } from '@socket.io/postgres-adapter';
import type pg from 'pg';
import { Server } from 'socket.io';
import { loopRoom, type ClientToServerEvents, type ServerToClientEvents, type TwinSample } from '../events.js';
import { batchNotifies } from './notify-batching.js';

export interface SampleEmitter {
  emit(sample: TwinSample): void;
  close(): Promise<void>;
}

/**
 * Emits twin samples to the loop rooms of every api process: a socket.io Server that never listens
 * (headless), on the same PostgreSQL adapter as the api, so a broadcast here reaches the sockets
 * there. (The separate emitter package drops messages with this adapter version.) Samples are
 * volatile: a client that cannot take one now only wants the next. The pool should be the
 * emitter's own: its notifications are batched (see {@link batchNotifies}).
 */
export function createSampleEmitter(pool: pg.Pool): SampleEmitter {
  const io = new Server<ClientToServerEvents, ServerToClientEvents>({ adapter: createAdapter(batchNotifies(pool)) });
  return {
    emit(sample) {
      io.to(loopRoom(sample.loopId)).volatile.emit('twin:sample', sample);
    },
    // Server.close() would also close an engine a headless server never started, and throws.
    close: async () => {
      await io.of('/').adapter.close();
    },
  };
}

/** For a service that should not emit (tests of the stepping alone). */
export const silentEmitter: SampleEmitter = { emit: () => undefined, close: async () => undefined };
