import type { Knex } from 'knex';
import type { TwinSample } from '../../simulator/src/events.js';
import { createTwinRegistry, type TwinRegistry } from '../../simulator/src/registry/twin-registry.js';
import {
  createTwinService,
  type SampleEmitter,
  type TwinOptionsInput,
  type TwinService,
} from '../../simulator/src/twin/index.js';

/** An emitter that keeps what it was given. */
export function recordingEmitter(): SampleEmitter & { samples: TwinSample[] } {
  const samples: TwinSample[] = [];
  return { samples, emit: (sample) => void samples.push(sample), close: async () => undefined };
}

/** Fast leases for tests: a loop is taken over about 1.5 s after its holder dies. */
export const FAST: TwinOptionsInput = {
  leaseIntervalMs: 250,
  lease: { ttlSamples: 3, minTtlMs: 1500 },
  persistIntervalMs: 250,
  wheelResolutionMs: 20,
};

export interface RunningTwins {
  registry: TwinRegistry;
  service: TwinService;
  emitter: ReturnType<typeof recordingEmitter>;
  log: string[];
  stop(graceful?: boolean): Promise<void>;
}

/** A registry and a twin service scoped to one area, as one simulator process would run them. */
export async function startTwins(
  db: Knex,
  databaseUrl: string,
  area: string,
  options: TwinOptionsInput = {},
  emitter?: SampleEmitter,
): Promise<RunningTwins> {
  const log: string[] = [];
  const registry = createTwinRegistry({ db, databaseUrl, log: (line) => log.push(`registry: ${line}`) });
  await registry.start();
  const recorder = recordingEmitter();
  const service = createTwinService({
    db,
    models: registry,
    log: (line) => log.push(line),
    emitter: emitter
      ? {
          emit: (s) => {
            recorder.emit(s);
            emitter.emit(s);
          },
          close: () => emitter.close(),
        }
      : recorder,
    options: { ...FAST, ...options, lease: { ...FAST.lease, ...options.lease, areas: [area] } },
  });
  await service.start();
  return {
    registry,
    service,
    emitter: recorder,
    log,
    async stop(graceful = true) {
      await service.stop({ graceful });
      await registry.stop();
      await emitter?.close();
    },
  };
}

export async function eventually<T>(
  read: () => Promise<T | undefined | false> | T | undefined | false,
  what: string,
  timeoutMs = 10_000,
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
