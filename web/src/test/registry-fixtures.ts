import { analyzeModel } from '@shadowloop/simulator/engine';
import type { Loop } from '@shadowloop/api/contracts';
import type { Version } from '../features/models/types';

const signal = (name: string, unit: string) => ({ name, unit });

export function fakeLoop(overrides: Partial<Loop> = {}): Loop {
  return {
    id: '11111111-1111-4111-8111-111111111111',
    tag: 'DIG-TEMP-301',
    name: 'Digester heating',
    area: 'digestion',
    areaName: 'Digestion',
    description: '',
    samplePeriodS: 10,
    inputs: [signal('hot-water valve', '%')],
    states: [signal('sludge temperature', '°C'), signal('water temperature', '°C'), signal('wall temperature', '°C')],
    outputs: [signal('sludge temperature', '°C')],
    operatingPoint: {},
    timeZone: 'Europe/London',
    status: 'no_twin',
    lastReadingAt: null,
    worstBandFraction: null,
    activeVersionId: null,
    maintenance: false,
    activeVersionNumber: null,
    draftCount: 0,
    inReviewCount: 0,
    createdAt: '2025-03-01T08:00:00Z',
    updatedAt: '2025-03-01T08:00:00Z',
    ...overrides,
  };
}

export const DIGESTER_MODEL = {
  A: [
    [0.98, 0.015, 0.004],
    [0.02, 0.95, 0],
    [0.01, 0, 0.97],
  ],
  B: [[0], [0.05], [0]],
  C: [[1, 0, 0]],
};

export function fakeVersion(overrides: Partial<Version> = {}): Version {
  const analysis = analyzeModel({ ...DIGESTER_MODEL, samplePeriodS: 10 }, { stepSamples: 200 });
  return {
    id: '22222222-2222-4222-8222-222222222222',
    loopId: fakeLoop().id,
    number: 1,
    status: 'draft',
    ...DIGESTER_MODEL,
    D: null,
    continuous: null,
    correction: { mode: 'free_run', Q: null, R: null, K: null, P: null },
    changeNote: 'First fit from the March step tests.',
    justification: null,
    analysis,
    author: { email: 'engineer@quillmere.example', name: 'Tobias Renner' },
    reviewer: null,
    reviewNote: null,
    rejectReason: null,
    activatedBy: null,
    createdAt: '2025-03-02T09:00:00Z',
    submittedAt: null,
    reviewedAt: null,
    activatedAt: null,
    retiredAt: null,
    ...overrides,
  };
}
