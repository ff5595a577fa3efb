import { describe, expect, it } from 'vitest';
import { scrollToRow, visibleRows } from '../../../src-renderer/app/state/windowing';

describe('windowing', () => {
  it('should render only the rows in view plus overscan', () => {
    const w = visibleRows(10_000, 32, 3200, 640, 5);
    // Row 100 is at the top (3200 / 32); 640 / 32 = 20 rows visible, +1 partial, +5 each side.
    expect(w.start).toBe(95);
    expect(w.end).toBe(126);
    expect(w.offset).toBe(95 * 32);
    expect(w.totalHeight).toBe(320_000);
  });

  it('should clamp at both ends', () => {
    expect(visibleRows(10, 32, -50, 640).start).toBe(0);
    const w = visibleRows(100, 32, 1e9, 640, 2);
    expect(w.end).toBe(100);
    expect(visibleRows(0, 32, 0, 640)).toEqual({ start: 0, end: 0, offset: 0, totalHeight: 0 });
  });

  it('should scroll just enough to show a row', () => {
    expect(scrollToRow(50, 32, 0, 320)).toBe(51 * 32 - 320);
    expect(scrollToRow(2, 32, 320, 320)).toBe(64);
    expect(scrollToRow(12, 32, 320, 320)).toBe(320);
  });
});
