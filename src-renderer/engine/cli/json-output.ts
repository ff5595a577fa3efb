/**
 * The `analyze --json` document of contracts/cli.md: the engine's SI result converted to
 * the contract's display units (pressures downhole in MPa, times in s, depths in m,
 * slopes in MPa/m3, rates in m3/min). Fields may be added, never renamed.
 *
 * Where the engine says more than the contract's vocabulary, the contract field keeps to
 * its listed words and an added field carries the rest: `stress.shmin.kind` is `estimate`
 * or `lower-bound` with `bound` 'upper' | 'lower' | null beside it (an ISIP or propagation
 * Shmin is an `estimate` with `bound: 'upper'`); `stress.shmin.from` is one of closure, isip,
 * leakOff, fitMaximum, extension, with `fromPick` naming the actual `picks` key (a
 * propagation pick reads `from: 'extension'`, `fromPick: 'propagation'`). A pick the gauge
 * clipped carries `bound: 'lower'`; each criterion carries the `unit` of its value and limit.
 */
import { EngineError } from '../errors';
import type { TestRecord } from '../record';
import { PICK_KINDS, type AnalysisResult, type CycleAnalysis, type Pick, type PickKind, type ShminKind } from '../result';
import { SAFETY_CAUTION } from './caution';

/** The program's name in the `tool` block. */
export const TOOL_NAME = 'stress-ledger';

/** Value rounded to 7 significant digits (well below any gauge's resolution), finite or null. */
export function rounded(value: number | null | undefined, digits = 7): number | null {
  if (value === null || value === undefined || !Number.isFinite(value)) return null;
  if (value === 0) return 0;
  return Number(value.toPrecision(digits));
}

/** {value, unit} with the SI value divided by `factor`, or null when not finite. */
export function quantity(si: number | null | undefined, unit: string, factor = 1): { value: number; unit: string } | null {
  const v = rounded(si === null || si === undefined ? null : si / factor);
  return v === null ? null : { value: v, unit };
}

const MPA = 1e6;

/** The JSON of one pick: pressure MPa, time s, method, plus rate (m3/min) for an extension. */
export function pickJson(pick: Pick): Record<string, unknown> {
  const out: Record<string, unknown> = {
    value: rounded(pick.pressure / MPA),
    unit: 'MPa',
    time: quantity(pick.time, 's'),
    method: pick.method,
    sampleIndex: pick.sampleIndex,
  };
  if (pick.rate !== undefined) out.rate = quantity(pick.rate * 60, 'm3/min');
  // Added field: the gauge clipped at full scale at this pick, so the value is only a lower bound.
  if (pick.bound) out.bound = pick.bound;
  if (pick.manual) {
    out.manual = true;
    out.reason = pick.reason ?? '';
  }
  return out;
}

/** The JSON of one analysed cycle. */
export function cycleJson(c: CycleAnalysis, time: Float64Array): Record<string, unknown> {
  const picks: Record<string, unknown> = {};
  for (const kind of PICK_KINDS) {
    const pick = c.picks[kind];
    if (pick) picks[kind] = pickJson(pick);
  }
  const fit = c.loadingFit;
  const out: Record<string, unknown> = {
    index: c.cycle.index,
    loadingSlope: fit ? quantity(fit.slope, 'MPa/m3', MPA) : null,
    expectedSlope: c.expectedSlope !== null ? quantity(c.expectedSlope, 'MPa/m3', MPA) : null,
    loadingR2: fit ? rounded(fit.r2) : null,
    picks,
    loadingResidualSd: fit ? quantity(fit.residualSd, 'MPa', MPA) : null,
    loadingSamples: fit ? fit.n : 0,
    loadingIntercept: fit ? quantity(fit.intercept, 'MPa', MPA) : null,
    pumpStart: quantity(time[c.cycle.pumpStart], 's'),
    pumpEnd: quantity(time[c.cycle.pumpEnd], 's'),
    shutInEnd: quantity(time[c.cycle.shutInEnd], 's'),
    meanRate: quantity(c.cycle.meanRate * 60, 'm3/min'),
    volumePumped: quantity(c.cycle.volumePumped, 'm3'),
    flowBack: c.cycle.flowBack,
    closureCandidates: c.closureCandidates.map((k) => ({
      method: k.method,
      value: rounded(k.pressure / MPA),
      unit: 'MPa',
      time: quantity(k.time, 's'),
      ...(k.g !== undefined ? { g: rounded(k.g) } : {}),
    })),
    closureSpread: c.closureSpread !== null ? quantity(c.closureSpread, 'MPa', MPA) : null,
  };
  if (c.stepRate) {
    out.stepRate = {
      steps: c.stepRate.steps.map((s) => ({ rate: quantity(s.rate * 60, 'm3/min'), pressure: quantity(s.pressure, 'MPa', MPA), time: quantity(time[s.endIndex], 's') })),
      extension: c.stepRate.extension
        ? { rate: quantity(c.stepRate.extension.rate * 60, 'm3/min'), pressure: quantity(c.stepRate.extension.pressure, 'MPa', MPA) }
        : null,
    };
  }
  return out;
}

/** The contract's words for what a Shmin value is (`stress.shmin.kind`). */
export type ContractShminKind = 'estimate' | 'lower-bound';
/** The contract's words for the pick a Shmin value comes from (`stress.shmin.from`). */
export type ContractShminSource = 'closure' | 'isip' | 'leakOff' | 'fitMaximum' | 'extension';

/**
 * The engine's Shmin meaning in the contract's vocabulary, which has only `estimate` and
 * `lower-bound`. The engine also reports `upper-bound` (Shmin from the ISIP or the
 * propagation pressure: a close upper bound, METHODS.md after White et al. 2002); the
 * contract's `kind` then reads `estimate` and the added field `bound` keeps the side
 * ('upper'; 'lower' for a lower bound; null for an estimate without a side).
 *
 * @param kind the engine's ShminKind. @returns {kind, bound} for the JSON. @throws nothing.
 * @example contractShminKind('upper-bound') // {kind: 'estimate', bound: 'upper'}
 */
export function contractShminKind(kind: ShminKind): { kind: ContractShminKind; bound: 'upper' | 'lower' | null } {
  if (kind === 'upper-bound') return { kind: 'estimate', bound: 'upper' };
  if (kind === 'lower-bound') return { kind: 'lower-bound', bound: 'lower' };
  return { kind: 'estimate', bound: null };
}

/**
 * The pick a Shmin comes from in the contract's vocabulary. The propagation pressure (the
 * near-constant pressure while a fracture grows) is the trade's fracture extension
 * pressure, so `from` reads `extension`; the added field `fromPick` always names the
 * `picks` key of the cycle it was taken from ('propagation' in that case).
 *
 * @param from the engine's pick kind. @returns {from, fromPick}. @throws nothing.
 * @example contractShminSource('propagation') // {from: 'extension', fromPick: 'propagation'}
 */
export function contractShminSource(from: PickKind): { from: ContractShminSource; fromPick: PickKind } {
  switch (from) {
    case 'closure': case 'isip': case 'leakOff': case 'fitMaximum': case 'extension':
      return { from, fromPick: from };
    case 'propagation':
      return { from: 'extension', fromPick: from };
    default:
      // Breakdown and reopening are not Shmin measurements (SHMIN_HIERARCHY never uses them).
      throw new EngineError('internal-error', `Shmin cannot come from a ${from} pick`, {}, 'closure, isip, propagation, extension, leakOff or fitMaximum');
  }
}

/** The JSON of the stress estimates. */
export function stressJson(stress: AnalysisResult['stress']): Record<string, unknown> {
  const sh = stress.shmax;
  const d = sh?.detectability ?? null;
  const shmin = stress.shmin;
  return {
    shmin: shmin
      ? { value: rounded(shmin.value / MPA), unit: 'MPa', ...contractShminKind(shmin.kind), ...contractShminSource(shmin.from), cycle: shmin.cycle }
      : null,
    shmax: sh
      ? {
          value: sh.value === null ? null : rounded(sh.value / MPA),
          unit: 'MPa',
          low: rounded(sh.low / MPA),
          high: rounded(sh.high / MPA),
          method: sh.method,
          cautions: sh.cautions,
          detectability: d
            ? {
                minPressureDeparture: quantity(d.minPressureDeparture, 'MPa', MPA),
                compliance: quantity(d.compliance * MPA, 'm3/MPa'),
                minDetectableVolume: quantity(d.minDetectableVolume, 'm3'),
                impliedFractureLength: quantity(d.impliedFractureLength, 'm'),
                wellboreRadius: quantity(d.wellboreRadius, 'm'),
                assumedAperture: quantity(d.assumedAperture, 'm'),
                assumedHeight: quantity(d.assumedHeight, 'm'),
                lengthToRadius: rounded(d.lengthToRadius),
                kirschApplies: d.kirschApplies,
                message: d.message,
              }
            : null,
        }
      : null,
    sv: { value: rounded(stress.sv.value / MPA), unit: 'MPa', source: stress.sv.source, ...(stress.sv.gradient !== undefined ? { gradient: quantity(stress.sv.gradient, 'kPa/m', 1e3) } : {}) },
    pp: { value: rounded(stress.pp.value / MPA), unit: 'MPa', source: stress.pp.source, ...(stress.pp.gradient !== undefined ? { gradient: quantity(stress.pp.gradient, 'kPa/m', 1e3) } : {}) },
    frictionCoefficient: stress.frictionCoefficient,
    tensileStrength: stress.tensileStrength === null ? null : quantity(stress.tensileStrength, 'MPa', MPA),
  };
}

/**
 * One entry of `results`: a successful analysis, or the file name with its error.
 *
 * @param file the file name as given. @param analysis the result (SI) when it succeeded.
 * @param record the imported record (for sample times). @param error the failure, if any.
 * @returns the contract's per-file object.
 * @example fileResultJson('a.csv', analysis, record, null).type // 'xlot'
 */
export function fileResultJson(file: string, analysis: AnalysisResult | null, record: TestRecord | null, error: EngineError | null): Record<string, unknown> {
  if (error || !analysis || !record) {
    return { file, error: error ? errorJson(error) : { code: 'internal-error', message: 'no result' } };
  }
  const m = analysis.metadata;
  return {
    file,
    error: null,
    type: analysis.type,
    typeInferred: analysis.typeInferred,
    samples: analysis.samples,
    depthTvd: quantity(m.depthTvd, 'm'),
    cycles: analysis.cycles.map((c) => cycleJson(c, record.time)),
    stress: stressJson(analysis.stress),
    quality: {
      grade: analysis.quality.grade,
      criteria: analysis.quality.criteria.map((c) => ({
        id: c.id, pass: c.pass, value: rounded(c.value), limit: rounded(c.limit), message: c.message, severity: c.severity,
        // Added field: the unit of value and limit (SI, 'fraction', 'ratio' or 'r2'); null when not known.
        unit: c.unit ?? null,
      })),
      explanation: analysis.quality.explanation,
    },
    typeReasons: analysis.typeReasons,
    gaugePosition: m.gaugePosition ?? 'surface',
    mudDensity: quantity(m.mudDensity, 'kg/m3'),
    hydrostaticCorrection: quantity(analysis.hydrostaticCorrection, 'MPa', MPA),
    well: m.well ?? null,
    warnings: analysis.warnings,
  };
}

/** The error object of the contract: {code, message, line?, column?, file?, ...}. */
export function errorJson(error: EngineError): Record<string, unknown> {
  return error.toJSON();
}

/**
 * The whole `analyze --json` document.
 * @param version program version. @param results per-file objects from {@link fileResultJson}.
 * @returns {tool, caution, results}.
 * @example JSON.stringify(analyzeDocument('0.1.0', [entry]))
 */
export function analyzeDocument(version: string, results: Record<string, unknown>[]): Record<string, unknown> {
  return { tool: { name: TOOL_NAME, version }, caution: SAFETY_CAUTION, results };
}
