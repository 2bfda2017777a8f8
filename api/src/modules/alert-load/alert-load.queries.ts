import type { AlertLoad } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import type { WindowCount } from './flood-merge.js';
import type { LoadRange } from './load-range.js';

/**
 * The alert-load figures, counted in PostgreSQL from the alert timeline. An activation is an
 * annunciation in ISA-18.2's sense: an alert's `raised` event or a `reactivated` one after it
 * cleared. Periods are half-open, [from, to).
 */
const ACTIVATION = `e.kind IN ('raised', 'reactivated')`;
const FROM = 'CAST(? AS timestamptz)';
const TO = 'CAST(? AS timestamptz)';
/** Chattering (ISA-18.2): the same alert back within this long of clearing. */
export const CHATTER_WINDOW_S = 60;
/** Stale, or standing (EEMUA 191): active for longer than this. */
export const STALE_AFTER_H = 24;
/** The report lists at most this many chattering and stale alerts, worst first. */
export const LIST_LIMIT = 100;

type Rows<T> = { rows: T[] };

/** Activations per UTC calendar day, every day the range touches (zeros included). */
export async function activationsPerDay(db: Db, { from, to }: LoadRange): Promise<AlertLoad['perDay']> {
  const { rows } = (await db.raw(
    `SELECT to_char(d.day, 'YYYY-MM-DD') AS day, count(e.id)::int AS count
     FROM generate_series(date_trunc('day', ${FROM} AT TIME ZONE 'UTC'),
                          (${TO} - interval '1 microsecond') AT TIME ZONE 'UTC', interval '1 day') AS d(day)
     LEFT JOIN alert_events e ON ${ACTIVATION}
       AND e.at >= greatest(d.day AT TIME ZONE 'UTC', ${FROM})
       AND e.at < least((d.day + interval '1 day') AT TIME ZONE 'UTC', ${TO})
     GROUP BY d.day ORDER BY d.day`,
    [from, to, from, to],
  )) as Rows<{ day: string; count: number }>;
  return rows;
}

/** Activations per clock-aligned 10-minute window (date_bin from 2000-01-01 UTC); windows with none are left out. */
export async function activationsPer10Min(db: Db, { from, to }: LoadRange): Promise<WindowCount[]> {
  const { rows } = (await db.raw(
    `SELECT date_bin('10 minutes', e.at, TIMESTAMPTZ '2000-01-01 00:00:00+00') AS start, count(*)::int AS count
     FROM alert_events e WHERE ${ACTIVATION} AND e.at >= ${FROM} AND e.at < ${TO}
     GROUP BY 1 ORDER BY 1`,
    [from, to],
  )) as Rows<{ start: Date; count: number }>;
  return rows.map((r) => ({ start: r.start.toISOString(), count: r.count }));
}

/** The ten loops with the most activations (ties by tag). */
export async function topLoops(db: Db, { from, to }: LoadRange): Promise<AlertLoad['topLoops']> {
  const { rows } = (await db.raw(
    `SELECT a.loop_id AS "loopId", l.tag AS "loopTag", l.name AS "loopName", count(*)::int AS count
     FROM alert_events e JOIN alerts a ON a.id = e.alert_id JOIN loops l ON l.id = a.loop_id
     WHERE ${ACTIVATION} AND e.at >= ${FROM} AND e.at < ${TO}
     GROUP BY a.loop_id, l.tag, l.name ORDER BY count DESC, l.tag LIMIT 10`,
    [from, to],
  )) as Rows<AlertLoad['topLoops'][number]>;
  return rows;
}

/**
 * Chattering alerts: per alert, the activations in the range that came within 60 s of the same
 * alert's previous `cleared` event (the event just before them on its timeline).
 */
export async function chatteringAlerts(db: Db, { from, to }: LoadRange): Promise<AlertLoad['chattering']> {
  const { rows } = (await db.raw(
    `WITH timeline AS (
       SELECT e.alert_id, e.kind, e.at,
              lag(e.kind) OVER w AS prev_kind, lag(e.at) OVER w AS prev_at
       FROM alert_events e
       WHERE e.kind IN ('raised', 'reactivated', 'cleared')
         AND e.at >= ${FROM} - make_interval(secs => ?) AND e.at < ${TO}
       WINDOW w AS (PARTITION BY e.alert_id ORDER BY e.at, e.id))
     SELECT t.alert_id AS "alertId", l.tag AS "loopTag", a.rule_kind AS rule, count(*)::int AS repeats
     FROM timeline t JOIN alerts a ON a.id = t.alert_id JOIN loops l ON l.id = a.loop_id
     WHERE t.kind <> 'cleared' AND t.at >= ${FROM}
       AND t.prev_kind = 'cleared' AND t.at - t.prev_at <= make_interval(secs => ?)
     GROUP BY t.alert_id, l.tag, a.rule_kind ORDER BY repeats DESC, l.tag LIMIT ${LIST_LIMIT}`,
    [from, CHATTER_WINDOW_S, to, from, CHATTER_WINDOW_S],
  )) as Rows<AlertLoad['chattering'][number]>;
  return rows;
}

/**
 * Stale alerts at `asOf`: not closed by then, last activated more than 24 h before it, and not
 * cleared or closed since that activation. Read from the timeline, so a past period shows what
 * was stale at its end.
 */
export async function staleAlerts(db: Db, asOf: Date): Promise<AlertLoad['stale']> {
  const { rows } = (await db.raw(
    `SELECT a.id AS "alertId", l.tag AS "loopTag", a.rule_kind AS rule, last.at AS "raisedAt",
            extract(epoch FROM (CAST(:asOf AS timestamptz) - last.at)) / 3600 AS hours
     FROM alerts a JOIN loops l ON l.id = a.loop_id
     CROSS JOIN LATERAL (
       SELECT e.at FROM alert_events e
       WHERE e.alert_id = a.id AND ${ACTIVATION} AND e.at <= CAST(:asOf AS timestamptz)
       ORDER BY e.at DESC, e.id DESC LIMIT 1) AS last
     WHERE (a.closed_at IS NULL OR a.closed_at > CAST(:asOf AS timestamptz))
       AND last.at < CAST(:asOf AS timestamptz) - make_interval(hours => :staleH)
       AND NOT EXISTS (
         SELECT 1 FROM alert_events c WHERE c.alert_id = a.id AND c.kind IN ('cleared', 'closed')
           AND c.at > last.at AND c.at <= CAST(:asOf AS timestamptz))
     ORDER BY last.at, l.tag LIMIT ${LIST_LIMIT}`,
    { asOf, staleH: STALE_AFTER_H },
  )) as Rows<{
    alertId: string;
    loopTag: string;
    rule: AlertLoad['stale'][number]['rule'];
    raisedAt: Date;
    hours: string;
  }>;
  return rows.map((r) => ({ ...r, raisedAt: r.raisedAt.toISOString(), hours: Number(r.hours) }));
}

/**
 * Mean time to acknowledge: over the alerts raised in the range that have been acknowledged, the
 * time from the `raised` event to the alert's first `acknowledged` event after it.
 */
export async function meanTimeToAcknowledge(
  db: Db,
  { from, to }: LoadRange,
): Promise<{ meanS: number | null; alerts: number }> {
  const { rows } = (await db.raw(
    `SELECT avg(extract(epoch FROM (ack.at - e.at))) AS mean_s, count(ack.at)::int AS alerts
     FROM alert_events e
     CROSS JOIN LATERAL (
       SELECT min(k.at) AS at FROM alert_events k
       WHERE k.alert_id = e.alert_id AND k.kind = 'acknowledged' AND k.at >= e.at) AS ack
     WHERE e.kind = 'raised' AND e.at >= ${FROM} AND e.at < ${TO} AND ack.at IS NOT NULL`,
    [from, to],
  )) as Rows<{ mean_s: string | null; alerts: number }>;
  const [row] = rows;
  return { meanS: row.mean_s === null ? null : Number(row.mean_s), alerts: row.alerts };
}
