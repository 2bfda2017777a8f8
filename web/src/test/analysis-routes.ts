import { analyzeModel } from '@shadowloop/simulator/engine';
import type { Version } from '../features/models/types';
import { signedInAs, type FakeRoutes } from './fake-api';
import { fakeLoop } from './registry-fixtures';

export const LOOP = fakeLoop();
const EXPLORED = {
  k: 10,
  Ak: [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ],
  trajectory: [
    [1, 0, 0],
    [0.98, 0.02, 0.01],
  ],
  modal: null,
  modalError: 'A is defective',
};

function engineerAs(email: string) {
  const routes = signedInAs(['engineer'], email === 'engineer@quillmere.example' ? 'Tobias Renner' : 'Priya Hallam');
  return { ...routes, 'GET /api/v1/me': { body: { id: 'u1', email, name: 'Someone', roles: ['engineer'] } } };
}

/** The api of one loop and one version, as an engineer with this e-mail sees it. */
export function analysisRoutes(version: Version, email: string, extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...engineerAs(email),
    [`GET /api/v1/loops/${LOOP.id}`]: { body: LOOP },
    [`GET /api/v1/model-versions/${version.id}`]: { body: version },
    [`GET /api/v1/model-versions/${version.id}/evidence`]: { body: [] },
    [`GET /api/v1/loops/${LOOP.id}/backtests`]: { body: [] },
    [`POST /api/v1/model-versions/${version.id}/explore`]: { body: EXPLORED },
    [`GET /api/v1/model-versions/${version.id}/analysis`]: ({ url }) => {
      const stepSamples = Number(new URL(url, 'http://shadowloop.test').searchParams.get('stepSamples'));
      return {
        body: analyzeModel(
          { A: version.A, B: version.B, C: version.C ?? undefined, samplePeriodS: LOOP.samplePeriodS },
          { stepSamples },
        ),
      };
    },
    ...extra,
  };
}
