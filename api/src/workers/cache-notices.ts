import type pg from 'pg';
import type { Logger } from 'pino';
import { CACHE_CHANNEL } from '../lib/cache-notice.js';
import { listenOnChannel } from '../lib/pg-listen.js';
import { forgetRuleSet } from '../modules/drift-rules/rule-set.js';
import { forgetIngestLookups } from '../modules/ingest-sources/ingest-sources.repository.js';
import { forgetLiveLoop } from '../modules/readings/live-loop.js';

/** Forgets the cached entries a notice names (api/src/lib/cache-notice.ts). */
export function applyCacheNotice(payload: string): void {
  try {
    const notice = JSON.parse(payload) as { loopId?: unknown; ingestSources?: unknown };
    if (typeof notice.loopId === 'string') {
      forgetLiveLoop(notice.loopId);
      forgetRuleSet(notice.loopId);
    }
    if (notice.ingestSources === true) forgetIngestLookups();
  } catch {
    // not ours
  }
}

export function listenForCacheNotices(pool: pg.Pool, logger: Logger): { stop(): Promise<void> } {
  return listenOnChannel(pool, CACHE_CHANNEL, applyCacheNotice, logger);
}
