import { describe, expect, it } from 'vitest';
import { propertySeed } from './property-seed';

describe('the seed of property and fuzz tests', () => {
  it('is fixed unless asked: a repeated npm test explores the same cases', () => {
    expect(propertySeed({})).toBe(propertySeed({ RIGBOOK_FUZZ_SEED: '' }));
    expect(propertySeed({ RIGBOOK_FUZZ_SEED: '1975069352' })).toBe(1975069352);
  });

  it('draws a fresh one when asked for random', () => {
    const drawn = new Set(Array.from({ length: 20 }, () => propertySeed({ RIGBOOK_FUZZ_SEED: 'random' })));
    expect(drawn.size).toBeGreaterThan(1);
    for (const s of drawn) expect(Number.isInteger(s) && s >= 0 && s < 2 ** 31).toBe(true);
  });
});
