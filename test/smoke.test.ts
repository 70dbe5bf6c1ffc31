import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';

describe('project skeleton', () => {
  it('has an engine version string', () => {
    expect(ENGINE_VERSION).toMatch(/^tendril-engine\/\d+$/);
  });
});
