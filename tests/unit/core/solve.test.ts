import { describe, expect, it } from 'vitest';
import { findRoot } from '../../../src-main/core/solve';

describe('bracketed root finding', () => {
  // x³ − 2x − 5 = 0 has its real root at 2.0945514815423265 (the classic worked example of
  // Newton's method, from memory).
  it('finds the root of x³ − 2x − 5', () => {
    expect(findRoot((x) => x ** 3 - 2 * x - 5, null, 2, 3, 1e-14)).toBeCloseTo(2.0945514815423265, 12);
  });

  // cos x = x at 0.7390851332151607 (the Dottie number, from memory).
  it('finds the fixed point of cos', () => {
    expect(findRoot((x) => Math.cos(x) - x, null, 0, 1, 1e-14)).toBeCloseTo(0.7390851332151607, 12);
  });

  it('stops after its iteration bound and stays inside the bracket', () => {
    let calls = 0;
    const r = findRoot(
      (x) => {
        calls++;
        return x < 0.3 ? -1 : 1; // a step: no root to converge on, only a sign change
      },
      null,
      0,
      1,
      0,
      40,
    );
    expect(calls).toBeLessThanOrEqual(42);
    expect(r).toBeGreaterThanOrEqual(0);
    expect(r).toBeLessThanOrEqual(1);
  });

  it('returns the better end when the interval holds no sign change', () => {
    expect(findRoot((x) => x + 10, null, 0, 1)).toBe(0);
  });
});
