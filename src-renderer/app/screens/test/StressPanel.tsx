import type { StressEstimates } from '../../../engine/result';
import type { UnitSystem } from '../../../engine/units/unitSystem';
import { equivalentMudDensity, formatQuantity, formatSignificant, formatSmallVolume } from '../../format/units';
import { PICK_STYLE } from '../../charts/style';
import { stressMethodWords } from '../../format/methodWords';

const SHMIN_KIND: Record<string, string> = { estimate: 'estimate', 'lower-bound': 'lower bound', 'upper-bound': 'upper bound' };
const SOURCE: Record<string, string> = { given: 'given', file: 'from the file', 'default-gradient': 'default gradient' };

/**
 * The detectability caution as the panel shows it: the analysis's words, with the smallest
 * detectable fracture volume ("smaller than 0.47 L") written in the system's small-volume
 * unit (L or US gal), so the volume appears once and in the chosen units.
 */
export function detectabilityText(message: string, units: UnitSystem, minDetectableVolume: number): string {
  return message.replace(/(smaller than )[0-9.eE+-]+ L\b/, (_whole, lead: string) => `${lead}${formatSmallVolume(units, minDetectableVolume)}`);
}

function Value({ units, value, tvd, prefix = '' }: { units: UnitSystem; value: number; tvd: number | null; prefix?: string }) {
  const emw = equivalentMudDensity(value, tvd);
  return <><b>{prefix}{formatQuantity(units, 'pressure', value)}</b>{emw !== null && <span className="hint"> · EMW {formatQuantity(units, 'emw', emw)}</span>}</>;
}

/**
 * What on the stress panel needs the reviewer's attention beyond the caution every SHmax
 * carries (frictional bounds only): an SHmax value taken from the reopening relation
 * (Hubbert-Willis / Bredehoeft breakdown relations, which rest on a fracture reopening at the
 * wall), or an Shmin that is only a bound. Empty when nothing does; the tab marks the
 * panel only then.
 */
export function stressAttention(stress: StressEstimates): string[] {
  const out: string[] = [];
  if (stress.shmax && stress.shmax.value !== null) out.push('SHmax value from the reopening pressure: check its caution');
  if (stress.shmin && stress.shmin.kind !== 'estimate') out.push(`Shmin is only ${stress.shmin.kind === 'lower-bound' ? 'a lower' : 'an upper'} bound`);
  return out;
}

/** Stress estimates of the test, with the cautions beside SHmax shown prominently. */
export function StressPanel({ stress, units, tvd }: { stress: StressEstimates; units: UnitSystem; tvd: number | null }) {
  const { shmin, shmax } = stress;
  // The detectability message is shown once, first; other cautions follow it.
  const cautions = shmax ? shmax.cautions.filter((c) => c !== shmax.detectability?.message) : [];
  return (
    <section className="panel stack" aria-labelledby="stress-title" data-testid="stress-panel">
      <h2 id="stress-title" style={{ margin: 0 }}>Stress estimates at test depth</h2>
      <dl className="kv">
        <dt>Shmin</dt>
        <dd data-testid="shmin-value">{shmin ? <><Value units={units} value={shmin.value} tvd={tvd} prefix={shmin.kind === 'lower-bound' ? '≥ ' : shmin.kind === 'upper-bound' ? '≤ ' : ''} />
          <div className="hint">{SHMIN_KIND[shmin.kind]} from the {PICK_STYLE[shmin.from].name.toLowerCase()}, cycle {shmin.cycle}</div></> : <span className="hint">no pick supports an estimate</span>}</dd>
        <dt>Sv</dt><dd><Value units={units} value={stress.sv.value} tvd={tvd} /> <span className="hint">({SOURCE[stress.sv.source]})</span></dd>
        <dt>Pp</dt><dd><Value units={units} value={stress.pp.value} tvd={tvd} /> <span className="hint">({SOURCE[stress.pp.source]})</span></dd>
        {stress.tensileStrength !== null && <><dt>T0 = Pb − Pr</dt><dd>{formatQuantity(units, 'pressure', stress.tensileStrength)}</dd></>}
        {shmax && <>
          <dt>SHmax bounds</dt>
          <dd data-testid="shmax-bounds">{formatQuantity(units, 'pressure', shmax.low)} to {formatQuantity(units, 'pressure', shmax.high)}
            <div className="hint">frictional limit, friction coefficient {stress.frictionCoefficient}</div></dd>
          {shmax.value !== null && <><dt>SHmax (reopening)</dt><dd data-testid="shmax-value"><Value units={units} value={shmax.value} tvd={tvd} /><div className="hint">{stressMethodWords(shmax.method)}</div></dd></>}
        </>}
      </dl>
      {shmax && (shmax.detectability || cautions.length > 0) && (
        <div className="shmax-caution" role="note" data-testid="shmax-caution">
          <b>Caution on SHmax.</b>
          {shmax.detectability && <p style={{ margin: '4px 0' }} data-testid="detectability-message">{detectabilityText(shmax.detectability.message, units, shmax.detectability.minDetectableVolume)}</p>}
          {shmax.detectability && units !== 'si' && (
            <p className="hint" style={{ margin: '4px 0' }}>
              In {units} units: smallest visible departure {formatSignificant(units, 'pressure', shmax.detectability.minPressureDeparture)}; implied fracture length{' '}
              {formatSignificant(units, 'depth', shmax.detectability.impliedFractureLength)}.
            </p>
          )}
          {cautions.length > 0 && <ul style={{ margin: '4px 0', paddingLeft: 18 }}>{cautions.map((c) => <li key={c}>{c}</li>)}</ul>}
        </div>
      )}
    </section>
  );
}
