/**
 * Printable review report of one test or a whole well: per test its header data, the
 * pressure and rate record with every pick, the picks with their methods (and the reason
 * for any set by hand), the stress estimates with their cautions, each quality criterion
 * with value and limit, and the review log with who did what and when. Print CSS in
 * report.css puts every test on its own page.
 */
import { useMemo } from 'react';
import type { TestDetail } from '../../../archive/api';
import { ChartView } from '../../components/ChartView';
import { GradeBadge, SafetyNote, StateBadge } from '../../components/Badges';
import { PICK_STYLE } from '../../charts/style';
import { placedPicks, timeChartOption } from '../../charts/options';
import { messageWords, methodWords, stressMethodWords } from '../../format/methodWords';
import { formatQuantity, type UnitSystem } from '../../format/units';
import { describeEvent, eventTime } from '../../state/logWords';
import { criterionCells, criterionName } from '../test/QualityPanel';
import { detectabilityText } from '../test/StressPanel';
import { withoutZoomSlider } from './printChart';
import './report.css';

/** Props of {@link ReportView}. */
export interface ReportViewProps {
  /** The tests reported, in the order shown (one test, or every test of a well). */
  details: TestDetail[];
  units: UnitSystem;
  /** Report title, e.g. "HF-2 review report". */
  title: string;
  /** When the report was made, ISO 8601 (shown in the header). */
  generatedAt: string;
  /** Who made it. */
  generatedBy?: string;
}

function TestSection({ detail, units }: { detail: TestDetail; units: UnitSystem }) {
  const { summary: s, analysis: a, metadata: m } = detail;
  // A report is read on paper: no zoom slider under the chart.
  const option = useMemo(() => withoutZoomSlider(timeChartOption({
    time: detail.samples.time, gaugePressure: detail.samples.pressure, downholePressure: a.downholePressure,
    rate: detail.samples.rate, picks: placedPicks(a), units, target: 900, range: null, showGauge: true,
  })), [detail, a, units]);
  const manual = new Map(detail.manualPicks.map((p) => [`${p.cycle}:${p.kind}`, p]));
  const st = a.stress;
  const q = (v: number | null | undefined) => formatQuantity(units, 'pressure', v ?? null);
  return (
    <section className="report-test" data-testid="report-test" aria-label={`${s.wellName} ${a.type.toUpperCase()} at ${formatQuantity(units, 'depth', s.depthTvd)}`}>
      <h2>{s.wellName} · {a.type.toUpperCase()}{a.typeInferred ? ' (type inferred)' : ''} · <GradeBadge grade={a.quality.grade} /> <StateBadge state={s.state} /></h2>
      <dl className="report-meta">
        <dt>Field</dt><dd>{s.fieldName}</dd>
        <dt>File</dt><dd>{s.fileName}</dd>
        <dt>TVD</dt><dd>{formatQuantity(units, 'depth', s.depthTvd)}</dd>
        <dt>MD</dt><dd>{formatQuantity(units, 'depth', s.depthMd)}</dd>
        <dt>Contractor</dt><dd>{m.contractor ?? '–'}</dd>
        <dt>Test date</dt><dd>{m.date ?? '–'}</dd>
        <dt>Mud density</dt><dd>{formatQuantity(units, 'density', m.mudDensity ?? null)}</dd>
        <dt>Hole diameter</dt><dd>{formatQuantity(units, 'diameter', m.holeDiameter ?? null)}</dd>
        <dt>Gauge</dt><dd>{m.gaugePosition ?? 'surface'}</dd>
        <dt>Imported</dt><dd>{eventTime(s.importedAt)} by {s.importedBy}</dd>
        <dt>Signed off / rejected by</dt><dd>{s.reviewer ?? '–'}</dd>
      </dl>
      <ChartView option={option} label={`Pressure and rate record of ${s.fileName}`} className="report-chart" />
      <h3>Picks</h3>
      <table>
        <thead><tr><th>Cycle</th><th>Event</th><th>Pressure (downhole)</th><th>Time</th><th>Method</th><th>Set by hand</th></tr></thead>
        <tbody>
          {a.cycles.flatMap((c) => Object.values(c.picks).filter((p) => p !== undefined).map((p) => {
            const hand = manual.get(`${c.cycle.index}:${p!.kind}`);
            return (
              <tr key={`${c.cycle.index}-${p!.kind}`}>
                <td>{c.cycle.index}</td><td>{PICK_STYLE[p!.kind].name}</td><td>{q(p!.pressure)}</td>
                <td>{formatQuantity(units, 'time', p!.time)}</td><td title={p!.method}>{p!.manual ? 'set by hand' : methodWords(p!.method)}</td>
                <td>{hand ? `${hand.author}, ${eventTime(hand.time)}: ${hand.reason}` : p!.manual ? p!.reason ?? 'yes' : '–'}</td>
              </tr>
            );
          }))}
        </tbody>
      </table>
      <h3>Stress estimates</h3>
      <table>
        <tbody>
          <tr><th>Shmin</th><td>{st.shmin ? `${q(st.shmin.value)} (${st.shmin.kind.replace('-', ' ')}, from ${st.shmin.from}, cycle ${st.shmin.cycle})` : 'none'}</td></tr>
          <tr><th>SHmax</th><td>{st.shmax ? `${st.shmax.value !== null ? `${q(st.shmax.value)} (${stressMethodWords(st.shmax.method)}); ` : ''}frictional bounds ${q(st.shmax.low)} – ${q(st.shmax.high)} (μ ${st.frictionCoefficient})` : 'none'}</td></tr>
          <tr><th>Sv</th><td>{q(st.sv.value)} ({st.sv.source.replace('-', ' ')})</td></tr>
          <tr><th>Pp</th><td>{q(st.pp.value)} ({st.pp.source.replace('-', ' ')})</td></tr>
        </tbody>
      </table>
      {st.shmax && st.shmax.cautions.length > 0 && <ul>{st.shmax.cautions.map((c) => (
        <li key={c} className="shmax-caution">{st.shmax!.detectability && c === st.shmax!.detectability.message ? detectabilityText(c, units, st.shmax!.detectability.minDetectableVolume) : c}</li>
      ))}</ul>}
      <h3>Quality criteria — grade {a.quality.grade}</h3>
      <p>{a.quality.explanation}</p>
      <table>
        <thead><tr><th>Criterion</th><th>Result</th><th>Value</th><th>Limit</th><th>Explanation</th></tr></thead>
        <tbody>
          {a.quality.criteria.map((c) => {
            const cells = criterionCells(c, {});
            return (
              <tr key={c.id} className={c.pass === false ? 'report-fail' : undefined}>
                <td>{criterionName(c.id)} <span className="mono">({c.id})</span></td><td>{c.pass === true ? 'pass' : c.pass === false ? `fail (${c.severity})` : 'cannot judge'}</td>
                <td>{cells.value}{cells.unit && c.value !== null ? ` ${cells.unit}` : ''}</td><td>{cells.limit}{cells.unit && c.limit !== null ? ` ${cells.unit}` : ''}</td><td>{messageWords(c.message)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <h3>Review log</h3>
      <table>
        <thead><tr><th>When</th><th>Who</th><th>What</th></tr></thead>
        <tbody>
          {detail.log.map((e) => <tr key={e.id}><td>{eventTime(e.time)}</td><td>{e.author}</td><td>{describeEvent(e, detail.log)}</td></tr>)}
        </tbody>
      </table>
    </section>
  );
}

/** The printable report of one test or a whole well. */
export function ReportView({ details, units, title, generatedAt, generatedBy }: ReportViewProps) {
  return (
    <div className="page report-view" data-testid="report-view">
      <div className="page-head">
        <div>
          <h1>{title}</h1>
          <p className="sub">Generated {eventTime(generatedAt)}{generatedBy ? ` by ${generatedBy}` : ''} · {details.length} test{details.length === 1 ? '' : 's'} · Stress Ledger</p>
        </div>
      </div>
      <SafetyNote />
      {details.map((d) => <TestSection key={d.summary.id} detail={d} units={units} />)}
      <SafetyNote />
    </div>
  );
}
