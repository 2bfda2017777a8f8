import { describe, expect, it } from 'vitest';
import { describeTarget } from './describe-target';

describe('describeTarget', () => {
  it('names registry entries by loop tag and version number', () => {
    expect(describeTarget({ target: 'model_version:9f', details: { loopTag: 'AER-DO-101', versionNumber: 2 } })).toBe(
      'AER-DO-101 · version 2',
    );
    expect(describeTarget({ target: 'loop:1a', details: { loopTag: 'AER-DO-101' } })).toBe('AER-DO-101');
  });

  it('keeps other targets as recorded', () => {
    expect(describeTarget({ target: 'user:u1', details: { roles: ['operator'] } })).toBe('user:u1');
    expect(describeTarget({ target: null, details: null })).toBe('—');
  });
});
