import type { AlertDetail, AlertRuleKind } from '../../contracts/alerts.js';

export type AlertMailReason = 'raised' | 'reactivated' | 'shelve_expired' | 'escalated_secondary' | 'escalated_area';

/** What a message says about its alert (read from alerts, loops and areas). */
export interface AlertForMail {
  id: string;
  number: number;
  loopTag: string;
  loopName: string;
  areaName: string;
  timeZone: string;
  ruleKind: AlertRuleKind;
  ruleVersion: number | null;
  priority: number;
  /** The latest raise (first raise or re-raise). */
  raisedAt: Date;
  activations: number;
  summary: string;
  detail: AlertDetail;
  hint: string | null;
}

export interface AlertMailInput {
  reason: AlertMailReason;
  alert: AlertForMail;
  /** Why this person gets it when it is not the obvious one (nobody on call, no area engineers). */
  audienceNote: string | null;
  alertUrl: string;
  /** Only for people who may acknowledge (the on-call role). */
  ack: { url: string; expiresAt: Date } | null;
  now: Date;
}

/** DESIGN.md §9: in every alert e-mail. */
export const MAIL_CAUTION = [
  "Shadowloop is an advisory monitoring tool. It is not a safety instrumented system and does not replace the plant's alarm system, interlocks or operating procedures.",
  "Act on this alert only within the site's procedures; model changes go through the site's management-of-change process and are reviewed by a qualified control engineer.",
].join('\n');

const RULE_LABELS: Record<AlertRuleKind, string> = {
  band: 'band rule',
  cusum: 'CUSUM rule',
  nis: 'NIS rule (chi-square on the innovation)',
  stale: 'stale rule',
  model: 'model warning',
};

const WHAT: Record<AlertRuleKind, string> = {
  band: 'diverged',
  cusum: 'diverged',
  nis: 'diverged',
  stale: 'has no fresh readings',
  model: 'has an unstable active model',
};

const SUBJECT_PREFIX: Record<AlertMailReason, string> = {
  raised: '',
  reactivated: 'Again: ',
  shelve_expired: 'Shelve ended: ',
  escalated_secondary: 'Escalated: ',
  escalated_area: 'Escalated to area: ',
};

export function alertMailSubject(reason: AlertMailReason, alert: AlertForMail): string {
  const rule = RULE_LABELS[alert.ruleKind].replace(/ \(.*\)$/, '');
  return `[Shadowloop P${alert.priority}] ${SUBJECT_PREFIX[reason]}${alert.loopTag} ${WHAT[alert.ruleKind]} — ${rule}`;
}

/** Four significant figures with the unit, "—" when there is no value. */
export function withUnit(value: number | null | undefined, unit: string): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const shown = String(Number.parseFloat(value.toPrecision(4)));
  return unit ? `${shown} ${unit}` : shown;
}

/** "2026-12-02 11:15 Europe/London", or null when the zone is unknown to this runtime. */
export function plantTime(at: Date, timeZone: string): string | null {
  try {
    const parts = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
    }).formatToParts(at);
    const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
    return `${part('year')}-${part('month')}-${part('day')} ${part('hour')}:${part('minute')} ${timeZone}`;
  } catch {
    return null;
  }
}

const isoMinute = (at: Date) => `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

function opening(input: AlertMailInput): string[] {
  const { reason, alert, now } = input;
  const minutes = Math.max(0, Math.round((now.getTime() - alert.raisedAt.getTime()) / 60_000));
  const lines: Record<AlertMailReason, string> = {
    raised: `${alert.loopTag} stopped behaving like its model.`,
    reactivated: `${alert.loopTag} diverged again (raise ${alert.activations} of this alert).`,
    shelve_expired: 'The shelve of this alert has ended and nobody has acknowledged it yet.',
    escalated_secondary: `Nobody has acknowledged this alert in ${minutes} min; it comes to you as the secondary on call.`,
    escalated_area: `Nobody has acknowledged this alert in ${minutes} min; it comes to you as an engineer of ${alert.areaName}.`,
  };
  return [lines[reason], ...(input.audienceNote ? [input.audienceNote] : [])];
}

function signalLines(detail: AlertDetail): string[] {
  const lines = (detail.signals ?? []).map((s) => {
    const limit = s.limit === undefined || s.limit === null ? '' : `, limit ${withUnit(s.limit, s.unit)}`;
    return `  ${s.name}: measured ${withUnit(s.measured, s.unit)}, predicted ${withUnit(s.predicted, s.unit)}, residual ${withUnit(s.residual, s.unit)}${limit}`;
  });
  if (detail.statistic)
    lines.push(`  ${detail.statistic}: ${withUnit(detail.value, '')} (limit ${withUnit(detail.limit, '')})`);
  return lines.length ? ['Signals at the raise', ...lines] : [];
}

function actionLines(input: AlertMailInput): string[] {
  const lines = ['Open the alert:', `  ${input.alertUrl}`];
  if (input.ack) {
    lines.push(
      'Acknowledge with one click (works once; asks you to sign in first if needed):',
      `  ${input.ack.url}`,
      `  The link expires at ${isoMinute(input.ack.expiresAt)}.`,
    );
  } else {
    lines.push('Acknowledging needs the on-call role: ask the person on call, or open the alert to follow it.');
  }
  return lines;
}

/** The plain-text message for one recipient. */
export function composeAlertMail(input: AlertMailInput): { subject: string; text: string } {
  const { alert } = input;
  const local = plantTime(alert.raisedAt, alert.timeZone);
  const rule = `${RULE_LABELS[alert.ruleKind]}${alert.ruleVersion === null ? '' : ` (version ${alert.ruleVersion})`}`;
  const blocks = [
    opening(input),
    [
      `Loop:     ${alert.loopTag} — ${alert.loopName}`,
      `Area:     ${alert.areaName}`,
      `Rule:     ${rule}, priority ${alert.priority}`,
      `When:     ${isoMinute(alert.raisedAt)}${local ? ` (${local}, plant time)` : ''}`,
      `Alert:    #${alert.number}`,
    ],
    ['What happened', `  ${alert.summary}`],
    signalLines(alert.detail),
    alert.hint ? ['Where the residual points', `  ${alert.hint}`] : [],
    actionLines(input),
    [MAIL_CAUTION],
  ];
  return {
    subject: alertMailSubject(input.reason, alert),
    text: `${blocks
      .filter((b) => b.length)
      .map((b) => b.join('\n'))
      .join('\n\n')}\n`,
  };
}
