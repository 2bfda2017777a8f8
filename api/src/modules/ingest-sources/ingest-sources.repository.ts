import type { Db } from '../../db/knex.js';
import { createTtlCache } from '../../lib/ttl-cache.js';
import { hashToken } from '../access-tokens/token-secret.js';

type Raw = {
  id: string;
  name: string;
  description: string;
  token_prefix: string;
  created_at: Date;
  last_used_at: Date | null;
  revoked_at: Date | null;
  loops: { id: string; tag: string }[] | null;
};

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const toSource = (r: Raw) => ({
  id: r.id,
  name: r.name,
  description: r.description,
  prefix: r.token_prefix,
  loops: r.loops ?? [],
  createdAt: r.created_at.toISOString(),
  lastUsedAt: iso(r.last_used_at),
  revokedAt: iso(r.revoked_at),
});
export type IngestSourceRow = ReturnType<typeof toSource>;

function selectSources(db: Db) {
  return db('ingest_sources as s').select(
    's.*',
    db.raw(`(
    SELECT json_agg(json_build_object('id', l.id, 'tag', l.tag) ORDER BY l.tag)
    FROM ingest_source_loops sl JOIN loops l ON l.id = sl.loop_id WHERE sl.source_id = s.id) AS loops`),
  );
}

export async function listSourceRows(db: Db): Promise<IngestSourceRow[]> {
  return ((await selectSources(db).orderBy('s.name')) as Raw[]).map(toSource);
}

export async function findSourceRow(db: Db, id: string): Promise<IngestSourceRow | undefined> {
  const row = (await selectSources(db).where('s.id', id).first()) as Raw | undefined;
  return row && toSource(row);
}

export async function insertSource(
  db: Db,
  row: { name: string; description: string; prefix: string; hash: string; createdBy: string },
) {
  const [inserted] = await db('ingest_sources')
    .insert({
      name: row.name,
      description: row.description,
      token_prefix: row.prefix,
      token_hash: row.hash,
      created_by: row.createdBy,
    })
    .returning<{ id: string }[]>('id');
  return inserted.id;
}

export async function replaceSourceLoops(db: Db, sourceId: string, loopIds: string[]): Promise<void> {
  await db('ingest_source_loops').where({ source_id: sourceId }).delete();
  if (loopIds.length)
    await db('ingest_source_loops').insert(loopIds.map((loopId) => ({ source_id: sourceId, loop_id: loopId })));
}

export async function revokeSource(db: Db, id: string): Promise<void> {
  await db('ingest_sources').where({ id }).whereNull('revoked_at').update({ revoked_at: db.fn.now() });
}

/** Loop ids among `ids` that do not exist. */
export async function unknownLoopIds(db: Db, ids: string[]): Promise<string[]> {
  if (!ids.length) return [];
  const found = new Set((await db('loops').whereIn('id', ids).pluck('id')) as string[]);
  return ids.filter((id) => !found.has(id));
}

const USE_RECORDED_EVERY_MS = 60_000;
/**
 * A bridge posts many times a second: its token and its loops are looked up at most once a minute
 * per api process. A revocation or a change of loops clears the cache of every api process when it
 * commits (a cache notice, api/src/lib/cache-notice.ts); the time limit is the safety net.
 */
export const INGEST_LOOKUP_TTL_MS = 60_000;
const tokens = createTtlCache<string, { sourceId: string; name: string }>(INGEST_LOOKUP_TTL_MS);
const scopes = createTtlCache<string, true>(INGEST_LOOKUP_TTL_MS, 100_000);

/** Bumped by every forget: a look-up that started before a revocation does not refill the cache. */
let lookupGeneration = 0;

export function forgetIngestLookups(): void {
  lookupGeneration += 1;
  tokens.clear();
  scopes.clear();
  pendingLookups.clear();
}

/** Look-ups under way, by token hash: a burst of posts with one token reads and records it once. */
const pendingLookups = new Map<string, Promise<{ sourceId: string; name: string } | undefined>>();

/** Resolves a presented ingest token to its source, or undefined when unknown or revoked; records its use once a minute. */
export async function useIngestToken(db: Db, token: string): Promise<{ sourceId: string; name: string } | undefined> {
  const hash = hashToken(token);
  const known = tokens.get(hash);
  if (known) return known;
  let pending = pendingLookups.get(hash);
  if (!pending) {
    const lookup = lookUpIngestToken(db, hash).finally(() => {
      // a forget may have started a newer look-up of the same token meanwhile: leave that one
      if (pendingLookups.get(hash) === lookup) pendingLookups.delete(hash);
    });
    pendingLookups.set(hash, lookup);
    pending = lookup;
  }
  return pending;
}

async function lookUpIngestToken(db: Db, hash: string): Promise<{ sourceId: string; name: string } | undefined> {
  const generation = lookupGeneration;
  const row = (await db('ingest_sources')
    .where({ token_hash: hash })
    .whereNull('revoked_at')
    .first('id', 'name', 'last_used_at')) as { id: string; name: string; last_used_at: Date | null } | undefined;
  if (!row) return undefined;
  if (!row.last_used_at || Date.now() - row.last_used_at.getTime() > USE_RECORDED_EVERY_MS) {
    await db('ingest_sources').where({ id: row.id }).update({ last_used_at: db.fn.now() });
  }
  const source = { sourceId: row.id, name: row.name };
  if (generation === lookupGeneration) tokens.set(hash, source);
  return source;
}

export async function sourceCoversLoop(db: Db, sourceId: string, loopId: string): Promise<boolean> {
  const key = `${sourceId}:${loopId}`;
  if (scopes.get(key)) return true;
  const covered = Boolean(
    await db('ingest_source_loops').where({ source_id: sourceId, loop_id: loopId }).first('loop_id'),
  );
  if (covered) scopes.set(key, true);
  return covered;
}
