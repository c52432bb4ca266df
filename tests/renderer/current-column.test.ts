import { describe, expect, it } from 'vitest';
import { currentCell, currentLevel, ruleBasis } from '../../src-renderer/lib/builds/current-column';

const row = (over: Partial<Parameters<typeof currentCell>[0]>) => ({
  peakCurrentA: 96,
  peakCurrentLimitA: 120,
  currentRule: 'controller-burst',
  currentSource: 'model' as const,
  status: 'tight' as const,
  ...over,
});

describe("the builds list's current column", () => {
  it('says which current each built-in current rule judges and whose rating the limit is (DESIGN rule table)', () => {
    expect(ruleBasis('battery-continuous')).toMatchObject({ basis: 'continuous', whose: 'pack' });
    expect(ruleBasis('battery-burst')).toMatchObject({ basis: 'peak', whose: 'pack' });
    expect(ruleBasis('controller-continuous')).toMatchObject({ basis: 'continuous', whose: 'controller' });
    expect(ruleBasis('controller-burst')).toMatchObject({ basis: 'peak', whose: 'controller' });
    expect(ruleBasis('motor-current')).toMatchObject({ basis: 'peak', whose: 'motor' });
    expect(ruleBasis('class-max-continuous-current')).toMatchObject({ basis: 'continuous', whose: 'class' });
    expect(ruleBasis(null)).toMatchObject({ basis: 'peak', whose: 'no limit' });
  });

  it('shows the pair with its tag, and says measured where the current was logged', () => {
    expect(currentCell(row({}))).toMatchObject({ figures: '96 A / 120 A', tag: 'peak · controller' });
    expect(currentCell(row({ currentRule: 'battery-continuous', currentSource: 'measured' })).tag).toBe('cont. · pack · measured');
    expect(currentCell(row({ peakCurrentLimitA: null, currentRule: null })).figures).toBe('96 A');
    expect(currentCell(row({ peakCurrentA: null })).figures).toBe('–');
  });

  it('marks past and near in words; near only where the verdict agrees', () => {
    // 121 of 120 A passes the limit whatever the threshold.
    expect(currentLevel(row({ peakCurrentA: 121, status: 'over' }))).toBe('past');
    // 110 of 120 A is 92 %: under a 15 % margin (common practice default threshold).
    expect(currentLevel(row({ peakCurrentA: 110, status: 'tight' }))).toBe('near');
    expect(currentLevel(row({ peakCurrentA: 110, status: 'clear' }))).toBe('');
    expect(currentLevel(row({ peakCurrentA: 60 }))).toBe('');
    expect(currentCell(row({ peakCurrentA: 121, status: 'over' })).title).toContain('past its limit');
  });
});
