import { describe, expect, it } from 'vitest';
import type { AlertEvent } from '@shadowloop/api/contracts';
import { eventDetailWords } from './event-details';

const event = (kind: AlertEvent['kind'], details: Record<string, unknown>): AlertEvent =>
  ({
    id: 1,
    at: '2026-12-02T09:00:00.000Z',
    kind,
    actor: null,
    fromState: null,
    toState: null,
    note: null,
    details,
  }) as AlertEvent;

describe('eventDetailWords', () => {
  it('says which sample a raise was judged on, in plant time, and the rule version, without the model version id', () => {
    const words = eventDetailWords(
      event('raised', {
        slotAt: '2026-12-02T07:11:00.000Z',
        ruleVersion: 1,
        versionId: 'af0f1af8-6756-4ca9-bc98-ed9eddbbf019',
      }),
      'Europe/London',
    );
    expect(words).toBe('judged on the sample of 2026-12-02 07:11:00 GMT · rule version 1');
  });

  it('says who a message went to and why, and how an acknowledgement arrived', () => {
    expect(
      eventDetailWords(
        event('notified', { to: 'admin@quillmere.example', reason: 'escalated_secondary', messageId: '<a@b>' }),
        'UTC',
      ),
    ).toBe('to admin@quillmere.example, for the escalation to the secondary on call');
    expect(eventDetailWords(event('acknowledged', { via: 'mail_link' }), 'UTC')).toBe(
      'with the link in the alert e-mail',
    );
  });

  it('counts the messages an escalation queued and leaves out its internal fields', () => {
    expect(
      eventDetailWords(
        event('escalated', { level: 2, messages: 3, skippedSecondary: true, to: 'escalated_area' }),
        'UTC',
      ),
    ).toBe('3 messages queued');
    expect(eventDetailWords(event('shelved', {}), 'UTC')).toBe('');
  });
});
