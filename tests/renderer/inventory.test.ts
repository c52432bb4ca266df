import { describe, expect, it } from 'vitest';
import { compareCells, inventoryRows, matchesSearch } from '../../src-renderer/lib/parts/inventory';

describe('the parts tables at shop scale', () => {
  it('finds a row when every word of the search is in it, whatever the case', () => {
    expect(matchesSearch('Shelf 4S 5000 LiPo 50', 'lipo 4s')).toBe(true);
    expect(matchesSearch('Shelf 4S 5000 LiPo 50', '6s')).toBe(false);
    expect(matchesSearch('anything', '   ')).toBe(true);
  });

  it('sorts numbers by value, text as read (4S before 12S), and empty cells last either way', () => {
    const rows = [
      { name: 'Pack 12S', c: 25 },
      { name: 'Pack 4S', c: null },
      { name: 'Pack 2S', c: 100 },
      { name: 'Pack 6S', c: 50 },
    ];
    const by = (key: 'name' | 'c', dir: 1 | -1) => inventoryRows(rows, { query: '', text: (r) => r.name, value: (r) => r[key], dir }).map((r) => r.name);
    expect(by('c', 1)).toEqual(['Pack 12S', 'Pack 6S', 'Pack 2S', 'Pack 4S']);
    expect(by('c', -1)).toEqual(['Pack 2S', 'Pack 6S', 'Pack 12S', 'Pack 4S']);
    expect(by('name', 1)).toEqual(['Pack 2S', 'Pack 4S', 'Pack 6S', 'Pack 12S']);
    expect(compareCells('', 'a', -1)).toBe(1);
  });

  it('keeps the given order among equal values and drops rows the search misses', () => {
    const rows = [
      { name: 'b', n: 1 },
      { name: 'a', n: 1 },
      { name: 'c', n: 0 },
    ];
    expect(inventoryRows(rows, { query: '', text: (r) => r.name, value: (r) => r.n, dir: -1 }).map((r) => r.name)).toEqual(['b', 'a', 'c']);
    expect(inventoryRows(rows, { query: 'a', text: (r) => r.name, value: (r) => r.n, dir: 1 }).map((r) => r.name)).toEqual(['a']);
  });
});
