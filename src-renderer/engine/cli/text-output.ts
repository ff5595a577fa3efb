/**
 * The readable summary of `analyze` without --json: per file, the type, depth, each
 * cycle's loading line and picks (downhole MPa), the stress estimates and the grade with
 * the criteria that failed or could not be judged.
 */
import { PICK_KINDS } from '../result';
import type { CliFileOutcome } from './analyze-files';
import { SAFETY_CAUTION } from './caution';

const PICK_LABELS: Record<string, string> = {
  leakOff: 'leak-off', breakdown: 'breakdown', propagation: 'propagation', isip: 'ISIP',
  closure: 'closure', reopening: 'reopening', fitMaximum: 'FIT maximum', extension: 'extension',
};

const mpa = (pa: number): string => `${(pa / 1e6).toFixed(2)} MPa`;

/**
 * The text summary of one file's outcome (several lines, ending with a newline).
 * @param outcome from analyzeFilesForCli. @returns the text.
 * @example process.stdout.write(fileSummaryText(outcome))
 */
export function fileSummaryText(outcome: CliFileOutcome): string {
  const lines: string[] = [];
  if (outcome.error || !outcome.analysis || !outcome.record) {
    lines.push(`${outcome.file}: could not be analysed`, `  ${outcome.error?.code ?? 'internal-error'}: ${outcome.error?.message ?? 'no result'}`);
    return lines.join('\n') + '\n';
  }
  const a = outcome.analysis;
  const time = outcome.record.time;
  const tvd = a.metadata.depthTvd !== undefined ? `${a.metadata.depthTvd.toFixed(1)} m TVD` : 'TVD not given';
  lines.push(`${outcome.file}: ${a.type.toUpperCase()}${a.typeInferred ? ' (inferred: ' + a.typeReasons.join('; ') + ')' : ''}, ${a.samples} samples, ${tvd}`);
  lines.push(`  gauge ${a.metadata.gaugePosition ?? 'surface'}, ${a.hydrostaticCorrection > 0 ? `fluid column adds ${mpa(a.hydrostaticCorrection)}` : 'no column correction'}; pressures are downhole`);
  for (const c of a.cycles) {
    const fit = c.loadingFit;
    const slope = fit ? `loading ${(fit.slope / 1e6).toFixed(3)} MPa/m3, R2 ${fit.r2.toFixed(4)}` : 'no linear loading part';
    const expected = c.expectedSlope !== null ? `, expected ${(c.expectedSlope / 1e6).toFixed(3)} MPa/m3` : '';
    lines.push(`  cycle ${c.cycle.index}: ${time[c.cycle.pumpStart].toFixed(0)}-${time[c.cycle.shutInEnd].toFixed(0)} s, ${c.cycle.volumePumped.toFixed(3)} m3 pumped, ${slope}${expected}`);
    const inTimeOrder = PICK_KINDS.filter((kind) => c.picks[kind]).sort((a, b) => (c.picks[a]?.time ?? 0) - (c.picks[b]?.time ?? 0));
    for (const kind of inTimeOrder) {
      const p = c.picks[kind];
      if (!p) continue;
      const rate = p.rate !== undefined ? ` at ${(p.rate * 60).toFixed(3)} m3/min` : '';
      lines.push(`    ${PICK_LABELS[kind].padEnd(12)} ${mpa(p.pressure).padStart(11)} at ${p.time.toFixed(1)} s${rate} (${p.method}${p.manual ? ', set by hand' : ''})`);
    }
    if (c.closureSpread !== null) lines.push(`    closure methods spread ${mpa(c.closureSpread)} over ${c.closureCandidates.length} methods`);
  }
  const s = a.stress;
  if (s.shmin) lines.push(`  Shmin ${mpa(s.shmin.value)} (${s.shmin.kind}, from ${s.shmin.from} of cycle ${s.shmin.cycle})`);
  else lines.push('  Shmin: no estimate');
  if (s.shmax) {
    const value = s.shmax.value !== null ? `${mpa(s.shmax.value)}, ` : '';
    lines.push(`  SHmax ${value}bounds ${mpa(s.shmax.low)} to ${mpa(s.shmax.high)} (${s.shmax.method})`);
    for (const caution of s.shmax.cautions) lines.push(`    caution: ${caution}`);
  }
  lines.push(`  Sv ${mpa(s.sv.value)} (${s.sv.source}), Pp ${mpa(s.pp.value)} (${s.pp.source})`);
  lines.push(`  grade ${a.quality.grade}: ${a.quality.explanation}`);
  for (const c of a.quality.criteria) {
    if (c.pass === true) continue;
    lines.push(`    ${c.pass === null ? 'not judged' : 'failed'} ${c.id}: ${c.message}`);
  }
  for (const w of a.warnings) lines.push(`  warning: ${w}`);
  return lines.join('\n') + '\n';
}

/**
 * The whole text report: every file, then the safety caution.
 * @param outcomes from analyzeFilesForCli. @returns the text.
 * @example process.stdout.write(analyzeSummaryText(outcomes))
 */
export function analyzeSummaryText(outcomes: readonly CliFileOutcome[]): string {
  return outcomes.map(fileSummaryText).join('\n') + `\n${SAFETY_CAUTION}\n`;
}
