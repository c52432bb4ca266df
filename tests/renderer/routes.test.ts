import { describe, expect, it } from 'vitest';
import { formatRoute, parseRoute, tabOf, type Route } from '../../src-renderer/lib/router/routes';

describe('hash routes', () => {
  const routes: Route[] = [
    { name: 'builds' },
    { name: 'build-new' },
    { name: 'build', id: 'build-12' },
    { name: 'build-edit', id: 'build-12' },
    { name: 'build-swap', id: 'build.x_1' },
    { name: 'parts', slug: 'packs', id: null },
    { name: 'parts', slug: 'controllers', id: 'esc-3' },
    { name: 'vehicles', id: null },
    { name: 'vehicles', id: 'veh-9' },
    { name: 'classes', id: null },
    { name: 'classes', id: 'cls-2' },
    { name: 'history', kind: null, id: null },
    { name: 'history', kind: 'batteries', id: 'pack-1' },
    { name: 'settings' },
    { name: 'compare', ids: ['build-1', 'a,b', 'build-3'] },
    { name: 'compare', ids: ['build-1'], of: { supplies: true } },
    // A change carries its preview request as JSON, with characters an address must escape.
    { name: 'compare', ids: ['build-1'], of: { change: JSON.stringify({ draft: { kind: 'motors', part: { name: 'A & B? #2 100%' }, buildId: 'build-1' } }), title: 'the draft motor "A & B"' } },
    { name: 'customers', id: null },
    { name: 'customers', id: 'cust-dana-1a2b3c4d' },
    { name: 'work-order', id: 'job-4' },
    { name: 'work-order-new', vehicleId: null },
    { name: 'work-order-new', vehicleId: 'veh 9' },
  ];

  it('reads back every route it writes, so a reload opens the same screen', () => {
    for (const r of routes) expect(parseRoute(formatRoute(r))).toEqual(r);
  });

  it('writes the addresses the screens are known by', () => {
    expect(formatRoute({ name: 'build', id: 'build-12' })).toBe('#/builds/build-12');
    expect(formatRoute({ name: 'parts', slug: 'packs', id: null })).toBe('#/parts/packs');
    expect(formatRoute({ name: 'compare', ids: ['b1', 'b2'] })).toBe('#/compare?ids=b1,b2');
    expect(formatRoute({ name: 'classes', id: 'new' })).toBe('#/classes/new');
    expect(tabOf({ name: 'classes', id: 'cls-2' })).toBe('classes');
    // A build named twice is compared once.
    expect(parseRoute('#/compare?ids=b1,b2,b1,')).toEqual({ name: 'compare', ids: ['b1', 'b2'] });
    expect(tabOf({ name: 'compare', ids: [] })).toBe('builds');
    expect(formatRoute({ name: 'compare', ids: ['b1'], of: { supplies: true } })).toBe('#/compare?ids=b1&supplies=1');
    // One build only, where its supplies are compared.
    expect(parseRoute('#/compare?ids=b1,b2&supplies=1')).toEqual({ name: 'compare', ids: ['b1'], of: { supplies: true } });
    expect(formatRoute({ name: 'work-order', id: 'job-4' })).toBe('#/jobs/job-4');
    expect(formatRoute({ name: 'work-order-new', vehicleId: 'veh-9' })).toBe('#/jobs/new?vehicle=veh-9');
    // A work order belongs with the customers it is done for.
    expect(tabOf({ name: 'work-order', id: 'job-4' })).toBe('customers');
  });

  it('opens the builds list for an empty or unknown address, and packs for an unknown part kind', () => {
    expect(parseRoute('')).toEqual({ name: 'builds' });
    expect(parseRoute('#/nowhere/else')).toEqual({ name: 'builds' });
    expect(parseRoute('#/parts/wheels')).toEqual({ name: 'parts', slug: 'packs', id: null });
    expect(parseRoute('#/history/planets/x')).toEqual({ name: 'history', kind: null, id: null });
  });

  it('survives a malformed escape in an id', () => {
    expect(parseRoute('#/builds/%E0%A4%A')).toEqual({ name: 'builds' });
  });

  it('lights the tab a screen belongs to', () => {
    expect(tabOf({ name: 'build-swap', id: 'b' })).toBe('builds');
    expect(tabOf({ name: 'parts', slug: 'motors', id: null })).toBe('parts');
    expect(tabOf({ name: 'history', kind: null, id: null })).toBe('history');
  });
});
