import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { TestDetail, TestHeader } from '../../../archive/api';
import type { Pick, PickKind } from '../../../engine/result';
import { useApp } from '../../context';
import { ConflictBadge, GradeBadge, SafetyNote, StateBadge } from '../../components/Badges';
import { ReasonDialog } from '../../components/Dialog';
import { placedPicks } from '../../charts/options';
import { formatQuantity } from '../../format/units';
import { canRedo, canUndo, emptyHistory, historyShortcut, recordEdit, redoStep, undoStep, type PickHistory } from '../../state/pickHistory';
import { PickDialog, type PickEditRequest } from './PickDialog';
import { PickPanel } from './PickPanel';
import { QualityPanel } from './QualityPanel';
import { ReviewPanel } from './ReviewPanel';
import { StressPanel, stressAttention } from './StressPanel';
import { TestCharts } from './TestCharts';

type SideTab = 'quality' | 'stress' | 'picks' | 'review';
const SIDE_TABS: { id: SideTab; label: string }[] = [
  { id: 'quality', label: 'Quality' }, { id: 'stress', label: 'Stresses' }, { id: 'picks', label: 'Picks' }, { id: 'review', label: 'Review' },
];

/** A panel waiting for the analysis of the test (it arrives from the analysis worker a moment after the record is drawn). */
function Analysing({ title, testId }: { title: string; testId: string }) {
  return (
    <section className="panel stack" aria-busy="true" data-testid={testId}>
      <h2 style={{ margin: 0 }}>{title}</h2>
      <p className="hint">Analysing…</p>
    </section>
  );
}

/**
 * The review of one test, opened progressively: the stored record (summary, samples,
 * downhole pressure) is drawn as soon as it is read; the analysis (picks, fitted lines,
 * diagnostics, criteria, stresses) follows from the analysis worker and fills the panels
 * that wait for it.
 */
export function TestScreen({ testId }: { testId: string }) {
  const [side, setSide] = useState<SideTab>('quality');
  const { archive, bridge, user, units, setUnits, navigate, notify } = useApp();
  const [header, setHeader] = useState<TestHeader | null>(null);
  const [detail, setDetail] = useState<TestDetail | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [limits, setLimits] = useState<Record<string, number>>({});
  const [selected, setSelected] = useState<string | null>(null);
  const [editing, setEditing] = useState<PickEditRequest | null>(null);
  const [resetting, setResetting] = useState(false);
  const [history, setHistory] = useState<PickHistory>(() => emptyHistory(testId));
  const historyRef = useRef(history);
  useEffect(() => { historyRef.current = history; }, [history]);
  const live = useRef(true);
  useEffect(() => { live.current = true; return () => { live.current = false; }; }, []);
  const fail = useCallback((e: unknown) => { if (live.current) setError(e instanceof Error ? e.message : String(e)); }, []);

  // The record first (no engine run); an archive without the progressive reads gives the whole detail at once.
  useEffect(() => {
    if (archive.getTestHeader && archive.getTestDetail) archive.getTestHeader(testId).then((h) => { if (live.current) setHeader(h); }).catch(fail);
    else archive.getTest(testId).then((d) => { if (live.current) setDetail(d); }).catch(fail);
    void archive.getSettings().then((s) => { if (live.current) setLimits(s.limits); });
  }, [archive, testId, fail]);

  // The analysis once the record's frame has been drawn (the request copies the samples to the worker).
  useEffect(() => {
    if (!header || !archive.getTestDetail) return;
    let timer = 0;
    const frame = requestAnimationFrame(() => {
      timer = window.setTimeout(() => { archive.getTestDetail!(header).then((d) => { if (live.current) setDetail(d); }).catch(fail); }, 0);
    });
    return () => { cancelAnimationFrame(frame); clearTimeout(timer); };
  }, [header, archive, fail]);

  const reload = useCallback(() => {
    const next = header && archive.getTestDetail ? archive.getTestDetail(header) : archive.getTest(testId);
    next.then((d) => { if (live.current) setDetail(d); }).catch(fail);
  }, [archive, testId, header, fail]);

  const applyChange = useCallback(async (cycle: number, kind: PickKind, pick: Pick | null, reason: string) => {
    const next = await archive.movePick(testId, cycle, kind, pick, reason, user);
    setDetail(next);
    return next;
  }, [archive, testId, user]);

  const savePick = useCallback(async (cycle: number, kind: PickKind, pick: Pick | null, reason: string) => {
    const before = detail?.analysis.cycles.find((c) => c.cycle.index === cycle)?.picks[kind] ?? null;
    const next = await applyChange(cycle, kind, pick, reason);
    setHistory((h) => recordEdit(h, { cycle, kind, before, after: pick, reason }));
    notify(`Pick saved. Grade now ${next.analysis.quality.grade}.`);
  }, [detail, applyChange, notify]);

  const undo = useCallback(async () => {
    const step = undoStep(historyRef.current);
    if (!step) return;
    setHistory(step.next);
    try { await applyChange(step.apply.cycle, step.apply.kind, step.apply.after ? { ...step.apply.after, manual: true, reason: step.apply.reason } : null, step.apply.reason); notify('Pick change undone.'); }
    catch (e) { notify(e instanceof Error ? e.message : String(e)); }
  }, [applyChange, notify]);
  const redo = useCallback(async () => {
    const step = redoStep(historyRef.current);
    if (!step) return;
    setHistory(step.next);
    try { await applyChange(step.apply.cycle, step.apply.kind, step.apply.after, step.apply.reason); notify('Pick change redone.'); }
    catch (e) { notify(e instanceof Error ? e.message : String(e)); }
  }, [applyChange, notify]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.tagName === 'SELECT' || t.isContentEditable)) return;
      const command = historyShortcut(e);
      if (command) { e.preventDefault(); void (command === 'undo' ? undo() : redo()); }
    };
    window.addEventListener('keydown', onKey);
    const off = bridge.onMenuCommand((c) => {
      if (c === 'undo') void undo();
      if (c === 'redo') void redo();
      const shown = detail ?? header;
      if (c === 'print-report' && shown) void bridge.printReport(`${shown.summary.wellName}-${shown.summary.type}-review.pdf`);
    });
    return () => { window.removeEventListener('keydown', onKey); off(); };
  }, [undo, redo, bridge, detail, header]);

  const picks = useMemo(() => (detail ? placedPicks(detail.analysis) : []), [detail]);

  if (error) return <div className="page" data-testid="screen-test"><div className="notice bad" role="alert">{error}</div></div>;
  const a = detail?.analysis ?? null;
  // The series drawn: the header's (kept across re-analyses, so the record is thinned once), else the analysis's.
  const samples = header?.samples ?? detail?.samples ?? null;
  const downhole = header?.downholePressure ?? a?.downholePressure ?? null;
  const correction = header?.hydrostaticCorrection ?? a?.hydrostaticCorrection ?? 0;
  if (!samples || !downhole || !(detail ?? header)) return <div className="page" data-testid="screen-test" aria-busy="true"><p className="hint">Loading the test…</p></div>;

  const s = detail?.summary ?? header!.summary;
  const m = (detail ?? header)!.metadata;
  const type = a?.type ?? s.type;
  const typeInferred = a?.typeInferred ?? s.typeInferred;
  return (
    <div className="page" data-testid="screen-test" data-test-id={s.id} data-analysed={a ? 'true' : 'false'}>
      <div className="test-head">
        <button type="button" className="btn small no-print" onClick={() => navigate({ screen: 'archive' })}>← Archive</button>
        <div>
          <h1 data-testid="test-title">{s.wellName} · {type.toUpperCase()}{typeInferred ? <span className="hint" style={{ fontSize: 13 }}> (type inferred)</span> : null}</h1>
          <div className="facts">
            <span>Field <b>{s.fieldName}</b></span>
            <span>TVD <b>{formatQuantity(units, 'depth', s.depthTvd)}</b></span>
            <span>MD <b>{formatQuantity(units, 'depth', s.depthMd)}</b></span>
            <span>Mud <b>{formatQuantity(units, 'density', m.mudDensity ?? null)}</b></span>
            {m.holeDiameter !== undefined && <span>Hole <b data-testid="hole-diameter">{formatQuantity(units, 'diameter', m.holeDiameter)}</b></span>}
            <span>Gauge <b>{m.gaugePosition ?? 'surface'}</b></span>
            <span>File <b className="mono">{s.fileName}</b></span>
            <span>Imported by <b>{s.importedBy}</b></span>
          </div>
        </div>
        <div className="head-right">
        <GradeBadge grade={a ? a.quality.grade : s.grade} large />
        <StateBadge state={s.state} />
        <ConflictBadge count={s.openConflicts?.length ?? 0} />
        <div className="row no-print" role="group" aria-label="Units">
          <button type="button" className={`btn small${units === 'si' ? ' primary' : ''}`} aria-pressed={units === 'si'} onClick={() => setUnits('si')} data-testid="units-si">SI</button>
          <button type="button" className={`btn small${units === 'oilfield' ? ' primary' : ''}`} aria-pressed={units === 'oilfield'} onClick={() => setUnits('oilfield')} data-testid="units-oilfield">Oilfield</button>
        </div>
        <button type="button" className="btn small no-print" onClick={() => navigate({ screen: 'report', testId: s.id })} data-testid="open-report">Report</button>
        <button type="button" className="btn small no-print" onClick={() => navigate({ screen: 'report', wellName: s.wellName })} data-testid="open-well-report">Well report</button>
        <button type="button" className="btn small no-print" onClick={() => void bridge.printReport(`${s.wellName}-${type}-review.pdf`)} data-testid="print-report">Print</button>
        </div>
      </div>
      {(s.openConflicts?.length ?? 0) > 0 && (
        <div className="notice bad" data-testid="test-conflict-notice">
          Two people changed this test without seeing each other&apos;s change. Nothing was chosen for you:{' '}
          <button type="button" className="btn link" onClick={() => navigate({ screen: 'team' })}>decide the conflict on the Team screen</button>.
        </div>
      )}
      {a && a.warnings.length > 0 && <div className="notice warn"><b>Analysis notes:</b> {a.warnings.join(' ')}</div>}
      <div className="review">
        <TestCharts samples={samples} downhole={downhole} correction={correction} type={type} analysis={a} units={units} selected={selected} onSelect={(k) => { setSelected(k); setSide('picks'); }} onDrop={setEditing} />
        <div className="side">
          <div className="tabs" role="tablist" aria-label="Test details">
            {SIDE_TABS.map((t) => {
              // The stress tab is marked only for something beyond the caution every SHmax carries.
              const attention = t.id === 'stress' && a ? stressAttention(a.stress) : [];
              return (
                <button key={t.id} type="button" role="tab" className="tab" aria-selected={side === t.id} data-testid={`side-tab-${t.id}`}
                  title={attention.length ? attention.join('; ') : undefined} onClick={() => setSide(t.id)}>
                  {t.label}{attention.length ? <span data-testid="stress-attention" aria-label={`needs attention: ${attention.join('; ')}`}> ⚠</span> : null}
                </button>
              );
            })}
          </div>
          {/* Every panel stays mounted: the inactive ones are hidden on screen and printed in the report. */}
          <div className={side === 'quality' ? undefined : 'print-only'}>{a ? <QualityPanel quality={a.quality} limits={limits} /> : <Analysing title="Quality" testId="quality-analysing" />}</div>
          <div className={side === 'stress' ? undefined : 'print-only'}>{a ? <StressPanel stress={a.stress} units={units} tvd={s.depthTvd} /> : <Analysing title="Stress estimates at test depth" testId="stress-analysing" />}</div>
          <div className={side === 'picks' ? undefined : 'print-only'}>{detail && a ? <PickPanel picks={picks} units={units} selected={selected} onSelect={setSelected}
            onEdit={(cycle, kind) => setEditing({ cycle, kind })}
            onReset={detail.manualPicks.length ? () => setResetting(true) : null} onAdd={() => setEditing({ cycle: a.cycles[0]?.cycle.index ?? 1, kind: 'closure', chooseKind: true })}
            canUndo={canUndo(history)} canRedo={canRedo(history)} onUndo={() => void undo()} onRedo={() => void redo()} /> : <Analysing title="Picks" testId="picks-analysing" />}</div>
          <div className={side === 'review' ? undefined : 'print-only'}>{detail ? <ReviewPanel detail={detail} onChanged={reload} /> : <Analysing title="Review" testId="review-analysing" />}</div>
        </div>
      </div>
      <SafetyNote />
      {resetting && (
        <ReasonDialog title="Return to the automatic picks" confirmLabel="Use automatic picks"
          explanation="Every pick set by hand on this test is dropped; the analysis picks again. The hand picks stay in the review log."
          onConfirm={async (reason) => { setDetail(await archive.resetPicks(testId, reason, user)); setHistory(emptyHistory(testId)); notify('Back to the automatic picks.'); }}
          onClose={() => setResetting(false)} />
      )}
      {editing && detail && <PickDialog detail={detail} request={editing} units={units} limits={limits} onSave={savePick} onClose={() => setEditing(null)} />}
    </div>
  );
}
