import { afterEach } from 'vitest';
import {
  replaceTwinSocketForTests,
  type AlertEventKind,
  type AlertObject,
  type LoopStatusChange,
  type TwinSample,
  type TwinSocketClient,
} from '../lib/socket';

let installed = false;

/** A stand-in for the shared socket: records what is watched and delivers events on demand. */
export function installFakeSocket() {
  installed = true;
  const samples = new Map<string, Set<(sample: TwinSample) => void>>();
  const statuses = new Map<string, Set<(change: LoopStatusChange) => void>>();
  const reconnects = new Set<() => void>();
  const alerts = new Set<(alert: AlertObject, kind: AlertEventKind) => void>();
  const hold = <T>(map: Map<string, Set<T>>, key: string, listener: T) => {
    const set = map.get(key) ?? new Set<T>();
    set.add(listener);
    map.set(key, set);
    return () => void set.delete(listener);
  };
  const client: TwinSocketClient = {
    watchLoop: (loopId, onSample) => hold(samples, loopId, onSample),
    watchArea: (areaId, onStatus) => hold(statuses, areaId, onStatus),
    watchAlerts: (onAlert) => {
      alerts.add(onAlert);
      return () => void alerts.delete(onAlert);
    },
    onReconnect: (listener) => {
      reconnects.add(listener);
      return () => void reconnects.delete(listener);
    },
    state: () => 'live',
    subscribeState: () => () => undefined,
  };
  replaceTwinSocketForTests(client);
  return {
    watchedLoops: () => [...samples.entries()].filter(([, set]) => set.size > 0).map(([id]) => id),
    watchedAreas: () => [...statuses.entries()].filter(([, set]) => set.size > 0).map(([id]) => id),
    sample: (sample: TwinSample) => samples.get(sample.loopId)?.forEach((listener) => listener(sample)),
    status: (change: LoopStatusChange) => statuses.get(change.area)?.forEach((listener) => listener(change)),
    reconnect: () => reconnects.forEach((listener) => listener()),
    alert: (alert: AlertObject, kind: AlertEventKind = 'updated') =>
      alerts.forEach((listener) => listener(alert, kind)),
  };
}

/** Pages rendered in tests never open a real connection; a test that needs events installs its own. */
export function keepSocketsOffline(): void {
  if (!installed) installFakeSocket();
}

afterEach(() => {
  installed = false;
  replaceTwinSocketForTests(null);
});
