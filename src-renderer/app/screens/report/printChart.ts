/**
 * Chart options as a printed page shows them: a printed chart cannot be zoomed, so the
 * zoom slider under the time axis is hidden (kept as a component with show: false, so a
 * chart already on screen merges the change instead of keeping the old slider), and the
 * room it took below the axis name is given back to the plot.
 */
import type { ChartOption } from '../../charts/echarts';

/** Bottom margin of a printed chart, px: room for the tick labels and the axis name only. */
export const PRINT_GRID_BOTTOM = 44;

/** The option without its zoom slider (inside zoom stays; it draws nothing). */
export function withoutZoomSlider(option: ChartOption): ChartOption {
  return withZoomSlider(option, false);
}

/**
 * The option with its zoom slider shown or hidden, said explicitly either way: a chart merges
 * a new option into the one it has, so after printing the slider must be switched back on.
 * Hidden, the bottom margin shrinks to PRINT_GRID_BOTTOM.
 */
export function withZoomSlider(option: ChartOption, shown: boolean): ChartOption {
  const zoom = option.dataZoom;
  if (!zoom) return option;
  const list = Array.isArray(zoom) ? zoom : [zoom];
  if (!list.some((z) => z.type === 'slider')) return option;
  const grid = !shown && option.grid && !Array.isArray(option.grid) ? { ...option.grid, bottom: PRINT_GRID_BOTTOM } : option.grid;
  return { ...option, grid, dataZoom: list.map((z) => (z.type === 'slider' ? { ...z, show: shown } : z)) } as ChartOption;
}
