import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { BuildSummary } from '../../src-renderer/lib/builds/build-summary';
import { rowText, RowTexts, type WidthBound } from '../../src-renderer/lib/builds/row-text';

const summary = (over: Partial<BuildSummary> = {}): BuildSummary => ({
  id: 'b1',
  name: 'Club racer',
  version: 1,
  archivedAt: null,
  vehicleId: 'v1',
  vehicleName: 'Short-course truck',
  kind: 'truck',
  customerId: null,
  customerName: '',
  className: '',
  motorId: 'm1',
  motorName: 'Motor',
  controllerId: 'c1',
  controllerName: 'Controller',
  propellerId: null,
  supplyLabels: ['2S 5000 mAh', '2S 5000 mAh'],
  batteryIds: ['p1', 'p2'],
  status: 'tight',
  supplyVoltageFullV: 16.8,
  theoreticalSpeedKmh: 80,
  peakCurrentA: 96,
  peakCurrentLimitA: 120,
  currentRule: 'controller-burst',
  currentSource: 'model',
  ruleStatuses: '',
  updatedAt: '2026-12-01T10:00:00.000Z',
  ...over,
});

/** A stand-in bound: ten pixels a character, one font as wide as another. */
const tenPerChar: WidthBound = (text) => text.length * 10;

describe("a builds-list row's texts", () => {
  it('says what each cell shows, in the chosen units', () => {
    const metric = rowText(summary(), 'metric', null);
    expect(metric).toMatchObject({ kind: 'Truck', customer: "shop's own", supply: '2S 5000 mAh | 2S 5000 mAh', vehicleTitle: 'Short-course truck (Truck)', voltage: '16.8 V', speed: '80.0 km/h' });
    expect(metric.href).toContain('b1');
    expect(metric.current.figures).toBe('96 A / 120 A');
    // 80 km/h in mph by mathjs (an outside oracle): 49.7.
    const mph = unit(80, 'km/h').toNumber('mi/h').toFixed(1);
    expect(rowText(summary(), 'imperial', null).speed).toBe(`${mph} mph`);
    expect(rowText(summary({ supplyLabels: [], supplyVoltageFullV: null, customerId: 'k1', customerName: 'Ana' }), 'metric', null)).toMatchObject({ supply: '–', voltage: '–', customer: 'Ana' });
  });

  it('bounds the widths of the cells that may be cut, once the fonts are known', () => {
    expect(rowText(summary(), 'metric', null).widths).toBeNull();
    const widths = rowText(summary(), 'metric', tenPerChar).widths!;
    expect(widths.name).toBe('Club racer'.length * 10);
    // The vehicle cell holds the vehicle's name, a space and its kind.
    expect(widths.vehicle).toBe('Short-course truck '.length * 10 + 'Truck'.length * 10);
    expect(widths.customer).toBe("shop's own".length * 10);
    expect(widths.supply).toBe('2S 5000 mAh | 2S 5000 mAh'.length * 10);
  });

  it('keeps one answer per build summary until a display setting changes', () => {
    const texts = new RowTexts();
    const s = summary();
    const first = texts.of(s, 'metric', 'en-US', tenPerChar, 'font-a');
    expect(texts.of(s, 'metric', 'en-US', tenPerChar, 'font-a')).toBe(first);
    // A new summary object for the same build (the list was read again) is worked out afresh.
    const again = texts.of(summary({ name: 'Club racer II' }), 'metric', 'en-US', tenPerChar, 'font-a');
    expect(again).not.toBe(first);
    expect(again.widths!.name).toBe('Club racer II'.length * 10);
    // Units, number locale, fonts, or the fonts becoming known: each starts afresh.
    expect(texts.of(s, 'imperial', 'en-US', tenPerChar, 'font-a').speed).toContain('mph');
    expect(texts.of(s, 'metric', 'de-DE', tenPerChar, 'font-a')).not.toBe(first);
    expect(texts.of(s, 'metric', 'de-DE', tenPerChar, 'font-b')).not.toBe(first);
    expect(texts.of(s, 'metric', 'de-DE', null, 'font-b').widths).toBeNull();
  });
});
