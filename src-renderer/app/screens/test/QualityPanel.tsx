import type { CriterionResult, QualityResult } from '../../../engine/result';
import { DEFAULT_LIMITS } from '../../../engine/quality/limits';
import { CriterionVerdict, GradeBadge } from '../../components/Badges';
import { GRADE_STYLE } from '../../charts/style';
import { messageWords } from '../../format/methodWords';

const CRITERION_NAMES: Record<string, string> = {
  'loading-linearity': 'Straight loading line',
  'loading-stiffness': 'Loading stiffness against expected',
  'rate-stability': 'Steady pump rate',
  'shut-in-stability': 'Shut-in long and settled',
  'second-cycle': 'Valid second cycle',
  'cycle-repeat': 'ISIP and closure repeat',
  sampling: 'Sampling fast enough',
  'gauge-range': 'Gauge range not reached',
  'pick-agreement': 'Closure methods agree',
};

export function criterionName(id: string): string {
  return CRITERION_NAMES[id] ?? id.replace(/[-.]/g, ' ').replace(/^\w/, (c) => c.toUpperCase());
}

/** Numbers of the criteria table: ratios and counts as written (4 significant digits), large values with separators. */
export function criterionNumber(v: number | null): string {
  if (v === null || !Number.isFinite(v)) return '–';
  const a = Math.abs(v);
  if (a >= 1000) return v.toLocaleString('en-US', { maximumFractionDigits: 0 });
  if (a === 0) return '0';
  return Number(v.toPrecision(4)).toString();
}

/**
 * Unit of a criterion's value and limit, from the limit definition whose key belongs to the
 * criterion and whose value (project or default) equals the limit. Rates of pressure change
 * are shown in kPa/min, as field reports write them.
 */
export function criterionScale(id: string, limit: number | null, limits: Record<string, number>): { unit: string; scale: number } {
  if (limit === null) return { unit: '', scale: 1 };
  const def = DEFAULT_LIMITS.find((l) => l.key.startsWith(`${id}.`) && Math.abs((limits[l.key] ?? l.value) - limit) <= 1e-9 * Math.max(1, Math.abs(limit)));
  if (!def || def.unit === '1') return { unit: '', scale: 1 };
  if (def.unit === 'Pa/s') return { unit: 'kPa/min', scale: 60 / 1000 };
  if (def.unit === 'Pa') return { unit: 'MPa', scale: 1e-6 };
  return { unit: def.unit, scale: 1 };
}

/** A criterion's value and limit as the table shows them: text and the unit beside it. */
export interface CriterionCells { value: string; limit: string; unit: string }

function fixed(v: number | null, digits: number, scale = 1): string {
  if (v === null || !Number.isFinite(v)) return '–';
  const x = v * scale;
  return (Math.abs(x) < 0.5 * 10 ** -digits ? 0 : x).toFixed(digits);
}

function seconds(v: number | null): string {
  if (v === null || !Number.isFinite(v)) return '–';
  if (Math.abs(v) >= 100) return v.toFixed(0);
  return Number(v.toPrecision(3)).toString();
}

/**
 * Value and limit of a criterion for the table, from the unit the engine gives
 * (CriterionResult.unit): shares as %, R² to 4 decimals, ratios to 2, pressure decline in
 * kPa/min, times in s. Without a unit, the limit definitions are searched (criterionScale).
 */
export function criterionCells(c: CriterionResult, limits: Record<string, number>): CriterionCells {
  switch (c.unit) {
    case 'fraction': return { value: fixed(c.value, 1, 100), limit: fixed(c.limit, 1, 100), unit: '%' };
    case 'r2': {
      const r2 = (v: number | null) => (v === null || !Number.isFinite(v) ? '–' : `R²\u00a0${fixed(v, 4)}`);
      return { value: r2(c.value), limit: r2(c.limit), unit: '' };
    }
    case 'ratio': return { value: fixed(c.value, 2), limit: fixed(c.limit, 2), unit: '×' };
    case 'Pa/s': return { value: fixed(c.value, 1, 60 / 1000), limit: fixed(c.limit, 1, 60 / 1000), unit: 'kPa/min' };
    case 's': return { value: seconds(c.value), limit: seconds(c.limit), unit: 's' };
    default: {
      const { unit, scale } = criterionScale(c.id, c.limit, limits);
      return { value: criterionNumber(c.value === null ? null : c.value * scale), limit: criterionNumber(c.limit === null ? null : c.limit * scale), unit };
    }
  }
}

export function QualityPanel({ quality, limits, preview }: { quality: QualityResult; limits: Record<string, number>; preview?: boolean }) {
  return (
    <section className="panel stack" aria-labelledby="quality-title" data-testid="quality-panel">
      <div className="row">
        <h2 id="quality-title" style={{ margin: 0 }}>Quality</h2>
        <span className="spacer" />
        <GradeBadge grade={quality.grade} large />
        <span style={{ color: GRADE_STYLE[quality.grade].color, fontWeight: 600 }}>{GRADE_STYLE[quality.grade].words}{preview ? ' (preview)' : ''}</span>
      </div>
      <p data-testid="grade-explanation">{quality.explanation}</p>
      <table className="plain" data-testid="criteria-table">
        <thead><tr><th>Criterion</th><th className="num">Value</th><th className="num">Limit</th><th>Result</th></tr></thead>
        <tbody>
          {quality.criteria.map((c) => {
            const cells = criterionCells(c, limits);
            return (
            <tr key={c.id} data-testid="criterion-row" data-criterion={c.id}>
              <td><div>{criterionName(c.id)}{c.severity === 'major' ? '' : <span className="hint"> (minor)</span>}</div><div className="hint">{messageWords(c.message)}</div></td>
              <td className="num" data-testid="criterion-value">{cells.value}{cells.unit && c.value !== null ? <span className="hint">{'\u00a0'}{cells.unit}</span> : null}</td>
              <td className="num" data-testid="criterion-limit">{cells.limit}{cells.unit && c.limit !== null ? <span className="hint">{'\u00a0'}{cells.unit}</span> : null}</td>
              <td><CriterionVerdict pass={c.pass} /></td>
            </tr>
            );
          })}
        </tbody>
      </table>
    </section>
  );
}
