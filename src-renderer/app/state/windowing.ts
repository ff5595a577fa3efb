/**
 * Row windowing for long lists: which rows to render for a scroll position.
 * Fixed row height; a few rows of overscan above and below keep fast scrolling smooth.
 */
export interface RowWindow {
  /** First row index to render (inclusive). */
  start: number;
  /** Last row index to render (exclusive). */
  end: number;
  /** Pixel offset of the first rendered row. */
  offset: number;
  /** Full height of the list, px. */
  totalHeight: number;
}

export function visibleRows(rowCount: number, rowHeight: number, scrollTop: number, viewportHeight: number, overscan = 6): RowWindow {
  const totalHeight = rowCount * rowHeight;
  if (rowCount <= 0 || rowHeight <= 0) return { start: 0, end: 0, offset: 0, totalHeight: 0 };
  const maxScroll = Math.max(0, totalHeight - viewportHeight);
  const top = Math.min(Math.max(0, scrollTop), maxScroll);
  const first = Math.floor(top / rowHeight);
  const visible = Math.ceil(viewportHeight / rowHeight) + 1;
  const start = Math.max(0, first - overscan);
  const end = Math.min(rowCount, first + visible + overscan);
  return { start, end, offset: start * rowHeight, totalHeight };
}

/** Scroll position that brings a row into view (unchanged when it already is). */
export function scrollToRow(row: number, rowHeight: number, scrollTop: number, viewportHeight: number): number {
  const top = row * rowHeight;
  if (top < scrollTop) return top;
  if (top + rowHeight > scrollTop + viewportHeight) return top + rowHeight - viewportHeight;
  return scrollTop;
}
