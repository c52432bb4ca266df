import { describe, expect, it } from 'vitest';
import { BUDGETS, verdictOf, type Figure } from './report';

const figure = (value: number, budget: Figure['budget']): Figure => ({ group: 'g', name: 'n', value, unit: 'ms', budget });

describe('the bench verdict reads the budget as written', () => {
  it('a figure at an "under" bound is not met; one a hair below it is', () => {
    expect(verdictOf(figure(16, BUDGETS.keystroke))).toBe('NOT MET');
    expect(verdictOf(figure(15.9, BUDGETS.keystroke))).toBe('met');
    expect(verdictOf(figure(300, BUDGETS.recheck10k))).toBe('NOT MET');
  });

  it('a figure at an "at most" bound is met; one past it is not', () => {
    expect(verdictOf(figure(1.5, BUDGETS.recheckVsFloor))).toBe('met');
    expect(verdictOf(figure(1.51, BUDGETS.recheckVsFloor))).toBe('NOT MET');
    expect(verdictOf(figure(0.05, BUDGETS.growthPerEdit))).toBe('met');
  });

  it('a figure that could not be measured is not met, and one without a budget has no verdict', () => {
    expect(verdictOf(figure(Number.NaN, BUDGETS.coldStart))).toBe('NOT MET');
    expect(verdictOf(figure(1, undefined))).toBe('');
  });

  it('every budget says in words which kind of bound it is', () => {
    for (const [name, budget] of Object.entries(BUDGETS)) expect(budget.text.startsWith(budget.strict ? '<' : '≤'), name).toBe(true);
  });
});
