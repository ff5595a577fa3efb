import { useEffect, useMemo, useRef, useState } from 'react';
import { flushSync } from 'react-dom';
import type { StoredSamples } from '../../../archive/api';
import type { TestType } from '../../../engine/record';
import type { AnalysisResult } from '../../../engine/result';
import type { UnitSystem } from '../../../engine/units/unitSystem';
import { ChartView, type PickDrop } from '../../components/ChartView';
import type { ChartOption } from '../../charts/echarts';
import {
  cyclesOverlayOption, gFunctionChartOption, logLogChartOption, parsePickKey, placedPicks, sqrtTimeChartOption,
  stepRateChartOption, timeChartOption, timeChartPickSeries, volumeChartOption,
} from '../../charts/options';
import { hasShutIn, shutInSeriesOf, shutInSlice, type ShutInArrays } from '../../charts/shutInDiagnostics';
import { useApp } from '../../context';
import { fromDisplay } from '../../format/units';
import { nearestIndex, nearestIndexUnsorted, pickRange } from '../../state/pickPlacement';
import { withZoomSlider } from '../report/printChart';
import type { PickEditRequest } from './PickDialog';

type Tab = 'volume' | 'shutin' | 'steprate' | 'overlay';
/** A cycle's shut-in arrays as computed in the analysis worker: on its way, done, or none to show. */
type ShutInEntry = 'computing' | 'none' | ShutInArrays;
/** The shut-in arrays of the record's cycles, valid for one time and downhole series. */
interface ShutInCache { time: Float64Array; downhole: Float64Array; entries: Map<string, ShutInEntry> }
const TARGET = 2400;

/**
 * The charts of a test. The pressure-time chart is drawn from the stored samples and the
 * downhole pressure as soon as they are read; the picks, fitted lines and diagnostic charts
 * join it when the analysis arrives (`analysis` null until then). The record is thinned
 * for drawing once: the picks are added to the thinned series, never re-thinned with them.
 */
export function TestCharts({ samples, downhole: headerDownhole, correction, type, analysis, units, selected, onSelect, onDrop }: {
  samples: StoredSamples;
  /** Downhole pressure of the record, Pa (gauge readings plus the constant hydrostatic correction). */
  downhole: Float64Array;
  /** Hydrostatic correction added to the gauge readings, Pa (0 for a downhole gauge). */
  correction: number;
  /** Test type as stored (chooses the diagnostic chart shown first). */
  type: TestType;
  analysis: AnalysisResult | null; units: UnitSystem; selected: string | null;
  onSelect: (key: string) => void; onDrop: (request: PickEditRequest) => void;
}) {
  const { engine } = useApp();
  const { time, pressure, rate, volume } = samples;
  // The series read with the test unless the analysis corrected the gauge otherwise.
  const downhole = analysis && analysis.hydrostaticCorrection !== correction ? analysis.downholePressure : headerDownhole;
  const cycles = useMemo(() => analysis?.cycles ?? [], [analysis]);
  const stepCycle = useMemo(() => cycles.find((c) => c.stepRate && c.stepRate.steps.length > 0) ?? null, [cycles]);
  const shutInCycles = useMemo(() => cycles.filter(hasShutIn), [cycles]);
  const [tab, setTab] = useState<Tab>(type === 'srt' ? 'steprate' : type === 'dfit' ? 'shutin' : 'volume');
  // A step-rate test whose analysis found no stabilised steps opens on the volume chart.
  const shown: Tab = analysis && tab === 'steprate' && !stepCycle ? 'volume' : tab;
  const [range, setRange] = useState<[number, number] | null>(null);
  const [chosenShutInCycle, setShutInCycle] = useState<number | null>(null);
  const shutInCycle = chosenShutInCycle ?? shutInCycles[0]?.cycle.index ?? 1;
  const [showGauge, setShowGauge] = useState(correction !== 0);
  const picks = useMemo(() => (analysis ? placedPicks(analysis) : []), [analysis]);
  // The diagnostic charts (shut-in series over every shut-in sample, above all) are built
  // once the pressure-time chart has been on screen for a frame, so a long record shows at once.
  const [diagnosticsReady, setDiagnosticsReady] = useState(false);
  useEffect(() => {
    let frame = requestAnimationFrame(() => { frame = requestAnimationFrame(() => { timer = window.setTimeout(() => setDiagnosticsReady(true), 0); }); });
    let timer = 0;
    return () => { cancelAnimationFrame(frame); clearTimeout(timer); };
  }, []);

  // Printing (print dialog, save as PDF, or print media): the time chart is drawn without its
  // zoom slider. The change is flushed at once so the chart is redrawn before the page is laid out.
  const [printing, setPrinting] = useState(false);
  useEffect(() => {
    const media = window.matchMedia?.('print');
    const set = (on: boolean) => flushSync(() => setPrinting(on));
    const before = () => set(true);
    const after = () => set(media?.matches ?? false);
    const change = (e: MediaQueryListEvent) => set(e.matches);
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    media?.addEventListener?.('change', change);
    return () => { window.removeEventListener('beforeprint', before); window.removeEventListener('afterprint', after); media?.removeEventListener?.('change', change); };
  }, []);

  const rangeSeconds = useMemo<[number, number] | null>(() => (range ? [fromDisplay(units, 'time', range[0]), fromDisplay(units, 'time', range[1])] : null), [range, units]);
  // The thinned record (min/max per pixel column for a long one): depends on the samples and the view only.
  const recordOption = useMemo(() => timeChartOption({
    time, gaugePressure: pressure, downholePressure: downhole, rate, picks: [], units, target: TARGET, range: rangeSeconds, showGauge,
  }), [time, pressure, downhole, rate, units, rangeSeconds, showGauge]);
  const timeOption = useMemo(() => {
    const withPicks = picks.length === 0 ? recordOption
      : { ...recordOption, series: [...(recordOption.series as object[]), ...timeChartPickSeries(picks, units)] } as ChartOption;
    return withZoomSlider(withPicks, !printing);
  }, [recordOption, picks, units, printing]);
  const volumeOption = useMemo(() => (analysis && diagnosticsReady && shown === 'volume' ? volumeChartOption({ time, volume, downholePressure: downhole, cycles, units, target: TARGET }) : null),
    [analysis, diagnosticsReady, shown, time, volume, downhole, cycles, units]);
  // The shut-in arrays (every shut-in sample) are computed in the analysis worker when the tab
  // is shown, once per cycle and series: switching back to a cycle draws it at once.
  const [shutInCache, setShutInCache] = useState<ShutInCache>(() => ({ time, downhole, entries: new Map() }));
  // Keys asked of the worker for the current series (read and written in the effect only).
  const shutInAsked = useRef<{ time: Float64Array; downhole: Float64Array; keys: Set<string> } | null>(null);
  const shutInCycleAnalysis = useMemo(() => cycles.find((x) => x.cycle.index === shutInCycle && hasShutIn(x)) ?? null, [cycles, shutInCycle]);
  const shutInKey = shutInCycleAnalysis ? `${shutInCycleAnalysis.cycle.index}:${shutInCycleAnalysis.cycle.pumpStart}:${shutInCycleAnalysis.cycle.pumpEnd}:${shutInCycleAnalysis.cycle.shutInEnd}` : null;
  const wantShutIn = diagnosticsReady && shown === 'shutin';
  useEffect(() => {
    if (!wantShutIn || !shutInCycleAnalysis || !shutInKey) return;
    if (!shutInAsked.current || shutInAsked.current.time !== time || shutInAsked.current.downhole !== downhole) {
      shutInAsked.current = { time, downhole, keys: new Set() };
    }
    const asked = shutInAsked.current.keys;
    if (asked.has(shutInKey)) return;
    asked.add(shutInKey);
    const current = shutInAsked.current;
    // A reply for a series no longer shown (the analysis changed the downhole pressure) is dropped.
    const settle = (entry: ShutInEntry) => shutInAsked.current === current && setShutInCache((prev) => {
      const entries = new Map(prev.time === time && prev.downhole === downhole ? prev.entries : []);
      entries.set(shutInKey, entry);
      return { time, downhole, entries };
    });
    const slice = shutInSlice(time, downhole, shutInCycleAnalysis);
    let request: Promise<ShutInArrays | null>;
    try {
      request = slice ? engine.shutInDiagnostics(shutInCycleAnalysis.cycle.index, slice.time, slice.downhole, slice.pumpingTime) : Promise.resolve(null);
    } catch {
      request = Promise.resolve(null);
    }
    request.then((arrays) => settle(arrays ?? 'none'), () => settle('none'));
  }, [wantShutIn, shutInCycleAnalysis, shutInKey, engine, time, downhole]);
  const shutInEntries = shutInCache.time === time && shutInCache.downhole === downhole ? shutInCache.entries : null;
  const shutInEntry: ShutInEntry | undefined = wantShutIn && shutInKey ? (shutInEntries?.get(shutInKey) ?? 'computing') : undefined;
  const shutIn = useMemo(() => {
    if (!shutInCycleAnalysis || !shutInEntry || typeof shutInEntry !== 'object') return null;
    try { return shutInSeriesOf(shutInEntry, shutInCycleAnalysis); } catch { return null; }
  }, [shutInEntry, shutInCycleAnalysis]);
  const shutInOptions = useMemo(() => (shutIn ? {
    g: gFunctionChartOption(shutIn, units, 1200), sqrt: sqrtTimeChartOption(shutIn, units, 1200), log: logLogChartOption(shutIn, units, 1200),
  } : null), [shutIn, units]);
  const stepOption = useMemo(() => (shown === 'steprate' && stepCycle ? stepRateChartOption({ cycle: stepCycle, units }) : null), [shown, stepCycle, units]);
  const overlayOption = useMemo(() => (analysis && diagnosticsReady && shown === 'overlay' ? cyclesOverlayOption({ time, downholePressure: downhole, cycles, units, target: TARGET }) : null),
    [analysis, diagnosticsReady, shown, time, downhole, cycles, units]);

  const cycleOf = (n: number) => cycles.find((c) => c.cycle.index === n);

  /** Converts a drop on one chart into the sample it means. */
  const drop = (chart: 'time' | 'volume' | 'g' | 'sqrt' | 'step') => (d: PickDrop) => {
    const key = parsePickKey(d.key);
    if (!key) return;
    const c = cycleOf(key.cycle);
    if (!c) return;
    const [lo, hi] = pickRange(c, key.kind);
    let sampleIndex: number;
    let rateAt: number | undefined;
    let pressureAt: number | undefined;
    switch (chart) {
      case 'time': sampleIndex = nearestIndex(time, fromDisplay(units, 'time', d.x), lo, hi); break;
      case 'volume': {
        const v0 = volume[c.cycle.pumpStart];
        sampleIndex = nearestIndexUnsorted(volume.map((v) => v - v0), fromDisplay(units, 'volume', d.x), lo, hi);
        break;
      }
      case 'g':
      case 'sqrt': {
        if (!shutIn) return;
        const series = chart === 'g' ? shutIn.g : shutIn.rootDt;
        sampleIndex = c.cycle.pumpEnd + nearestIndex(series, d.x);
        break;
      }
      case 'step': {
        rateAt = fromDisplay(units, 'rate', d.x);
        pressureAt = fromDisplay(units, 'pressure', d.y);
        const steps = c.stepRate?.steps ?? [];
        const nearest = steps.reduce((b, s) => (Math.abs(s.rate - rateAt!) < Math.abs(b.rate - rateAt!) ? s : b), steps[0]);
        sampleIndex = nearest ? nearest.endIndex : c.cycle.pumpEnd;
        break;
      }
    }
    onDrop({ cycle: key.cycle, kind: key.kind, proposal: { sampleIndex, pressure: pressureAt, rate: rateAt } });
  };

  const tabs: { id: Tab; label: string; show: boolean }[] = [
    { id: 'volume', label: 'Pressure–volume', show: true },
    { id: 'shutin', label: 'Shut-in diagnostics', show: shutInCycles.length > 0 },
    { id: 'steprate', label: 'Step rate', show: stepCycle !== null },
    { id: 'overlay', label: 'Cycles overlaid', show: cycles.length > 0 },
  ];

  return (
    <div className="stack">
      <section className="panel tight" aria-label="Pressure and rate against time">
        <div className="row" style={{ marginBottom: 4 }}>
          <h2 style={{ margin: 0 }}>Pressure and rate against time</h2><span className="spacer" />
          <label className="row hint" style={{ gap: 4 }}><input type="checkbox" checked={showGauge} onChange={(e) => setShowGauge(e.target.checked)} />Show gauge pressure</label>
          {range && <button className="btn small" type="button" onClick={() => setRange(null)}>Show whole record</button>}
        </div>
        <ChartView option={timeOption} className="chart-box tall" testId="chart-time" label="Downhole pressure and pump rate against time, with the picks" draggable
          onPickDrop={drop('time')} onPickClick={onSelect} onZoom={setRange} highlightKey={selected} />
      </section>
      <section className="panel tight">
        {analysis && (
          <div className="tabs" role="tablist" aria-label="Diagnostic charts">
            {tabs.filter((t) => t.show).map((t) => (
              <button key={t.id} type="button" role="tab" className="tab" aria-selected={shown === t.id} data-testid={`tab-${t.id}`} onClick={() => setTab(t.id)}>{t.label}</button>
            ))}
          </div>
        )}
        <div style={{ paddingTop: analysis ? 8 : 0 }} role={analysis ? 'tabpanel' : undefined}>
          {!analysis && <p className="hint" data-testid="charts-analysing" aria-busy="true">Analysing the record… the picks, fitted lines and diagnostic charts follow in a moment.</p>}
          {analysis && shown === 'volume' && <ChartView option={volumeOption} testId="chart-volume" label="Pressure against pumped volume with the fitted loading line" draggable
            onPickDrop={drop('volume')} onPickClick={onSelect} highlightKey={selected} />}
          {analysis && shown === 'shutin' && (
            <div className="stack">
              <div className="row">
                <label className="row" style={{ gap: 6 }}>Cycle
                  <select value={shutInCycle} onChange={(e) => setShutInCycle(Number(e.target.value))} data-testid="shutin-cycle">
                    {shutInCycles.map((c) => <option key={c.cycle.index} value={c.cycle.index}>Cycle {c.cycle.index}</option>)}
                  </select>
                </label>
                <span className="hint">G-function with G dP/dG · square root of time · log-log derivative</span>
              </div>
              {shutInOptions ? (
                <div className="stack">
                  <ChartView option={shutInOptions.g} className="chart-box" testId="chart-gfunction" label="G-function plot" draggable onPickDrop={drop('g')} onPickClick={onSelect} highlightKey={selected} />
                  <div className="chart-row">
                  <ChartView option={shutInOptions.sqrt} className="chart-box small" testId="chart-sqrt" label="Square root of time plot" draggable onPickDrop={drop('sqrt')} onPickClick={onSelect} highlightKey={selected} />
                  <ChartView option={shutInOptions.log} className="chart-box small" testId="chart-loglog" label="Log-log derivative plot" />
                  </div>
                </div>
              ) : !diagnosticsReady ? <p className="hint">Preparing the shut-in diagnostics…</p>
                : shutInEntry === 'none' || !shutInCycleAnalysis ? <p className="hint">This cycle has no shut-in long enough to diagnose.</p>
                  : <p className="hint" data-testid="shutin-computing" aria-busy="true">Computing diagnostics…</p>}
            </div>
          )}
          {analysis && shown === 'steprate' && (stepOption
            ? <ChartView option={stepOption} testId="chart-steprate" label="Step-rate plot of stabilised pressure against rate" draggable onPickDrop={drop('step')} onPickClick={onSelect} highlightKey={selected} />
            : <p className="hint">No stabilised steps were found.</p>)}
          {analysis && shown === 'overlay' && <ChartView option={overlayOption} testId="chart-overlay" label="All cycles overlaid" />}
        </div>
      </section>
    </div>
  );
}
