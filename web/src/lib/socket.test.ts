import { describe, expect, it, vi } from 'vitest';
import { createTwinSocketClient, type TwinSample, type TwinSocket } from './socket';

/** Enough of a socket.io client socket: handlers by event, and what was emitted. */
function fakeSocket() {
  const handlers = new Map<string, ((payload?: unknown) => void)[]>();
  const emitted: [string, unknown][] = [];
  const socket = {
    connected: false,
    on(event: string, handler: (payload?: unknown) => void) {
      handlers.set(event, [...(handlers.get(event) ?? []), handler]);
      return socket;
    },
    emit(event: string, payload: unknown) {
      emitted.push([event, payload]);
      return socket;
    },
    connect: vi.fn(),
    fire(event: string, payload?: unknown) {
      if (event === 'connect') socket.connected = true;
      if (event === 'disconnect') socket.connected = false;
      handlers.get(event)?.forEach((handler) => handler(payload));
    },
  };
  return { socket, emitted };
}

const sample = (loopId: string): TwinSample => ({
  loopId,
  t: '2025-03-01T08:00:00Z',
  k: 1,
  predicted: [1],
  measured: [1.1],
  residual: [0.1],
  status: 'in_step',
});

describe('the shared twin socket', () => {
  it('joins a room once for many watchers and leaves it with the last one', () => {
    const { socket, emitted } = fakeSocket();
    const client = createTwinSocketClient(() => socket as unknown as TwinSocket);
    const first = client.watchLoop('a', () => undefined);
    const second = client.watchLoop('a', () => undefined);
    socket.fire('connect');
    expect(emitted).toEqual([['loop:watch', { loopId: 'a' }]]);
    first();
    expect(emitted).toHaveLength(1);
    second();
    expect(emitted.at(-1)).toEqual(['loop:unwatch', { loopId: 'a' }]);
  });

  it('hands samples to the watchers of their loop only', () => {
    const { socket } = fakeSocket();
    const client = createTwinSocketClient(() => socket as unknown as TwinSocket);
    const seenA = vi.fn();
    const seenB = vi.fn();
    client.watchLoop('a', seenA);
    client.watchLoop('b', seenB);
    socket.fire('twin:sample', sample('a'));
    expect(seenA).toHaveBeenCalledWith(sample('a'));
    expect(seenB).not.toHaveBeenCalled();
  });

  it('after a drop, joins every held room again and then asks for a backfill', () => {
    const { socket, emitted } = fakeSocket();
    const client = createTwinSocketClient(() => socket as unknown as TwinSocket);
    const backfill = vi.fn();
    client.onReconnect(backfill);
    client.watchLoop('a', () => undefined);
    client.watchArea('aeration', () => undefined);
    socket.fire('connect');
    expect(backfill).not.toHaveBeenCalled();
    socket.fire('disconnect', 'transport close');
    expect(client.state()).toBe('reconnecting');
    emitted.length = 0;
    socket.fire('connect');
    expect(emitted).toEqual([
      ['loop:watch', { loopId: 'a' }],
      ['area:watch', { areaId: 'aeration' }],
    ]);
    expect(backfill).toHaveBeenCalledTimes(1);
    expect(client.state()).toBe('live');
  });

  it('reconnects by itself when the server closed the connection', () => {
    const { socket } = fakeSocket();
    const client = createTwinSocketClient(() => socket as unknown as TwinSocket);
    client.watchLoop('a', () => undefined);
    socket.fire('disconnect', 'io server disconnect');
    expect(socket.connect).toHaveBeenCalled();
  });

  it('hands raised and updated alerts to alert watchers, which need no room of their own', () => {
    const { socket, emitted } = fakeSocket();
    const client = createTwinSocketClient(() => socket as unknown as TwinSocket);
    const seen = vi.fn();
    const stop = client.watchAlerts(seen);
    socket.fire('connect');
    const alert = {
      id: 'x',
      number: 1,
      loopId: 'a',
      area: 'aeration',
      state: 'unacknowledged',
      priority: 1,
      active: true,
    };
    socket.fire('alert:raised', alert);
    socket.fire('alert:updated', { ...alert, state: 'acknowledged' });
    expect(seen.mock.calls).toEqual([
      [alert, 'raised'],
      [{ ...alert, state: 'acknowledged' }, 'updated'],
    ]);
    expect(emitted).toEqual([]);
    stop();
    socket.fire('alert:updated', alert);
    expect(seen).toHaveBeenCalledTimes(2);
  });
});
