/**
 * The regional stress model screen: the depth plot (TVD down) of Sv, Pp, the Shmin trend
 * from accepted tests with its bands, SHmax bounds and the tests themselves; the choice of
 * field and wells, axis (pressure / gradient / EMW), model inputs (gradients, a density log,
 * pore-pressure measurements, a well's survey for the MD column), and the CSV / XLSX
 * export of the stress table. The logic lives in engine/model and engine/export; this
 * component only holds the choices and draws.
 */
import { useMemo, useState, type CSSProperties } from 'react';
import { ChartView } from '../../components/ChartView';
import { SafetyNote } from '../../components/Badges';
import { fromDisplay, toDisplay, unitLabel, type UnitSystem } from '../../format/units';
import { stressTableCsv } from '../../../engine/export/csv';
import { stressTableXlsx } from '../../../engine/export/xlsx';
import { porePressureFromGradient, porePressureFromMeasurements } from '../../../engine/model/pore-pressure';
import { parsePorePressureFile, pointsOfWell, type PorePressurePoint } from '../../../engine/model/pore-pressure-file';
import { measuredDepthAtTvd, trueVerticalDepthAtMd, wellPathFromSurvey } from '../../../engine/model/well-path';
import { parseSurveyFile } from '../../../engine/import/survey-import';
import { buildRegionalModel, stressTable, type ModelTestInput, type RegionalModel, type StressTableRow } from '../../../engine/model/regional-model';
import { parseLasFile } from '../../../engine/import/lasImport';
import type { DepthLog } from '../../../engine/record';
import { verticalStressFromDensityLog, verticalStressFromGradient } from '../../../engine/model/vertical-stress';
import { depthPlotOption, wellColors, GRADE_SYMBOL, type DepthAxisMode } from './depthPlotOption';
import { testsHaveFormations, trendOptionsForChoice, type TrendChoice } from './modelInputs';

/** Elevations of a well, m (rig floor above sea level or ground; water depth offshore). */
export interface ModelWell {
  /** Archive id of the well (needed to store a survey loaded here). */
  id?: string;
  name: string; fieldName: string; rigFloorElevation?: number; waterDepth?: number;
  /** Directional survey (MD m, inclination and azimuth in degrees); gives the table's MD column when this well alone is chosen. */
  survey?: { md: number; inc: number; azi: number }[];
}

/** Props of {@link StressModelScreen}. All values SI. */
export interface StressModelScreenProps {
  /** Every test on offer, in any review state; only accepted tests are fitted. */
  tests: ModelTestInput[];
  /** Display unit system (SI or oilfield). */
  units: UnitSystem;
  /** Opens a test, called with its id when its point or row is clicked. */
  onOpenTest: (testId: string) => void;
  /** Saves export bytes: the bridge's saveFile (native dialog in Electron, download on the web). */
  saveFile: (suggestedName: string, bytes: Uint8Array, mimeType: string) => Promise<string | null>;
  /** Application version written into the export provenance. */
  appVersion: string;
  /** Who exports, written into the provenance. */
  user?: string;
  /** Well elevations, to prefill rig floor and water depth when one well is chosen. */
  wells?: ModelWell[];
  /** Short message to the user (export saved, failed). */
  notify?: (text: string) => void;
  /** True while the tests are being loaded. */
  loading?: boolean;
  /** Lets the user pick a bulk-density log (LAS) for Sv: the bridge's openFiles. Without it the screen offers gradients only. */
  openFiles?: (options: { accept?: string[]; multiple?: boolean }) => Promise<{ name: string; bytes: Uint8Array }[]>;
  /** Stores a survey loaded here for a well without one (the archive's setWellSurvey); without it no survey can be loaded. */
  saveWellSurvey?: (well: ModelWell, stations: { md: number; inc: number; azi: number }[], sourceFile: string) => Promise<void>;
  /** Pore-pressure measurements to start with (otherwise loaded with openFiles). */
  porePressurePoints?: { file: string; points: PorePressurePoint[] } | null;
  /** Trend shape to start with (default one line); "by formation" applies only when tests name their formations. */
  initialTrend?: TrendChoice;
}

const TREND_CHOICES: { id: TrendChoice; label: string }[] = [
  { id: 'one', label: 'one line' },
  { id: 'breaks', label: 'by depth breaks' },
  { id: 'formation', label: 'by formation' },
];

/** Plain words for the marker shapes of the grades. */
const SYMBOL_WORD: Record<string, string> = { circle: 'circle', rect: 'square', triangle: 'triangle', diamond: 'diamond', pin: 'pin' };

/** Right-aligned, tabular figures for number cells. */
const NUM: CSSProperties = { textAlign: 'right', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' };

/** A test's review state in plain words, capitalised. */
function stateWords(state: string): string {
  const words = state.replace(/[-_]/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** The caution naming the tests whose bound contradicts the trend (well, TVD, value). */
function boundCaution(model: RegionalModel, units: UnitSystem): string | null {
  const bad = model.tests.filter((t) => t.boundViolated && t.shmin && t.tvd !== null);
  if (!bad.length) return null;
  const list = bad.map((t) => `${t.well} at TVD ${fmt(toDisplay(units, 'depth', t.tvd!), 0)} ${unitLabel(units, 'depth')}: ${t.shmin!.kind === 'lower-bound' ? 'lower bound' : 'upper bound'} ${fmt(toDisplay(units, 'pressure', t.shmin!.value), units === 'si' ? 2 : 0)} ${unitLabel(units, 'pressure')} (${t.file})`);
  return `The trend contradicts ${bad.length === 1 ? 'a bound' : `${bad.length} bounds`} (a lower bound above the trend, or an upper bound below it): ${list.join('; ')}.`;
}

/** A number with thousands separators and a fixed count of decimals. */
function fmt(v: number, decimals: number): string {
  return v.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

const CSV_MIME = 'text/csv';
const XLSX_MIME = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
const ONE_PSI_PER_FT = 22_620.6;

function numberInput(value: string): number | null {
  const v = Number(value.replace(',', '.'));
  return Number.isFinite(v) ? v : null;
}

/** The depth-plot screen of the regional stress model. */
export function StressModelScreen(props: StressModelScreenProps) {
  const { tests, units, onOpenTest, saveFile, appVersion, user, wells = [], notify, loading, openFiles, saveWellSurvey } = props;
  const [densityLog, setDensityLog] = useState<DepthLog | null>(null);
  const [ppPoints, setPpPoints] = useState<{ file: string; points: PorePressurePoint[] } | null>(props.porePressurePoints ?? null);
  const fields = useMemo(() => [...new Set(tests.map((t) => t.field))].sort(), [tests]);
  const [field, setField] = useState<string>('');
  const activeField = field || fields[0] || '';
  const fieldWells = useMemo(() => [...new Set(tests.filter((t) => t.field === activeField).map((t) => t.well))].sort(), [tests, activeField]);
  const [unchecked, setUnchecked] = useState<Set<string>>(new Set());
  const chosenWells = useMemo(() => fieldWells.filter((w) => !unchecked.has(w)), [fieldWells, unchecked]);
  const [mode, setMode] = useState<DepthAxisMode>('pressure');
  const [showUnaccepted, setShowUnaccepted] = useState(false);
  const [showReferences, setShowReferences] = useState(false);
  const [friction, setFriction] = useState('0.6');
  const [svGradient, setSvGradient] = useState(() => toDisplay(units, 'gradient', ONE_PSI_PER_FT).toFixed(units === 'si' ? 2 : 3));
  const [ppGradient, setPpGradient] = useState(() => toDisplay(units, 'gradient', 10_000).toFixed(units === 'si' ? 2 : 3));
  const single = chosenWells.length === 1 ? wells.find((w) => w.name === chosenWells[0] && (w.fieldName === activeField || !w.fieldName)) : undefined;
  const [waterDepth, setWaterDepth] = useState('');
  const [rigFloor, setRigFloor] = useState('');
  const [step, setStep] = useState(units === 'si' ? '100' : '500');
  const [breaks, setBreaks] = useState('');
  const [trendChoice, setTrendChoice] = useState<TrendChoice>(props.initialTrend ?? 'one');
  // Tests the trend may fit: accepted, of the chosen field and wells (the formations offered come from these).
  const fittable = useMemo(() => tests.filter((t) => t.field === activeField && chosenWells.includes(t.well) && t.state === 'accepted'), [tests, activeField, chosenWells]);
  const formationsOffered = testsHaveFormations(fittable);
  const activeTrend: TrendChoice = trendChoice === 'formation' && !formationsOffered ? 'one' : trendChoice;
  const [busy, setBusy] = useState(false);

  const built = useMemo((): { model: RegionalModel; rows: StressTableRow[]; mudline: number } | { error: string } | null => {
    if (!activeField) return null;
    try {
      const wd = numberInput(waterDepth) ?? (single?.waterDepth !== undefined ? toDisplay(units, 'depth', single.waterDepth) : 0);
      const rf = numberInput(rigFloor) ?? (single?.rigFloorElevation !== undefined ? toDisplay(units, 'depth', single.rigFloorElevation) : 0);
      const overburden = { waterDepth: fromDisplay(units, 'depth', wd), rigFloorElevation: fromDisplay(units, 'depth', rf) };
      const path = single?.survey && single.survey.length > 1 ? wellPathFromSurvey(single.name, single.survey) : null;
      const sv = densityLog
        ? verticalStressFromDensityLog(densityLog, { ...overburden, indexToTvd: path && densityLog.indexKind !== 'tvd' ? (md) => trueVerticalDepthAtMd(path, md) : undefined })
        : verticalStressFromGradient(fromDisplay(units, 'gradient', numberInput(svGradient) ?? NaN), overburden);
      const ppGradientSI = fromDisplay(units, 'gradient', numberInput(ppGradient) ?? NaN);
      let pp = porePressureFromGradient(ppGradientSI, overburden.rigFloorElevation);
      if (ppPoints) {
        const chosen = pointsOfWell(ppPoints.points, single?.name, ppPoints.file);
        pp = porePressureFromMeasurements(chosen.points, { datum: overburden.rigFloorElevation, gradientBelow: ppGradientSI, well: chosen.well });
      }
      const breakDepths = breaks.split(/[;,\s]+/).filter((b) => b !== '').map((b) => fromDisplay(units, 'depth', numberInput(b) ?? NaN));
      const shape = trendOptionsForChoice(activeTrend, fittable, breakDepths);
      const model = buildRegionalModel(tests, {
        field: activeField, wells: chosenWells, acceptedOnly: true, minGrade: 'D',
        frictionCoefficient: numberInput(friction) ?? NaN, verticalStress: sv, porePressure: pp, overburden, trend: shape.trend,
      });
      model.provenance.push(...shape.notes);
      const stepM = fromDisplay(units, 'depth', numberInput(step) ?? NaN);
      if (path) model.provenance.push(path.provenance);
      const depths = model.tests.filter((t) => t.tvd !== null && t.field === activeField).map((t) => t.tvd!);
      const deepest = depths.length ? Math.max(...depths) : 3000;
      const to = Math.max(stepM * 2, Math.ceil((deepest * 1.1) / stepM) * stepM);
      const rows = stressTable(model, { from: stepM, to, step: stepM, well: single?.name, mdAtTvd: path ? (z) => measuredDepthAtTvd(path, z) : undefined });
      return { model, rows, mudline: overburden.rigFloorElevation + overburden.waterDepth };
    } catch (e) {
      return { error: e instanceof Error ? e.message : String(e) };
    }
  }, [tests, activeField, chosenWells, friction, svGradient, ppGradient, waterDepth, rigFloor, step, units, single, densityLog, breaks, ppPoints, activeTrend, fittable]);

  async function loadPorePressurePoints() {
    if (!openFiles) return;
    try {
      const [file] = await openFiles({ accept: ['.csv', '.txt', '.tsv'], multiple: false });
      if (!file) return;
      setPpPoints({ file: file.name, points: parsePorePressureFile(file.bytes, file.name) });
    } catch (e) {
      notify?.(`The pore-pressure measurements could not be used: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  async function loadSurvey() {
    if (!openFiles || !saveWellSurvey || !single) return;
    try {
      const [file] = await openFiles({ accept: ['.csv', '.txt', '.tsv', '.las'], multiple: false });
      if (!file) return;
      const survey = parseSurveyFile(file.bytes, file.name);
      await saveWellSurvey(single, survey.stations, file.name);
      const other = survey.well && survey.well !== single.name ? ` (the file names well ${survey.well})` : '';
      notify?.(`Survey of ${single.name} stored from ${file.name}: ${survey.stations.length} stations${other}.`);
    } catch (e) {
      notify?.(`The survey could not be used: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  async function loadDensityLog() {
    if (!openFiles) return;
    try {
      const [file] = await openFiles({ accept: ['.las'], multiple: false });
      if (!file) return;
      const parsed = parseLasFile(file.bytes, file.name);
      if (parsed.kind !== 'log') throw new Error(`${file.name} is indexed by time, not depth`);
      setDensityLog(parsed.log);
    } catch (e) {
      notify?.(`The density log could not be used: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  const option = useMemo(() => (built && 'model' in built ? depthPlotOption(built.model, built.rows, { mode, units, showUnaccepted, showReferences, mudline: built.mudline }) : null), [built, mode, units, showUnaccepted, showReferences]);

  async function exportTable(format: 'csv' | 'xlsx') {
    if (!built || !('model' in built)) return;
    setBusy(true);
    try {
      const date = new Date().toISOString();
      const context = { appVersion, date, unitSystem: units, title: `${activeField} regional stress table`, author: user };
      const bytes = format === 'csv'
        ? new TextEncoder().encode(stressTableCsv(built.model, built.rows, context))
        : await stressTableXlsx(built.model, built.rows, context);
      const name = `stress-table-${activeField.replace(/[^A-Za-z0-9-]+/g, '-').toLowerCase()}-${date.slice(0, 10)}.${format}`;
      const saved = await saveFile(name, bytes, format === 'csv' ? CSV_MIME : XLSX_MIME);
      if (saved) notify?.(`Saved ${saved}`);
    } catch (e) {
      notify?.(`Export failed: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setBusy(false);
    }
  }

  const model = built && 'model' in built ? built.model : null;
  const seg = model?.trend.segments[0];
  // Lines of intervals (breaks or formations) are shown with their names, even a single one.
  const namedLines = !!model && model.trend.segments.some((sg) => sg.top !== null);
  const colors = model ? wellColors(model) : new Map<string, string>();
  const shownTests = model ? model.tests.filter((t) => t.field === activeField && chosenWells.includes(t.well) && (showUnaccepted || t.state === 'accepted')) : [];
  const showFormation = shownTests.some((t) => !!t.formation);
  const hiddenCount = model ? model.tests.filter((t) => t.field === activeField && chosenWells.includes(t.well) && t.state !== 'accepted').length : 0;
  const pu = unitLabel(units, 'pressure');
  const hasMd = !!built && 'rows' in built && built.rows.some((r) => r.md !== null);
  const p = (v: number | null) => (v === null ? '–' : fmt(toDisplay(units, 'pressure', v), units === 'si' ? 2 : 0));
  const d = (v: number | null) => (v === null ? '–' : fmt(toDisplay(units, 'depth', v), 0));
  const boundNote = model ? boundCaution(model, units) : null;

  return (
    <div className="page" data-testid="screen-model">
      <div className="page-head">
        <div>
          <h1>Stress model</h1>
          <p className="sub">Shmin trend from accepted tests (weighted by grade), SHmax bounds, Sv and Pp against TVD.</p>
        </div>
        <div className="spacer" />
        <button type="button" className="btn" data-testid="export-csv" disabled={!model || busy} onClick={() => void exportTable('csv')}>Export CSV</button>
        <button type="button" className="btn primary" data-testid="export-xlsx" disabled={!model || busy} onClick={() => void exportTable('xlsx')}>Export XLSX</button>
      </div>

      {loading && <p className="hint" aria-busy="true">Loading tests…</p>}
      {!loading && fields.length === 0 && <div className="panel empty">No tests in the archive yet.</div>}

      {fields.length > 0 && (
        <div className="panel tight stack">
          <div className="row">
            <label>Field{' '}
              <select value={activeField} data-testid="model-field" onChange={(e) => { setField(e.target.value); setUnchecked(new Set()); }}>
                {fields.map((f) => <option key={f} value={f}>{f || '(no field)'}</option>)}
              </select>
            </label>
            <span className="hint">Wells:</span>
            {fieldWells.map((w) => (
              <label key={w} className="row" style={{ gap: 4 }}>
                <input type="checkbox" checked={!unchecked.has(w)} data-testid={`model-well-${w}`}
                  onChange={(e) => { const next = new Set(unchecked); if (e.target.checked) next.delete(w); else next.add(w); setUnchecked(next); }} />
                <span aria-hidden="true" style={{ display: 'inline-block', width: 10, height: 10, background: colors.get(w), borderRadius: 2 }} />{w}
              </label>
            ))}
          </div>
          <div className="row" role="group" aria-label="Axis">
            <span className="hint">Axis:</span>
            {(['pressure', 'gradient', 'emw'] as const).map((m) => (
              <button key={m} type="button" className="tab" aria-selected={mode === m} data-testid={`model-axis-${m}`} onClick={() => setMode(m)}>
                {m === 'pressure' ? `Pressure (${unitLabel(units, 'pressure')})` : m === 'gradient' ? `Gradient (${unitLabel(units, 'gradient')})` : `EMW (${unitLabel(units, 'emw')})`}
              </button>
            ))}
            <label className="row" style={{ gap: 4 }}>
              <input type="checkbox" checked={showUnaccepted} data-testid="model-show-unaccepted" onChange={(e) => setShowUnaccepted(e.target.checked)} />
              Show rejected and unreviewed tests ({hiddenCount}), not fitted
            </label>
            <label className="row" style={{ gap: 4 }}>
              <input type="checkbox" checked={showReferences} data-testid="model-show-references" onChange={(e) => setShowReferences(e.target.checked)} />
              Reference correlations (Breckels &amp; van Eekelen, Eaton)
            </label>
          </div>
          <div className="row">
            {densityLog
              ? <span data-testid="model-density-log">Sv from density log {densityLog.fileName} <button type="button" className="btn small" onClick={() => setDensityLog(null)}>Use a gradient</button></span>
              : <label>Sv gradient ({unitLabel(units, 'gradient')}) <input size={6} value={svGradient} onChange={(e) => setSvGradient(e.target.value)} data-testid="model-sv-gradient" /></label>}
            {openFiles && !densityLog && <button type="button" className="btn small" onClick={() => void loadDensityLog()} data-testid="model-load-density">Sv from density log (LAS)…</button>}
            {ppPoints && <span data-testid="model-pp-points">Pp through {ppPoints.points.length} measurements from {ppPoints.file} <button type="button" className="btn small" onClick={() => setPpPoints(null)}>Use a gradient</button></span>}
            {openFiles && !ppPoints && <button type="button" className="btn small" onClick={() => void loadPorePressurePoints()} data-testid="model-load-pp-points">Pp from measurements (CSV)…</button>}
            <label>{ppPoints ? 'Pp gradient below the deepest point' : 'Pp gradient'} ({unitLabel(units, 'gradient')}) <input size={6} value={ppGradient} onChange={(e) => setPpGradient(e.target.value)} data-testid="model-pp-gradient" /></label>
            <label>Friction μ <input size={4} value={friction} onChange={(e) => setFriction(e.target.value)} data-testid="model-friction" /></label>
            <label>Water depth ({unitLabel(units, 'depth')}) <input size={6} value={waterDepth} placeholder={single?.waterDepth !== undefined ? toDisplay(units, 'depth', single.waterDepth).toFixed(0) : '0'} onChange={(e) => setWaterDepth(e.target.value)} /></label>
            <label>Rig floor ({unitLabel(units, 'depth')}) <input size={6} value={rigFloor} placeholder={single?.rigFloorElevation !== undefined ? toDisplay(units, 'depth', single.rigFloorElevation).toFixed(0) : '0'} onChange={(e) => setRigFloor(e.target.value)} /></label>
            <label>Table step ({unitLabel(units, 'depth')}) <input size={5} value={step} onChange={(e) => setStep(e.target.value)} data-testid="model-step" /></label>
            {single && (single.survey && single.survey.length > 1
              ? <span className="hint" data-testid="model-survey">MD of {single.name} from its survey ({single.survey.length} stations)</span>
              : openFiles && saveWellSurvey && single.id !== undefined
                ? <button type="button" className="btn small" onClick={() => void loadSurvey()} data-testid="model-load-survey">Load survey for {single.name}…</button>
                : <span className="hint">{single.name} has no survey: no MD column</span>)}
          </div>
          <div className="row" role="group" aria-label="Trend">
            <span className="hint">Trend:</span>
            {TREND_CHOICES.filter((c) => c.id !== 'formation' || formationsOffered).map((c) => (
              <button key={c.id} type="button" className="tab" aria-selected={activeTrend === c.id} data-testid={`model-trend-${c.id}`} onClick={() => setTrendChoice(c.id)}>{c.label}</button>
            ))}
            {activeTrend === 'breaks' && (
              <label title="TVDs where the trend is split into separate lines, e.g. 1500, 2500">Trend breaks ({unitLabel(units, 'depth')}) <input size={10} value={breaks} placeholder="none" onChange={(e) => setBreaks(e.target.value)} data-testid="model-breaks" /></label>
            )}
            {activeTrend === 'formation' && <span className="hint" data-testid="model-trend-formation-note">One line per formation named in the files; tests without a formation are fitted together as &quot;unnamed&quot;.</span>}
          </div>
        </div>
      )}

      {built && 'error' in built && <div className="notice bad" role="alert" data-testid="model-error">{built.error}</div>}

      {model && (
        <>
          <div className="panel tight" data-testid="model-trend">
            {namedLines && model.trend.segments.map((sg) => (
              <div key={sg.name}>{sg.name}: Shmin = {toDisplay(units, 'pressure', sg.intercept).toFixed(units === 'si' ? 2 : 0)} {unitLabel(units, 'pressure')} + {toDisplay(units, 'gradient', sg.gradient).toFixed(units === 'si' ? 2 : 3)} {unitLabel(units, 'gradient')} × TVD · R² {sg.r2.toFixed(3)} · n {sg.n}</div>
            ))}
            {namedLines ? null : seg
              ? <span>Shmin = {toDisplay(units, 'pressure', seg.intercept).toFixed(units === 'si' ? 2 : 0)} {unitLabel(units, 'pressure')} + {toDisplay(units, 'gradient', seg.gradient).toFixed(units === 'si' ? 2 : 3)} {unitLabel(units, 'gradient')} × TVD · R² {seg.r2.toFixed(3)} · n {seg.n} · {(model.trend.confidence * 100).toFixed(0)} % bands</span>
              : <span>No Shmin trend: {model.trend.provenance.filter((x) => x.startsWith('No trend')).join(' ') || 'no accepted tests with a Shmin value.'}</span>}
            {model.cautions.slice(1).map((c) => <p key={c} className="shmax-caution">{c.startsWith('The trend contradicts') && boundNote ? boundNote : c}</p>)}
          </div>
          <ChartView option={option} label="Depth plot of the regional stress model" testId="model-depth-plot" className="chart-box depth-plot"
            onPickClick={(id) => onOpenTest(id)} />
          <p className="hint">
            Marker shape = grade ({Object.entries(GRADE_SYMBOL).map(([g, s]) => `${g} ${SYMBOL_WORD[s] ?? s}`).join(', ')}); colour = well; arrow = FIT lower bound (never fitted);
            star = SHmax from reopening (indicative); hollow grey = not accepted; hollow blue circle = Pp measurement; dark ring = outlier of the trend. Click a point to open its test.
          </p>
          <div className="panel tight">
            <table className="grid-table" data-testid="model-tests">
              <thead><tr><th>Well</th><th>File</th><th style={NUM}>TVD ({unitLabel(units, 'depth')})</th><th style={NUM}>Shmin ({unitLabel(units, 'pressure')})</th>{showFormation && <th>Formation</th>}<th>Grade</th><th>State</th><th>Signed off by</th><th>In fit</th></tr></thead>
              <tbody>
                {shownTests.map((t) => (
                  <tr key={t.testId} data-testid="model-test-row">
                    <td>{t.well}</td>
                    <td><button type="button" className="btn link" onClick={() => onOpenTest(t.testId)}>{t.file}</button></td>
                    <td style={NUM}>{d(t.tvd)}</td>
                    <td style={NUM}>{t.shmin && t.shmin.kind !== 'estimate' ? <span className="hint">{t.shmin.kind.replace('-', ' ')} </span> : null}{p(t.shmin?.value ?? null)}</td>
                    {showFormation && <td>{t.formation ?? '–'}</td>}
                    <td>{t.grade}</td><td>{stateWords(t.state)}</td><td>{t.state === 'accepted' ? t.reviewer ?? '–' : '–'}</td>
                    <td>{t.used ? (t.outlier ? 'yes, outlier' : 'yes') : `no${t.reason ? `: ${t.reason}` : t.role === 'lower-bound' ? ': lower bound' : ''}`}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <details className="panel tight">
            <summary>Stress table ({built && 'rows' in built ? built.rows.length : 0} rows) and provenance</summary>
            <table className="grid-table" data-testid="model-table">
              <thead><tr><th style={NUM}>TVD ({unitLabel(units, 'depth')})</th>{hasMd && <th style={NUM}>MD ({unitLabel(units, 'depth')})</th>}<th style={NUM}>Pp ({pu})</th><th style={NUM}>Shmin ({pu})</th><th style={NUM}>Shmin low–high ({pu})</th><th style={NUM}>SHmax high ({pu})</th><th style={NUM}>Sv ({pu})</th><th>Regime</th>{namedLines && <th>Trend line</th>}</tr></thead>
              <tbody>
                {built && 'rows' in built && built.rows.map((r) => (
                  <tr key={r.tvd}><td style={NUM}>{d(r.tvd)}</td>{hasMd && <td style={NUM}>{d(r.md)}</td>}<td style={NUM}>{p(r.pp)}</td><td style={NUM}>{p(r.shmin)}</td><td style={NUM}>{p(r.shminLow)}–{p(r.shminHigh)}</td><td style={NUM}>{p(r.shmaxHigh)}</td><td style={NUM}>{p(r.sv)}</td><td>{r.regime ?? '–'}</td>{namedLines && <td>{r.segment ?? '–'}</td>}</tr>
                ))}
              </tbody>
            </table>
            <ul>{model.provenance.map((x) => <li key={x} className="hint">{x}</li>)}</ul>
          </details>
        </>
      )}
      <SafetyNote />
    </div>
  );
}
