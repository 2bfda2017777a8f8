import type { Knex } from 'knex';

/**
 * The ingest keeps what it looks up on every post (a loop, its drift rules, a bridge's token and
 * scope) in per-process caches. A change that matters to them announces itself here, with a
 * PostgreSQL NOTIFY in its own transaction (delivered only if it commits); every api process then
 * forgets the entries at once (api/src/workers/cache-notices.ts). The caches' time limits remain
 * as a safety net for a notice missed while a listening connection was down.
 */
export const CACHE_CHANNEL = 'shadowloop_cache_changed';

export type CacheNotice = { loopId: string } | { ingestSources: true };

export async function announceCacheChange(db: Knex | Knex.Transaction, notice: CacheNotice): Promise<void> {
  await db.raw('SELECT pg_notify(?, ?)', [CACHE_CHANNEL, JSON.stringify(notice)]);
}
