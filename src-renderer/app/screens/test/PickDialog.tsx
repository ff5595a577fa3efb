import { useEffect, useMemo, useState } from 'react';
import type { TestDetail } from '../../../archive/api';
import { MINIMUM_REASON_LENGTH } from '../../../archive/review-rules';
import { PICK_KINDS, type Grade, type Pick, type PickKind } from '../../../engine/result';
import type { UnitSystem } from '../../../engine/units/unitSystem';
import { Dialog } from '../../components/Dialog';
import { GradeBadge, PickMarker } from '../../components/Badges';
import { PICK_STYLE } from '../../charts/style';
import { useApp } from '../../context';
import { formatQuantity, fromDisplay, toDisplay, unitLabel } from '../../format/units';
import { methodWords } from '../../format/methodWords';
import { manualPickAt, nearestIndex, pickRange, previewOptions, recordOfDetail } from '../../state/pickPlacement';

export interface PickEditRequest {
  cycle: number;
  kind: PickKind;
  /** Where a drag left the pick (sample index, and the pressure at the pointer). */
  proposal?: { sampleIndex: number; pressure?: number; rate?: number };
  /** Let the engineer choose the kind (adding a pick the analysis did not find). */
  chooseKind?: boolean;
}

function round(v: number, digits: number): string {
  return Number.isFinite(v) ? String(Number(v.toFixed(digits))) : '';
}

/** Type in or confirm a pick position; a reason is required and kept in the review log. */
export function PickDialog({ detail, request, units, limits, onSave, onClose }: {
  detail: TestDetail; request: PickEditRequest; units: UnitSystem; limits: Record<string, number>;
  onSave: (cycle: number, kind: PickKind, pick: Pick | null, reason: string) => Promise<void>; onClose: () => void;
}) {
  const { engine } = useApp();
  const { time } = detail.samples;
  const downhole = detail.analysis.downholePressure;
  const [cycle, setCycle] = useState(request.cycle);
  const [kind, setKind] = useState<PickKind>(request.kind);
  const cycleAnalysis = detail.analysis.cycles.find((c) => c.cycle.index === cycle) ?? detail.analysis.cycles[0];
  const current = cycleAnalysis?.picks[kind];
  const startIndex = request.proposal?.sampleIndex ?? current?.sampleIndex ?? cycleAnalysis?.cycle.pumpEnd ?? 0;
  const [timeText, setTimeText] = useState(() => round(toDisplay(units, 'time', time[startIndex]), 3));
  const [useCurve, setUseCurve] = useState(request.proposal?.pressure === undefined);
  const [pressureText, setPressureText] = useState(() => round(toDisplay(units, 'pressure', request.proposal?.pressure ?? current?.pressure ?? downhole[startIndex]), 3));
  const [rateText, setRateText] = useState(() => (kind === 'extension' ? round(toDisplay(units, 'rate', request.proposal?.rate ?? current?.rate ?? 0), 4) : ''));
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [previewGrade, setPreviewGrade] = useState<Grade | null>(null);

  const parsed = useMemo(() => {
    const t = Number(timeText.replace(',', '.'));
    if (!Number.isFinite(t) || !cycleAnalysis) return null;
    const [lo, hi] = pickRange(cycleAnalysis, kind);
    const sample = nearestIndex(time, fromDisplay(units, 'time', t), lo, hi);
    const p = useCurve ? downhole[sample] : fromDisplay(units, 'pressure', Number(pressureText.replace(',', '.')));
    if (!Number.isFinite(p)) return null;
    const rate = kind === 'extension' && rateText ? fromDisplay(units, 'rate', Number(rateText.replace(',', '.'))) : undefined;
    return { sample, pressure: p, rate };
  }, [timeText, pressureText, rateText, useCurve, cycleAnalysis, kind, time, downhole, units]);

  useEffect(() => {
    if (!parsed) { setPreviewGrade(null); return; }
    let alive = true;
    const pick = manualPickAt(kind, parsed.sample, time, downhole, reason || 'preview', parsed.pressure, parsed.rate);
    const timer = setTimeout(() => {
      engine.analyse(recordOfDetail(detail), previewOptions(detail, limits, { cycle, kind, pick, reason: reason || 'preview' }))
        .then((a) => { if (alive) setPreviewGrade(a.quality.grade); })
        .catch(() => { if (alive) setPreviewGrade(null); });
    }, 250);
    return () => { alive = false; clearTimeout(timer); };
  }, [parsed, kind, cycle, detail, limits, engine, time, downhole, reason]);

  const reasonOk = reason.trim().length >= MINIMUM_REASON_LENGTH;
  const save = async (remove: boolean) => {
    setBusy(true); setError(null);
    try {
      const pick = remove || !parsed ? null : manualPickAt(kind, parsed.sample, time, downhole, reason.trim(), parsed.pressure, parsed.rate);
      await onSave(cycle, kind, pick, reason.trim());
      onClose();
    } catch (e) { setError(e instanceof Error ? e.message : String(e)); setBusy(false); }
  };

  return (
    <Dialog title={current ? `Move the ${PICK_STYLE[kind].name.toLowerCase()}` : 'Set a pick by hand'} onClose={onClose} testId="pick-dialog">
      {request.chooseKind ? (
        <div className="row">
          <label className="field">Cycle
            <select value={cycle} onChange={(e) => setCycle(Number(e.target.value))} data-testid="pick-cycle">
              {detail.analysis.cycles.map((c) => <option key={c.cycle.index} value={c.cycle.index}>Cycle {c.cycle.index}</option>)}
            </select>
          </label>
          <label className="field">Pick
            <select value={kind} onChange={(e) => setKind(e.target.value as PickKind)} data-testid="pick-kind">
              {PICK_KINDS.map((k) => <option key={k} value={k}>{PICK_STYLE[k].name} ({PICK_STYLE[k].short})</option>)}
            </select>
          </label>
        </div>
      ) : (
        <p><PickMarker kind={kind} />{PICK_STYLE[kind].name}, cycle {cycle}.{' '}
          {current ? <>Now at {formatQuantity(units, 'pressure', current.pressure)}, {formatQuantity(units, 'time', current.time)} ({current.manual ? 'set by hand' : `automatic: ${methodWords(current.method)}`}).</> : 'The analysis has no such pick.'}</p>
      )}
      {(detail.summary.state === 'accepted' || detail.summary.state === 'rejected') && (
        <div className="notice warn" data-testid="pick-reopens">This test is {detail.summary.state}. Changing a pick reopens its review; it will need a new sign-off.</div>
      )}
      <div className="row">
        <label className="field">Time ({unitLabel(units, 'time')})
          <input type="text" value={timeText} onChange={(e) => setTimeText(e.target.value)} data-testid="pick-time" size={10} />
        </label>
        <label className="field">Pressure ({unitLabel(units, 'pressure')})
          <input type="text" value={useCurve && parsed ? round(toDisplay(units, 'pressure', parsed.pressure), 3) : pressureText} disabled={useCurve}
            onChange={(e) => setPressureText(e.target.value)} data-testid="pick-pressure" size={10} />
        </label>
        {kind === 'extension' && (
          <label className="field">Rate ({unitLabel(units, 'rate')})
            <input type="text" value={rateText} onChange={(e) => setRateText(e.target.value)} data-testid="pick-rate" size={8} />
          </label>
        )}
      </div>
      <label className="row" style={{ gap: 6 }}>
        <input type="checkbox" checked={useCurve} onChange={(e) => { setUseCurve(e.target.checked); if (!e.target.checked && parsed) setPressureText(round(toDisplay(units, 'pressure', parsed.pressure), 3)); }} />
        Take the pressure from the downhole curve at this time
      </label>
      <label className="field">Reason for the change (required, kept in the review log)
        <textarea value={reason} onChange={(e) => setReason(e.target.value)} data-testid="pick-reason" />
      </label>
      <p className="hint" data-testid="pick-preview">
        {previewGrade ? <>Grade with this change: <GradeBadge grade={previewGrade} /> (now {detail.analysis.quality.grade})</> : 'Working out the grade with this change…'}
      </p>
      {error && <p className="error-text" role="alert">{error}</p>}
      <div className="actions">
        {current && <button type="button" className="btn danger" disabled={!reasonOk || busy} onClick={() => void save(true)} data-testid="pick-remove">Remove pick</button>}
        <span className="spacer" />
        <button type="button" className="btn" onClick={onClose}>Cancel</button>
        <button type="button" className="btn primary" disabled={!reasonOk || !parsed || busy} onClick={() => void save(false)} data-testid="pick-save">Save pick</button>
      </div>
    </Dialog>
  );
}
