import { describe, expect, expectTypeOf, it } from 'vitest';
import { CAUTION_TOPICS } from '../../../src-main/core/catalogue/cautions';
import { FIGURE_KEYS, FIGURES, SOURCE_FIGURES, type FigureKey, type Figures, type SourceFigureKey } from '../../../src-main/core/catalogue/figures';
import { BUILT_IN_RULE_IDS, cautionsFor, RULE_IDS, RULES, ruleName } from '../../../src-main/core/catalogue/rules';
import type { BuildContext } from '../../../src-main/core/domain';
import { battery, controller, motor, quadContext, supplyOf, truckContext } from './fixtures';

// The catalogues are checked against the evaluation itself: a rule judges the figure its
// entry names, and every figure the evaluation fills in has an entry.

/** True only for a type whose keys are a closed list (no `[key: string]` index signature). */
type ClosedKeys<T> = string extends keyof T ? false : true;

describe('figure catalogue', () => {
  it('Figures has no index signature: its keys are the catalogue keys', () => {
    // Fails to compile if Figures regains an open index signature.
    const closed: ClosedKeys<Figures> = true;
    expect(closed).toBe(true);
    expectTypeOf<keyof Figures>().toEqualTypeOf<FigureKey | SourceFigureKey>();
  });

  it('the evaluation fills in exactly the catalogue figures', () => {
    // Ratings entered only where a maker gives them (heat loss, eRPM limit, lead gauge, connector, BEC).
    const rated = {
      motor: motor({ maxLossW: 150 }),
      controller: controller({ maxErpm: 300_000, minVoltageV: 6, becCurrentA: 5 }),
      batteries: new Map([['pack-a', battery({ wireGaugeAwg: 10, connectorRatingA: 90 })]]),
    };
    const quad = quadContext();
    // A receiver and servo load entered on the build, so the BEC check judges it.
    const withLoad = (ctx: BuildContext): BuildContext => ({ ...ctx, build: { ...ctx.build, becLoadA: 2 } });
    for (const ctx of [withLoad(truckContext(rated)), withLoad({ ...quad, ...rated })]) {
      const keys = Object.keys(supplyOf(ctx).figures).sort();
      expect(keys).toEqual([...FIGURE_KEYS, ...Object.keys(SOURCE_FIGURES)].sort());
    }
  });

  it('a figure that belongs to the other kind of vehicle is null', () => {
    const truck = supplyOf(truckContext()).figures;
    const quad = supplyOf(quadContext()).figures;
    for (const key of FIGURE_KEYS) {
      if (FIGURES[key].applies === 'propeller') expect(truck[key], key).toBeNull();
      if (FIGURES[key].applies === 'ground') expect(quad[key], key).toBeNull();
    }
    // And the fixtures are complete enough that the kind's own figures are there.
    expect(truck.loadedTopSpeedKmh).not.toBeNull();
    expect(quad.thrustN).not.toBeNull();
  });

  it('every sheet label says which charge the figure is taken at', () => {
    const words: Record<string, RegExp> = { nominal: /nominal/i, full: /full[- ]charge/i, cutoff: /cut-off/i };
    for (const key of FIGURE_KEYS) {
      const charge = FIGURES[key].charge;
      if (charge !== null) expect(FIGURES[key].label, key).toMatch(words[charge]!);
    }
  });
});

describe('rule catalogue', () => {
  it('every rule has sentences, a short name of its own and a caution topic', () => {
    const names = new Set<string>();
    for (const id of RULE_IDS) {
      const spec = RULES[id];
      if (spec.kind === 'rating') {
        for (const text of [spec.text.what, spec.text.limitName, spec.text.risk, spec.text.fix, spec.text.tightHint]) expect(text.length, id).toBeGreaterThan(0);
      } else if (spec.kind === 'pack') {
        expect(spec.over('Red 4S'), id).toContain('"Red 4S"');
      } else {
        expect(spec.over.length, id).toBeGreaterThan(0);
      }
      expect(spec.name.length, id).toBeGreaterThan(0);
      expect(ruleName(id)).toBe(spec.name);
      names.add(spec.name);
      expect(spec.cautions.length, id).toBeGreaterThan(0);
      for (const topic of spec.cautions) expect(CAUTION_TOPICS, id).toContain(topic);
      expect(spec.limit.length, id).toBeGreaterThan(0);
    }
    expect(names.size).toBe(RULE_IDS.length);
  });

  it('an over finding of every rule calls for a caution, with or without lithium packs', () => {
    for (const id of RULE_IDS) {
      for (const lithium of [true, false]) expect(cautionsFor({ rule: id, status: 'over', unit: '' }, lithium).length, id).toBeGreaterThan(0);
    }
  });

  it('a rating rule judges the figure its entry names, in that figure’s unit', () => {
    // Single-pack builds: a pack's share of the current is the whole supply current.
    const seen = new Set<string>();
    // Ratings entered only where a maker gives them (heat loss, eRPM limit, lead gauge, connector, BEC).
    const rated = {
      motor: motor({ maxLossW: 150 }),
      controller: controller({ maxErpm: 300_000, minVoltageV: 6, becCurrentA: 5 }),
      batteries: new Map([['pack-a', battery({ wireGaugeAwg: 10, connectorRatingA: 90 })]]),
    };
    const quad = quadContext();
    // A receiver and servo load entered on the build, so the BEC check judges it.
    const withLoad = (ctx: BuildContext): BuildContext => ({ ...ctx, build: { ...ctx.build, becLoadA: 2 } });
    for (const ctx of [withLoad(truckContext(rated)), withLoad({ ...quad, ...rated })]) {
      const s = supplyOf(ctx);
      for (const f of s.findings) {
        const id = BUILT_IN_RULE_IDS.find((r) => r === f.rule);
        if (id === undefined) continue;
        const spec = RULES[id];
        if (spec.kind !== 'rating') continue;
        expect(f.unit, id).toBe(FIGURES[spec.figure].unit);
        expect(f.value, id).not.toBeNull();
        expect(f.value, id).toBe(s.figures[spec.figure]);
        seen.add(id);
      }
    }
    expect([...seen].sort()).toEqual([...BUILT_IN_RULE_IDS].sort());
  });
});
