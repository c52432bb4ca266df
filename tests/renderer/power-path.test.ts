import { describe, expect, it } from 'vitest';
import { askedText, assumedText, decidingChecks, powerPath, type PathParts } from '../../src-renderer/lib/sheet/power-path';
import { valueUsedText } from '../../src-renderer/lib/sheet/values-used';
import { figuresByStage } from '../../src-renderer/lib/sheet/stage-figures';
import { stageOfRule } from '../../src-renderer/lib/sheet/path-stages';
import type { BuildContext, Finding } from '../../src-main/core/domain';
import { battery, finding, quadContext, supplyOf, truckContext } from '../unit/core/fixtures';

const partsOf = (ctx: BuildContext): PathParts => ({
  vehicle: ctx.vehicle,
  motor: ctx.motor,
  controller: ctx.controller,
  propeller: ctx.propeller,
  batteries: [...ctx.batteries.values()],
  motorCount: ctx.build.motorCount,
  buildId: ctx.build.id,
});

describe('power path', () => {
  it('follows the energy: packs, controller, motor, gearing, wheels for a truck', () => {
    const ctx = truckContext();
    const path = powerPath(supplyOf(ctx), partsOf(ctx), 'metric');
    expect(path.map((s) => s.title)).toEqual(['Pack', 'Speed controller', 'Motor', 'Gearing', 'Wheels']);
    expect(path[0]!.parts).toEqual([{ label: 'Pack A', href: '#/parts/packs/pack-a' }]);
    expect(path[1]!.parts[0]!.href).toBe('#/parts/controllers/esc-a');
    expect(path[2]!.parts[0]!.href).toBe('#/parts/motors/motor-a');
    expect(path[3]!.parts[0]!.href).toBe('#/builds/build-a/edit');
    expect(path[4]!.parts[0]!.href).toBe('#/vehicles/truck-a');
  });

  it('propeller builds end in the propeller and thrust', () => {
    const ctx = quadContext();
    const path = powerPath(supplyOf(ctx), partsOf(ctx), 'metric');
    expect(path.map((s) => s.title)).toEqual(['Pack', 'Speed controller', 'Motors × 4', 'Propeller', 'Thrust']);
    expect(path[3]!.rule).toBe('prop-tip-speed');
    expect(path[4]!.figure).toMatch(/ N \(\d[\d,]* g\) static, full charge$/u);
  });

  it('puts each stage rating beside the figure the build asks of it, from the worst check of the stage', () => {
    const ctx = truckContext();
    const v = supplyOf(ctx);
    const path = powerPath(v, partsOf(ctx), 'metric');
    const pack = path[0]!;
    const worstPackCheck = [finding(v, 'battery-continuous'), finding(v, 'battery-burst')].sort((a, b) => (a.margin ?? 0) - (b.margin ?? 0))[0]!;
    expect(pack.rule).toBe(worstPackCheck.rule);
    // Continuous rating = C × capacity: 50 × 5 Ah = 250 A; burst 100 × 5 = 500 A (common practice).
    expect(pack.asked).toMatch(worstPackCheck.rule === 'battery-continuous' ? / of 250 A continuous$/u : / of 500 A burst$/u);
    expect(pack.status).toBe(worstPackCheck.status);
    expect(path[1]!.findings.map((f) => f.rule).sort()).toEqual(['controller-burst', 'controller-continuous', 'controller-voltage']);
  });

  it('the stage verdict is its worst check: a small pack reads over at the packs', () => {
    const small = battery({ cRatingContinuous: 5, cRatingBurst: 10 });
    const ctx = truckContext({ batteries: new Map([[small.id, small]]) });
    const v = supplyOf(ctx);
    const path = powerPath(v, partsOf(ctx), 'metric');
    expect(path[0]!.status).toBe('over');
    // 5 C × 5 Ah = 25 A continuous; 10 C × 5 Ah = 50 A burst.
    expect(path[0]!.asked).toMatch(/ of (25 A continuous|50 A burst)$/u);
    expect(decidingChecks(v).every((f) => f.status !== 'clear')).toBe(true);
    expect(decidingChecks(v)[0]!.status).toBe('over');
  });

  it('a missing controller is said at its stage, and its checks cannot be made', () => {
    const ctx = truckContext({ controller: null, build: { ...truckContext().build, controllerId: null } });
    const path = powerPath(supplyOf(ctx), partsOf(ctx), 'metric');
    expect(path[1]!.missing).toBe('no speed controller chosen');
    expect(path[1]!.parts).toEqual([]);
  });

  it('says what a figure assumed', () => {
    const f: Finding = { rule: 'controller-continuous', status: 'clear', value: 35.8, limit: 60, unit: 'A', margin: 0.403, message: '', source: 'model', assumed: ['battery.cellResistanceOhm'] };
    expect(askedText(f, 'metric')).toBe('35.8 A of 60 A continuous');
    expect(assumedText(f)).toBe('continuous, model, full charge, pack resistance not measured, taken as zero');
    expect(assumedText({ ...f, rule: 'battery-burst', source: 'measured', assumed: [] })).toBe('peak, measured, full charge');
    expect(assumedText({ ...f, rule: 'controller-voltage', unit: 'V', assumed: [] })).toBe('full charge');
    // Tip speed in ft/s: 40 m/s ÷ 0.3048 = 131 ft/s, 200 m/s ÷ 0.3048 = 656 ft/s (NIST SP 811: 1 ft = 0.3048 m).
    expect(askedText({ ...f, rule: 'prop-tip-speed', unit: 'm/s', value: 40, limit: 200 }, 'imperial')).toBe('131 ft/s of 656 ft/s limit');
    expect(askedText({ ...f, value: null, status: 'incomplete' }, 'metric')).toBe('Controller continuous current: cannot be checked');
  });

  it('says when a figure was entered, and when a limit is a rule of thumb', () => {
    const bec: Finding = { rule: 'bec-current', status: 'tight', value: 2.8, limit: 3, unit: 'A', margin: 0.2 / 3, message: '' };
    expect(askedText(bec, 'metric')).toBe('2.80 A of 3 A BEC rating');
    expect(assumedText(bec)).toBe('as entered on the build');
    expect(stageOfRule('bec-current', 'A')).toBe('controller');
    const heat: Finding = { rule: 'motor-heat', status: 'tight', value: 59.6, limit: 150, unit: 'W', margin: 0.6, message: '', source: 'measured', typical: ['motor.maxLossW'] };
    expect(askedText(heat, 'metric')).toBe('59.6 W of 150 W rule-of-thumb limit');
    expect(assumedText(heat)).toBe('continuous, measured, full charge, limit by rule of thumb per motor mass');
    expect(askedText({ ...heat, typical: [] }, 'metric')).toBe('59.6 W of 150 W rated loss');
    expect(valueUsedText({ field: 'motor.maxLossW', value: 150, basis: 'rule-of-thumb' })).toMatch(/^Motor heat limit: 150 W, rule of thumb per motor mass/);
  });

  it('class rules fall on the stage of what they limit', () => {
    expect(stageOfRule('class-max-voltage', 'V')).toBe('supply');
    expect(stageOfRule('class-speed', 'km/h')).toBe('output');
    expect(stageOfRule('motor-current', 'A')).toBe('motor');
  });

  it('groups every figure once, by stage', () => {
    const truck = figuresByStage('truck');
    // Stages come from the figure catalogue: the supply current is the packs' figure (their
    // checks and the controller's both read it); the controller's own is the BEC load, entered
    // on some builds only.
    expect(truck.map((g) => g.title)).toEqual(['Packs', 'Speed controller (supply current)', 'Motor', 'Gearing', 'Wheels']);
    expect(truck.find((g) => g.id === 'controller')!.figures.map((f) => [f.key, f.optional])).toEqual([['becLoadA', true]]);
    expect(truck.find((g) => g.id === 'supply')!.figures.map((f) => f.key)).toContain('continuousCurrentA');
    const keys = truck.flatMap((g) => g.figures.map((f) => f.key));
    expect(new Set(keys).size).toBe(keys.length);
    expect(truck.find((g) => g.id === 'drive')!.figures.map((f) => f.key)).toContain('finalDriveRatio');
    const boat = figuresByStage('boat');
    expect(boat.find((g) => g.id === 'output')!.figures.map((f) => f.key)).toContain('thrustN');
  });
});
