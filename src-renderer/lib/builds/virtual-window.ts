// Which rows of a long list to put in the page: the visible ones plus a few either side, so
// 10 000 builds cost as much to draw as thirty.

export interface WindowSlice {
  /** First row index drawn. */
  start: number;
  /** One past the last row index drawn. */
  end: number;
  /** Pixels above the first drawn row. */
  offset: number;
  /** Height of the whole list, for the scroll bar. */
  total: number;
  /**
   * Row elements to keep in the page: enough for a full window whatever the count, so a filter
   * that empties the list and brings it back reuses the same elements instead of making them anew.
   */
  slots: number;
}

/**
 * `below` is the overscan under the window, `overscan` by default; the list draws none there in
 * the frame that answers a keystroke and adds it right after (see BuildsTable.svelte). The
 * overscan above never changes with it, so a slot keeps its row when the rest is added.
 */
export function visibleWindow(scrollTop: number, viewportHeight: number, rowHeight: number, count: number, overscan = 6, below = overscan): WindowSlice {
  const total = count * rowHeight;
  if (rowHeight <= 0) return { start: 0, end: 0, offset: 0, total, slots: 0 };
  const shown = Math.ceil(Math.max(viewportHeight, rowHeight) / rowHeight) + 1;
  const slots = shown + 2 * overscan;
  if (count === 0) return { start: 0, end: 0, offset: 0, total, slots };
  const top = Math.max(0, Math.min(scrollTop, Math.max(0, total - viewportHeight)));
  const first = Math.floor(top / rowHeight);
  const start = Math.max(0, first - overscan);
  // Below the window: the rows that reach the viewport's bottom edge from where it starts (one
  // fewer than `shown` when the top row is whole), then the overscan.
  const inView = Math.floor((top + Math.max(viewportHeight, rowHeight) - 1) / rowHeight) - first + 1;
  const end = Math.min(count, first + inView + Math.max(0, Math.min(overscan, below)));
  return { start, end, offset: start * rowHeight, total, slots };
}

/** The scroll position that brings a row fully into view, moving as little as possible. */
export function revealRow(index: number, scrollTop: number, viewportHeight: number, rowHeight: number): number {
  const top = index * rowHeight;
  const bottom = top + rowHeight;
  if (top < scrollTop) return top;
  if (bottom > scrollTop + viewportHeight) return Math.max(0, bottom - viewportHeight);
  return scrollTop;
}

/** The row a key moves the selection to, or null for keys the list does not handle. */
export function moveSelection(key: string, index: number, count: number, pageRows: number): number | null {
  if (count === 0) return null;
  const clamp = (i: number) => Math.max(0, Math.min(count - 1, i));
  switch (key) {
    case 'ArrowDown':
      return clamp(index < 0 ? 0 : index + 1);
    case 'ArrowUp':
      return clamp(index < 0 ? 0 : index - 1);
    case 'PageDown':
      return clamp(index + Math.max(1, pageRows));
    case 'PageUp':
      return clamp(index - Math.max(1, pageRows));
    case 'Home':
      return 0;
    case 'End':
      return count - 1;
    default:
      return null;
  }
}
