import type { Knex } from 'knex';

/** A loop this process holds, with the settings the stepping needs. */
export interface LeasedLoop {
  loopId: string;
  samplePeriodS: number;
  staleAfterSamples: number;
}

export interface LeaseTerms {
  /** A lease lasts this many sample periods of its loop… */
  ttlSamples: number;
  /** …and never less than this, so that renewing every second keeps even fast loops. */
  minTtlMs: number;
  /** At most this many loops per process. */
  maxLoops: number;
  /** Only loops of these plant areas; every area when null. */
  areas: string[] | null;
}

/** The lease length of a loop in milliseconds (the SQL below computes the same). */
export const leaseTtlMs = (terms: LeaseTerms, samplePeriodS: number) =>
  Math.max(terms.minTtlMs, terms.ttlSamples * samplePeriodS * 1000);

/**
 * Claims and renews in one statement: every loop with an active version whose lease is free,
 * expired or already ours is (re)leased to `holder`. Two processes racing for one loop both reach
 * the ON CONFLICT branch on the same row; its WHERE is re-checked against the row the winner just
 * wrote, so exactly one of them gets it. Loops already held come first when `maxLoops` bites.
 */
export async function claimLeases(db: Knex, holder: string, terms: LeaseTerms): Promise<LeasedLoop[]> {
  const result = await db.raw<{ rows: { loop_id: string; sample_period_s: number; stale_after_samples: number }[] }>(
    `WITH wanted AS (
       SELECT l.id, l.sample_period_s, l.stale_after_samples
       FROM loops l
       LEFT JOIN loop_leases held ON held.loop_id = l.id
       WHERE EXISTS (SELECT 1 FROM model_versions v WHERE v.loop_id = l.id AND v.status = 'active')
         AND (held.loop_id IS NULL OR held.holder = :holder OR held.expires_at <= now())
         AND (CAST(:areas AS text[]) IS NULL OR l.area_id = ANY(CAST(:areas AS text[])))
       ORDER BY (held.holder IS NOT DISTINCT FROM :holder) DESC, l.id
       LIMIT :maxLoops
     ), taken AS (
       INSERT INTO loop_leases (loop_id, holder, expires_at)
       SELECT id, :holder, now() + make_interval(secs => greatest(:minTtlS, :ttlSamples * sample_period_s)) FROM wanted
       ON CONFLICT (loop_id) DO UPDATE SET holder = EXCLUDED.holder, expires_at = EXCLUDED.expires_at
         WHERE loop_leases.holder = EXCLUDED.holder OR loop_leases.expires_at <= now()
       RETURNING loop_id
     )
     SELECT w.id AS loop_id, w.sample_period_s, w.stale_after_samples FROM taken t JOIN wanted w ON w.id = t.loop_id`,
    {
      holder,
      maxLoops: terms.maxLoops,
      minTtlS: terms.minTtlMs / 1000,
      ttlSamples: terms.ttlSamples,
      areas: terms.areas,
    },
  );
  return result.rows.map((r) => ({
    loopId: r.loop_id,
    samplePeriodS: r.sample_period_s,
    staleAfterSamples: r.stale_after_samples,
  }));
}

/** Gives up this holder's leases: all of them, or all but `keep`. */
export async function releaseLeases(db: Knex, holder: string, keep: string[] = []): Promise<number> {
  const query = db('loop_leases').where({ holder });
  if (keep.length) query.whereRaw('loop_id <> ALL(?::uuid[])', [`{${keep.join(',')}}`]);
  return query.delete();
}
