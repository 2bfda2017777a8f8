import type { Alert, AlertWithEvents } from '@shadowloop/api/contracts';

export const AERATION_LOOP_ID = '33333333-3333-4333-8333-333333333333';

let counter = 0;

/** An alert as GET /api/v1/alerts answers it: a band alert on the aeration DO loop, waiting. */
export function fakeAlert(overrides: Partial<Alert> = {}): Alert {
  counter += 1;
  const number = overrides.number ?? 100 + counter;
  return {
    id: `aaaaaaaa-aaaa-4aaa-8aaa-${String(number).padStart(12, '0')}`,
    number,
    loopId: AERATION_LOOP_ID,
    loopTag: 'AER-DO-101',
    loopName: 'Aeration basin dissolved oxygen',
    area: 'aeration',
    rule: 'band',
    ruleId: null,
    ruleVersion: 2,
    priority: 2,
    state: 'unacknowledged',
    active: true,
    raisedAt: '2025-06-03T09:15:00Z',
    activeSince: overrides.raisedAt ?? '2025-06-03T09:15:00Z',
    clearedAt: null,
    activations: 1,
    acknowledgedAt: null,
    acknowledgedBy: null,
    shelvedUntil: null,
    shelveReason: null,
    closedAt: null,
    closedBy: null,
    closeCause: null,
    closeNote: null,
    summary: 'Dissolved oxygen read 0.6 mg/L above the twin for 3 samples in a row.',
    detail: {
      statistic: '|residual| / limit',
      value: 1.4,
      limit: 1,
      signals: [{ name: 'dissolved oxygen', unit: 'mg/L', measured: 2.6, predicted: 2.0, residual: 0.6, limit: 0.43 }],
      slotAt: '2025-06-03T09:15:00Z',
    },
    direction: {
      signals: [{ index: 0, name: 'dissolved oxygen', unit: 'mg/L', share: 1, residual: 0.6 }],
      modes: [
        { eigenvalue: { re: 0.95, im: 0 }, share: 0.8 },
        { eigenvalue: { re: 0.5, im: 0 }, share: 0.2 },
      ],
      points: 'sensor',
      hint: 'One output drifts alone: check its transmitter first.',
    },
    escalationLevel: 0,
    updatedAt: '2025-06-03T09:15:00Z',
    ...overrides,
  };
}

export function withEvents(alert: Alert, events: AlertWithEvents['events'] = []): AlertWithEvents {
  return {
    ...alert,
    events: events.length
      ? events
      : [
          {
            id: 1,
            at: alert.raisedAt,
            kind: 'raised',
            actor: null,
            fromState: null,
            toState: 'unacknowledged',
            note: null,
            details: {},
          },
          {
            id: 2,
            at: alert.raisedAt,
            kind: 'notified',
            actor: null,
            fromState: null,
            toState: null,
            note: null,
            details: { to: 'oncall@quillmere.example', reason: 'raised' },
          },
        ],
  };
}
