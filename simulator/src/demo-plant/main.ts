import knexFactory from 'knex';
import { loadActiveModels } from '../registry/active-models.js';
import type { ActiveModel } from '../registry/hot-swap.js';
import { readDemoConfig } from './demo-config.js';
import { createDemoPlant } from './demo-plant.js';
import { QUILLMERE_PROFILES } from './quillmere.js';
import { createReadingPoster } from './reading-poster.js';

/**
 * The demo plant process (started by npm start unless DEMO_PLANT=false): plays the invented
 * Quillmere works for the demo loops of the database and posts their readings to the api.
 */
const log = (line: string) => console.log(`demo plant: ${line}`);
const config = readDemoConfig(process.env);
const RETRY_MS = 30_000;

/** The demo loops with the version active now; waits while the database has none yet. */
async function loadDemoLoops(): Promise<ActiveModel[]> {
  const db = knexFactory({ client: 'pg', connection: config.databaseUrl, pool: { min: 0, max: 1 } });
  try {
    for (;;) {
      const tags = new Set(QUILLMERE_PROFILES.map((p) => p.tag));
      const loops = (await loadActiveModels(db, log)).filter((loop) => tags.has(loop.loopTag));
      if (loops.length) return loops;
      log(`no demo loop (${[...tags].join(', ')}) has an active version; looking again in ${RETRY_MS / 1000} s`);
      await new Promise((resolve) => setTimeout(resolve, RETRY_MS));
    }
  } finally {
    await db.destroy();
  }
}

const loops = await loadDemoLoops();
const poster = createReadingPoster({ apiUrl: config.apiUrl, token: config.token, log });
const plant = createDemoPlant({ loops, poster, speed: config.speed, seed: config.seed, log });
plant.start();
log(`posting readings of ${plant.tags.join(', ')} to ${config.apiUrl}`);

let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  // the last readings get a moment to go out, not longer: the supervisor is waiting
  void Promise.race([plant.stop(), new Promise((resolve) => setTimeout(resolve, 2000))]).finally(() => process.exit(0));
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
