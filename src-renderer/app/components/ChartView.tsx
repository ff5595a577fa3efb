import { useEffect, useRef } from 'react';
import { echarts, type ChartOption } from '../charts/echarts';

/** Where a dragged pick was let go, in the chart's data coordinates. */
export interface PickDrop { key: string; x: number; y: number }

interface Props {
  option: ChartOption | null;
  className?: string;
  testId?: string;
  label: string;
  /** Pick keys (series 'pick-*', datum name) the user may drag; others stay put. */
  draggable?: boolean;
  onPickDrop?: (drop: PickDrop) => void;
  onPickClick?: (key: string) => void;
  /** Visible x range changed by zooming (data units of the x axis), null for the full range. */
  onZoom?: (range: [number, number] | null) => void;
  highlightKey?: string | null;
}

/**
 * One ECharts canvas. Picks (scatter series with id 'pick-...') can be dragged: the
 * marker follows the pointer, and on release the drop is reported in data
 * coordinates (pixel to data with convertFromPixel).
 */
export function ChartView({ option, className, testId, label, draggable = false, onPickDrop, onPickClick, onZoom, highlightKey }: Props) {
  const host = useRef<HTMLDivElement>(null);
  const chart = useRef<ReturnType<typeof echarts.init> | null>(null);
  const handlers = useRef({ onPickDrop, onPickClick, onZoom, draggable });
  useEffect(() => { handlers.current = { onPickDrop, onPickClick, onZoom, draggable }; });

  useEffect(() => {
    if (!host.current) return;
    const c = echarts.init(host.current, undefined, { renderer: 'canvas' });
    chart.current = c;
    // The instance on its element, for end-to-end tests that drag a pick (pixel <-> data).
    (host.current as HTMLDivElement & { chart?: unknown }).chart = c;
    // The observer also reports the size the chart was made with; a re-layout then would redraw for nothing.
    const el = host.current;
    const ro = new ResizeObserver(() => { if (el.clientWidth !== c.getWidth() || el.clientHeight !== c.getHeight()) c.resize(); });
    ro.observe(el);
    let drag: { key: string; seriesId: string; dataIndex: number; moved: boolean } | null = null;
    c.on('mousedown', (params) => {
      const p = params as unknown as { seriesId?: string; name?: string; dataIndex: number };
      if (!handlers.current.draggable || !p.seriesId?.startsWith('pick-') || !p.name) return;
      drag = { key: p.name, seriesId: p.seriesId, dataIndex: p.dataIndex, moved: false };
      c.dispatchAction({ type: 'hideTip' });
    });
    c.on('click', (params) => {
      const p = params as unknown as { seriesId?: string; name?: string };
      if (p.seriesId?.startsWith('pick-') && p.name && !drag?.moved) handlers.current.onPickClick?.(p.name);
    });
    const zr = c.getZr();
    zr.on('mousemove', (e) => {
      if (!drag) return;
      const point = c.convertFromPixel({ seriesId: drag.seriesId }, [e.offsetX, e.offsetY]) as number[] | undefined;
      if (!point) return;
      drag.moved = true;
      const opt = c.getOption() as { series: { id: string; data: { name: string; value: number[] }[] }[] };
      const s = opt.series.find((x) => x.id === drag!.seriesId);
      if (!s) return;
      const data = s.data.map((d, i) => (i === drag!.dataIndex ? { ...d, value: [point[0], point[1]] } : d));
      c.setOption({ series: [{ id: drag.seriesId, data }] }, { lazyUpdate: true });
    });
    zr.on('mouseup', (e) => {
      if (!drag) return;
      const d = drag;
      drag = null;
      if (!d.moved) return;
      const point = c.convertFromPixel({ seriesId: d.seriesId }, [e.offsetX, e.offsetY]) as number[] | undefined;
      if (point) handlers.current.onPickDrop?.({ key: d.key, x: point[0], y: point[1] });
    });
    c.on('datazoom', () => {
      const opt = c.getOption() as { dataZoom?: { startValue?: number; endValue?: number; start?: number; end?: number }[] };
      const z = opt.dataZoom?.[0];
      if (!z) return;
      if ((z.start ?? 0) <= 0 && (z.end ?? 100) >= 100) handlers.current.onZoom?.(null);
      else if (z.startValue !== undefined && z.endValue !== undefined) handlers.current.onZoom?.([z.startValue, z.endValue]);
    });
    return () => { ro.disconnect(); c.dispose(); chart.current = null; };
  }, []);

  useEffect(() => {
    const c = chart.current;
    if (!c) return;
    if (!option) { c.clear(); return; }
    c.setOption(option, { replaceMerge: ['series'], lazyUpdate: false });
  }, [option]);

  useEffect(() => {
    const c = chart.current;
    if (!c || !option) return;
    c.dispatchAction({ type: 'downplay' });
    if (highlightKey) c.dispatchAction({ type: 'highlight', name: highlightKey });
  }, [highlightKey, option]);

  return <div ref={host} className={className ?? 'chart-box'} role="img" aria-label={label} data-testid={testId} />;
}
