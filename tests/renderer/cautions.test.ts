import { describe, expect, it } from 'vitest';
import { cautionsFor, cautionsOfAll } from '../../src-renderer/lib/verdict/cautions';

describe('cautions beside an over finding', () => {
  it('names fire for lithium packs over their rating, and heat in wires and connectors', () => {
    expect(cautionsFor({ rule: 'battery-burst', status: 'over', unit: 'A' }, true)).toEqual(['fire', 'heat']);
  });

  it('leaves fire out for NiMH packs', () => {
    expect(cautionsFor({ rule: 'battery-continuous', status: 'over', unit: 'A' }, false)).toEqual(['heat']);
  });

  it('names injury for a propeller tip too fast, and over-voltage for voltage rules', () => {
    expect(cautionsFor({ rule: 'prop-tip-speed', status: 'over', unit: 'm/s' }, true)).toEqual(['propeller']);
    expect(cautionsFor({ rule: 'controller-voltage', status: 'over', unit: 'V' }, true)).toEqual(['voltage']);
    expect(cautionsFor({ rule: 'class-max-amps', status: 'over', unit: 'A' }, true)).toEqual(['heat']);
  });

  it('says nothing unless the finding is over', () => {
    for (const status of ['tight', 'clear', 'incomplete'] as const) expect(cautionsFor({ rule: 'battery-burst', status, unit: 'A' }, true)).toEqual([]);
  });

  it('lists each caution once for a set of findings', () => {
    const all = cautionsOfAll(
      [
        { rule: 'battery-burst', status: 'over', unit: 'A' },
        { rule: 'motor-current', status: 'over', unit: 'A' },
        { rule: 'prop-tip-speed', status: 'over', unit: 'm/s' },
      ],
      true,
    );
    expect(all).toEqual(['fire', 'heat', 'propeller']);
  });
});
