import { describe, expect, it } from 'vitest';
import { DEFAULT_LIST_QUERY, formatListQuery, parseListQuery, type ListQuery } from '../../src-renderer/lib/builds/list-query';
import { formatRoute, parseRoute } from '../../src-renderer/lib/router/routes';

describe('the builds list in the address', () => {
  const full: ListQuery = {
    text: 'shop 4s & co',
    statuses: ['over', 'incomplete'],
    kinds: ['truck', 'boat'],
    customer: 'cust-dana',
    partId: 'pack-1',
    rule: 'class-max-kv',
    sortKey: 'peak',
    sortDir: -1,
    archived: true,
  };

  it('reads back every filter, the sort and the search it writes', () => {
    expect(parseListQuery(formatListQuery(full))).toEqual(full);
    expect(parseRoute(formatRoute({ name: 'builds', query: full }))).toEqual({ name: 'builds', query: full });
  });

  it('writes nothing for the default list, so the plain address stays #/builds', () => {
    expect(formatListQuery(DEFAULT_LIST_QUERY)).toBe('');
    expect(formatRoute({ name: 'builds', query: DEFAULT_LIST_QUERY })).toBe('#/builds');
    expect(parseRoute('#/builds')).toEqual({ name: 'builds' });
  });

  it('encodes text so that &, = and spaces survive (URLSearchParams, WHATWG URL standard)', () => {
    const hash = formatRoute({ name: 'builds', query: { ...DEFAULT_LIST_QUERY, text: 'a&b=c d' } });
    expect(hash).toBe('#/builds?q=a%26b%3Dc+d');
    expect(parseRoute(hash)).toEqual({ name: 'builds', query: { ...DEFAULT_LIST_QUERY, text: 'a&b=c d' } });
  });

  it('drops what it does not know instead of failing: unknown verdicts, kinds and sort columns', () => {
    const q = parseListQuery('v=over,bogus,over&kind=car,hovercraft&sort=colour&dir=sideways');
    expect(q.statuses).toEqual(['over']);
    expect(q.kinds).toEqual(['car']);
    expect(q.sortKey).toBe(DEFAULT_LIST_QUERY.sortKey);
    expect(q.sortDir).toBe(1);
  });

  it('keeps a check by its rule id and drops one that is not an id', () => {
    expect(parseListQuery('check=controller-continuous&v=over').rule).toBe('controller-continuous');
    expect(formatListQuery({ ...DEFAULT_LIST_QUERY, rule: 'controller-continuous', statuses: ['over'] })).toBe('v=over&check=controller-continuous');
    expect(parseListQuery('check=a%2Cb%3Dover').rule).toBe('');
    expect(parseListQuery('check=').rule).toBe('');
  });

  it('keeps a vehicle chosen for a new build in its address', () => {
    expect(formatRoute({ name: 'build-new', vehicleId: 'veh 1' })).toBe('#/builds/new?vehicle=veh+1');
    expect(parseRoute('#/builds/new?vehicle=veh+1')).toEqual({ name: 'build-new', vehicleId: 'veh 1' });
    expect(parseRoute('#/builds/new')).toEqual({ name: 'build-new' });
  });
});
