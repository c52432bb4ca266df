import { describe, expect, it } from 'vitest';
import { moveSelection, revealRow, visibleWindow } from '../../src-renderer/lib/builds/virtual-window';

describe('virtual window', () => {
  it('draws the visible rows plus the overscan, not the whole list', () => {
    // 600 px of 32 px rows shows 18.75 rows; scrolled to row 100.
    const w = visibleWindow(3200, 600, 32, 10_000, 6);
    expect(w.start).toBe(94);
    // From row 100's top edge, 600 px reach into row 118: 19 rows in view, then 6 below.
    expect(w.end).toBe(100 + 19 + 6);
    expect(w.offset).toBe(94 * 32);
    expect(w.total).toBe(320_000);
    expect(w.end - w.start).toBeLessThan(40);
  });

  it('counts a partly scrolled top row, and can leave out the rows below the view', () => {
    // 10 px into row 100: rows 100 to 119 are (partly) in view, 20 of them.
    expect(visibleWindow(3210, 600, 32, 10_000, 6).end).toBe(100 + 20 + 6);
    // The frame that answers a keystroke: the overscan above stays (so slots keep their rows), none below.
    const now = visibleWindow(3200, 600, 32, 10_000, 6, 0);
    expect(now.start).toBe(94);
    expect(now.end).toBe(100 + 19);
    expect(now.slots).toBe(visibleWindow(3200, 600, 32, 10_000, 6).slots);
    expect(visibleWindow(0, 600, 32, 10_000, 6, 0)).toMatchObject({ start: 0, end: 19 });
  });

  it('clamps at both ends of the list', () => {
    // 600 px of 32 px rows: 19 rows seen (18.75 rounded up) + 1 partly scrolled in + 6 either side.
    expect(visibleWindow(0, 600, 32, 10, 6)).toEqual({ start: 0, end: 10, offset: 0, total: 320, slots: 32 });
    const bottom = visibleWindow(1e9, 600, 32, 1000, 6);
    expect(bottom.end).toBe(1000);
    expect(bottom.start).toBeGreaterThan(900);
    expect(visibleWindow(0, 600, 32, 0)).toEqual({ start: 0, end: 0, offset: 0, total: 0, slots: 32 });
  });

  it('keeps as many row elements for an empty or short list as for a long one', () => {
    // The elements outlive a filter that matches nothing, so bringing the rows back only rewrites them.
    const long = visibleWindow(3200, 600, 32, 10_000, 6);
    expect(long.end - long.start).toBeLessThanOrEqual(long.slots);
    expect(visibleWindow(0, 600, 32, 3, 6).slots).toBe(long.slots);
    expect(visibleWindow(0, 600, 32, 0, 6).slots).toBe(long.slots);
    expect(visibleWindow(0, 900, 32, 0, 6).slots).toBeGreaterThan(long.slots);
  });

  it('scrolls only as far as needed to show a row', () => {
    expect(revealRow(5, 0, 320, 32)).toBe(0);
    expect(revealRow(10, 0, 320, 32)).toBe(32);
    expect(revealRow(2, 200, 320, 32)).toBe(64);
  });

  it('moves the selection with the usual keys and ignores the rest', () => {
    expect(moveSelection('ArrowDown', -1, 5, 10)).toBe(0);
    expect(moveSelection('ArrowDown', 4, 5, 10)).toBe(4);
    expect(moveSelection('ArrowUp', 0, 5, 10)).toBe(0);
    expect(moveSelection('PageDown', 0, 50, 10)).toBe(10);
    expect(moveSelection('End', 0, 50, 10)).toBe(49);
    expect(moveSelection('Home', 30, 50, 10)).toBe(0);
    expect(moveSelection('a', 3, 50, 10)).toBeNull();
    expect(moveSelection('ArrowDown', 0, 0, 10)).toBeNull();
  });
});
