import { describe, expect, it } from 'vitest';
import { DRAFT_CATALOGUES, DRAFT_KINDS, draftFieldKeys, isDraftKind, type DraftKind } from '../../../src-main/core/catalogue/draft-fields';
import type { FieldSpec } from '../../../src-main/core/catalogue/field-spec';
import type { Battery, BuildContext } from '../../../src-main/core/domain';
import { evaluateBuild } from '../../../src-main/core/evaluate';
import { controller, motor, propeller, quadContext, truckContext } from './fixtures';

// The draft fields are checked against the evaluation itself: every field a draft leaves out
// changes no figure or verdict when it takes its fallback, and every field a draft asks for
// changes one when it is altered. So the list can neither miss a field the checks read nor
// ask for one they do not.

/** The contexts a part of each kind is tried in; the second ones reach the fields read only as a fallback. */
const CONTEXTS: Record<DraftKind, BuildContext[]> = {
  // A pack with its lead gauge and connector rating entered, so the lead and connector checks judge it.
  // A pack with a past (cycles before its log), which a draft leaves out; one in a multirotor, whose all-up mass counts the pack.
  batteries: [packContext({ cycleCount: 150 }), packContext({ cycleCount: 150 }, quadContext()), packContext({ cycleCount: 150, wireGaugeAwg: 12, connectorRatingA: 60 })],
  // The fixture motor has a rated heat loss, so the heat check judges it; the last has none, so
  // its heat check takes the rule of thumb on its mass. Each has notes, which a draft leaves out.
  motors: [withMotorNotes(truckContext()), withMotorNotes(quadContext()), withMotorNotes(truckContext({ motor: motor({ maxLossW: null }) }))],
  // A controller rated only in cells: its cell count stands in for its voltage (4.2 V a cell, common practice).
  // Another with an eRPM limit and a minimum input voltage, so those checks judge it.
  // And one with a BEC rating on a build that enters its receiver and servo load.
  controllers: [
    truckContext(),
    truckContext({ controller: controller({ maxVoltageV: null, maxCells: 6 }) }),
    truckContext({ controller: controller({ maxErpm: 210_000, minVoltageV: 6 }) }),
    withBecLoad(truckContext({ controller: controller({ becCurrentA: 3 }) }), 2.5),
  ],
  // A maker's rpm limit stricter than the tip-speed limit of a 127 mm propeller.
  propellers: [quadContext(), quadContext({ propeller: propeller({ maxRpm: 20_000 }) })],
};

function withMotorNotes(ctx: BuildContext): BuildContext {
  return ctx.motor ? { ...ctx, motor: { ...ctx.motor, notes: 'spare' } } : ctx;
}

function withBecLoad(ctx: BuildContext, loadA: number): BuildContext {
  return { ...ctx, build: { ...ctx.build, becLoadA: loadA } };
}

function packContext(over: Partial<Battery>, ctx: BuildContext = truckContext()): BuildContext {
  const pack = { ...[...ctx.batteries.values()][0]!, ...over };
  return { ...ctx, batteries: new Map([[pack.id, pack]]) };
}

type Part = Record<string, unknown> & { id: string };

function partOf(ctx: BuildContext, kind: DraftKind): Part {
  if (kind === 'batteries') return [...ctx.batteries.values()][0] as unknown as Part;
  const part = { motors: ctx.motor, controllers: ctx.controller, propellers: ctx.propeller }[kind];
  if (!part) throw new Error(`the context has no ${kind}`);
  return part as unknown as Part;
}

function withPart(ctx: BuildContext, kind: DraftKind, part: Part): BuildContext {
  if (kind === 'batteries') return { ...ctx, batteries: new Map([[part.id, part as never]]) };
  const key = ({ motors: 'motor', controllers: 'controller', propellers: 'propeller' } as const)[kind];
  return { ...ctx, [key]: part };
}

const SKIP = Symbol('not altered here');

/** A value the field accepts that is not the one given; an empty field is altered in another context. */
function altered(spec: FieldSpec, value: unknown): unknown {
  if (value === null) return SKIP;
  if (spec.nullable) return null;
  if (spec.type === 'choice') return spec.options?.find((o) => o !== value);
  if (typeof value === 'number') return spec.type === 'integer' ? value + 1 : value * 2;
  throw new Error(`no way to alter ${spec.label}`);
}

const verdictOf = (ctx: BuildContext) => JSON.stringify(evaluateBuild(ctx));

describe('the fields of a draft part', () => {
  it('are the name and the fields the checks read, in catalogue order', () => {
    // The lists as the catalogues stood when written (December 2026).
    // The wider checks (heat loss, eRPM with the pole count, minimum voltage, leads and connectors) came later the same month,
    // then the BEC rating and the heat check's rule of thumb on the motor's mass.
    expect(draftFieldKeys('motors')).toEqual(['name', 'kv', 'resistanceOhm', 'noLoadCurrentA', 'maxCurrentA', 'maxPowerW', 'maxVoltageV', 'maxRpm', 'maxLossW', 'poles', 'massKg']);
    expect(draftFieldKeys('batteries')).toEqual(['name', 'chemistry', 'cellsSeries', 'cellsParallel', 'capacityMah', 'cRatingContinuous', 'cRatingBurst', 'cellResistanceOhm', 'massKg', 'wireGaugeAwg', 'connectorRatingA']);
    expect(draftFieldKeys('controllers')).toEqual(['name', 'maxVoltageV', 'maxCells', 'continuousCurrentA', 'burstCurrentA', 'maxErpm', 'minVoltageV', 'becCurrentA', 'resistanceOhm']);
    expect(draftFieldKeys('propellers')).toEqual(['name', 'diameterMm', 'pitchMm', 'thrustCoefficient', 'powerCoefficient', 'maxRpm']);
  });

  it('include every field a new record cannot be made without', () => {
    for (const kind of DRAFT_KINDS) {
      const required = Object.entries<FieldSpec>(DRAFT_CATALOGUES[kind])
        .filter(([, spec]) => spec.fallback === undefined)
        .map(([key]) => key);
      expect(required.length, kind).toBeGreaterThan(0);
      for (const key of required) expect(draftFieldKeys(kind), `${kind}.${key}`).toContain(key);
    }
  });

  it('leave out only fields whose fallback gives the same figures and verdicts', () => {
    for (const kind of DRAFT_KINDS) {
      const left = Object.entries<FieldSpec>(DRAFT_CATALOGUES[kind]).filter(([key]) => !(draftFieldKeys(kind) as string[]).includes(key));
      expect(left.length, kind).toBeGreaterThan(0);
      for (const ctx of CONTEXTS[kind]) {
        const part = partOf(ctx, kind);
        const fallbacks = Object.fromEntries(left.map(([key, spec]) => [key, spec.fallback]));
        // The fixtures hold values other than the fallbacks (a mass, poles, three blades), so the check has something to find.
        expect(
          left.some(([key, spec]) => part[key] !== spec.fallback),
          kind,
        ).toBe(true);
        expect(verdictOf(withPart(ctx, kind, { ...part, ...fallbacks })), kind).toBe(verdictOf(ctx));
      }
    }
  });

  it('ask only for fields that move a figure or a verdict when altered', () => {
    for (const kind of DRAFT_KINDS) {
      const catalogue: Record<string, FieldSpec> = DRAFT_CATALOGUES[kind];
      for (const key of draftFieldKeys(kind).filter((k) => k !== 'name')) {
        const spec = catalogue[key]!;
        const moved = CONTEXTS[kind].some((ctx) => {
          const part = partOf(ctx, kind);
          if (altered(spec, part[key]) === SKIP) return false;
          return verdictOf(withPart(ctx, kind, { ...part, [key]: altered(spec, part[key]) })) !== verdictOf(ctx);
        });
        expect(moved, `${kind}.${key}`).toBe(true);
      }
    }
  });

  it('are offered for packs, motors, controllers and propellers only', () => {
    expect(DRAFT_KINDS.every(isDraftKind)).toBe(true);
    expect(isDraftKind('vehicles')).toBe(false);
    expect(isDraftKind('classRules')).toBe(false);
  });
});
