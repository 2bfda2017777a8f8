import type { AlertEvent } from '@shadowloop/api/contracts';
import { formatPlantTime } from '../../../lib/plant-time';

/** Why an alert e-mail went out (api AlertMailReason), in words. */
const MAIL_REASON_WORDS: Record<string, string> = {
  raised: 'the raise',
  reactivated: 'the raise after an acknowledgement',
  shelve_expired: 'the end of the shelf',
  escalated_secondary: 'the escalation to the secondary on call',
  escalated_area: "the escalation to the area's engineers",
};

/** Where an acknowledgement came from. */
const VIA_WORDS: Record<string, string> = {
  app: 'in Shadowloop',
  mail_link: 'with the link in the alert e-mail',
};

const text = (value: unknown) => (typeof value === 'string' && value ? value : null);
const count = (value: unknown) => (typeof value === 'number' && Number.isFinite(value) ? value : null);

/**
 * The details an event carries, as a line of words: the sample a raise or clear was judged on and
 * the rule's version, who an e-mail went to and why, how an acknowledgement arrived, how many
 * messages an escalation queued. Identifiers (model version, message id) stay out: the version is
 * on the alert's facts and message ids are in the mail outbox.
 */
export function eventDetailWords(event: AlertEvent, timeZone: string): string {
  const d = event.details;
  const parts: string[] = [];
  const slotAt = text(d.slotAt);
  if (slotAt) parts.push(`judged on the sample of ${formatPlantTime(Date.parse(slotAt), timeZone, { date: true })}`);
  const ruleVersion = count(d.ruleVersion);
  if (ruleVersion !== null) parts.push(`rule version ${ruleVersion}`);
  const to = text(d.to);
  if (event.kind === 'notified' && to) {
    const reason = text(d.reason);
    parts.push(`to ${to}${reason ? `, for ${MAIL_REASON_WORDS[reason] ?? reason.replaceAll('_', ' ')}` : ''}`);
  }
  if (event.kind === 'escalated') {
    const messages = count(d.messages);
    if (messages !== null) parts.push(messages === 1 ? '1 message queued' : `${messages} messages queued`);
  }
  const via = text(d.via);
  if (via) parts.push(VIA_WORDS[via] ?? via.replaceAll('_', ' '));
  return parts.join(' · ');
}
