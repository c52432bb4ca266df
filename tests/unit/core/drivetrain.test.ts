import { evaluate } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { finalDriveRatio, rolloutMm, speedKmhAt, wheelRpm } from '../../../src-main/core/drivetrain';
import { launchCurrent, loadedTopSpeed } from '../../../src-main/core/ground-load';
import { currentAt, motorParams, stallCurrent, torqueAt } from '../../../src-main/core/motor';
import { aeroDrag, roadLoad, rollingResistance } from '../../../src-main/core/road-load';

describe('gearing', () => {
  it('final drive ratio is spur ÷ pinion × internal ratio', () => {
    expect(finalDriveRatio(46, 15, 2.6)).toBeCloseTo((46 / 15) * 2.6, 12);
    expect(wheelRpm(30000, 7.5)).toBe(4000);
  });

  it('rollout and speed agree with a mathjs unit computation', () => {
    const fdr = finalDriveRatio(46, 15, 2.6);
    // Rollout: tyre circumference per motor turn.
    expect(rolloutMm(115, fdr)).toBeCloseTo(evaluate(`pi * 115 mm / ${fdr}`).toNumber('mm'), 9);
    // Speed: motor rpm ÷ ratio × circumference, converted by mathjs.
    expect(speedKmhAt(32560, fdr, 115)).toBeCloseTo(evaluate(`32560 / ${fdr} * pi * 115 mm / minute`).toNumber('km/h'), 9);
  });
});

describe('road load', () => {
  // Drag equation F = ½·ρ·v²·C_d·A (any aerodynamics textbook, e.g. Anderson, "Fundamentals
  // of Aerodynamics", from memory), evaluated by mathjs with its own unit handling.
  it('aerodynamic drag matches the drag equation at 100 km/h', () => {
    const expected = evaluate('0.5 * 1.225 kg/m^3 * (100 km/h)^2 * 0.6 m^2').toNumber('N');
    expect(aeroDrag(1.225, 0.6, 100 / 3.6)).toBeCloseTo(expected, 9);
    expect(expected).toBeCloseTo(283.6, 1); // hand check of the same relation
  });

  it('rolling resistance is C_rr·m·g', () => {
    expect(rollingResistance(0.015, 1500)).toBeCloseTo(evaluate('0.015 * 1500 kg * gravity').toNumber('N'), 9);
    expect(roadLoad(1.225, 0.6, 0.015, 1500, 0)).toBeCloseTo(rollingResistance(0.015, 1500), 12);
  });
});

describe('ground operating points', () => {
  const m = motorParams(2200, 0.011 + 0.001 + 0.012, 2.5);
  const d = { motorCount: 1, finalDrive: finalDriveRatio(46, 15, 2.6), tireDiameterMm: 115, efficiency: 0.85 };
  const truck = { massKg: 3.2, dragAreaM2: 0.03, rollingCoefficient: 0.03, airDensity: 1.225 };

  it('loaded top speed is where drive force meets road load', () => {
    const top = loadedTopSpeed(m, 16.8, d, truck);
    const r = 0.115 / 2;
    const drive = (torqueAt(m, 16.8, top.omegaRadS) * d.finalDrive * d.efficiency) / r;
    expect(drive).toBeCloseTo(roadLoad(1.225, 0.03, 0.03, 3.2, top.speedMps), 6);
    expect(top.currentA).toBeCloseTo(currentAt(m, 16.8, top.omegaRadS), 9);
    expect(top.speedMps).toBeGreaterThan(0);
  });

  it('launch current is traction-limited: μ·m·g·r ÷ ratio ÷ η through Kt, plus I0', () => {
    const kt = 60 / (2 * Math.PI * 2200);
    const byHand = (0.9 * 3.2 * 9.80665 * (0.115 / 2)) / d.finalDrive / 0.85 / kt + 2.5;
    expect(launchCurrent(m, 16.8, d, 0.9, 3.2)).toBeCloseTo(byHand, 9);
  });

  it('launch current is the stall current when the tyres could take more', () => {
    expect(launchCurrent(m, 16.8, d, 50, 3.2)).toBeCloseTo(stallCurrent(m, 16.8), 9);
    expect(stallCurrent(m, 16.8)).toBeCloseTo(16.8 / 0.024, 9);
  });

  it('a vehicle the motor cannot move stays stalled, with finite figures', () => {
    const top = loadedTopSpeed(m, 16.8, d, { ...truck, massKg: 1e9 });
    expect(top.speedMps).toBe(0);
    expect(top.currentA).toBeCloseTo(stallCurrent(m, 16.8), 9);
  });
});
