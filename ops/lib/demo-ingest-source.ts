import knexFactory from 'knex';
import { newTokenSecret } from '../../api/src/modules/access-tokens/token-secret.js';
import { recordAudit } from '../../api/src/modules/audit/audit.repository.js';
import { INGEST_TOKEN_PREFIX } from '../../api/src/modules/ingest-sources/ingest-sources.service.js';
import { QUILLMERE_PROFILES } from '../../simulator/src/demo-plant/quillmere.js';

export const DEMO_SOURCE_NAME = 'Quillmere demo plant';

/**
 * The ingest source the demo plant posts with: created on the first start, and given a new token
 * on every start (the previous one stops working; only its SHA-256 hash was stored), scoped to the
 * demo loops. Returns the token for the demo plant's environment.
 */
export async function rotateDemoIngestSource(databaseUrl: string): Promise<{ token: string; loops: number }> {
  const db = knexFactory({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 1 } });
  const secret = newTokenSecret(INGEST_TOKEN_PREFIX);
  try {
    return await db.transaction(async (trx) => {
      const [source] = await trx('ingest_sources')
        .insert({
          name: DEMO_SOURCE_NAME,
          description: 'The invented plant that npm start runs for the demo.',
          token_prefix: secret.prefix,
          token_hash: secret.hash,
        })
        .onConflict('name')
        .merge({ token_prefix: secret.prefix, token_hash: secret.hash, revoked_at: null })
        .returning<{ id: string }[]>('id');
      const loopIds = (await trx('loops')
        .whereIn(
          'tag',
          QUILLMERE_PROFILES.map((p) => p.tag),
        )
        .pluck('id')) as string[];
      await trx('ingest_source_loops').where({ source_id: source.id }).delete();
      if (loopIds.length)
        await trx('ingest_source_loops').insert(loopIds.map((loopId) => ({ source_id: source.id, loop_id: loopId })));
      await recordAudit(trx, {
        actor: null,
        action: 'ingest_source.token_rotated',
        targetType: 'ingest_source',
        targetId: source.id,
        details: { name: DEMO_SOURCE_NAME, prefix: secret.prefix, by: 'npm start', loops: loopIds.length },
      });
      return { token: secret.token, loops: loopIds.length };
    });
  } finally {
    await db.destroy();
  }
}
