/**
 * The analysis pipeline of one test record: overrides, test type, downhole pressure,
 * cycles, loading line and picks, shut-in picks, expected stiffness, hand-set picks,
 * stress estimates and quality grade. Pure and deterministic: the same record and
 * options give the same result, in a Web Worker as in Node.
 *
 * Speed: every step is O(n) in the number of samples (running fits, selection-based
 * medians, no per-sample objects), so a 1,000,000-sample record analyses in well under
 * a second. The shut-in methods may decimate long shut-ins internally (shut-in.ts).
 *
 * Results are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { AnalysisOptions } from './analysis-options';
import { assembleCyclePicks } from './analysis/cycle-picks';
import { downholePressure } from './analysis/downhole';
import { analyseLoading, DEFAULT_DEPARTURE_SD } from './analysis/loading-picks';
import { applyManualPicks } from './analysis/manual-picks';
import { segmentCycles } from './analysis/segmentation';
import { expectedLoadingSlope } from './analysis/stiffness';
import { inferTestType } from './analysis/type-inference';
import { EngineError } from './errors';
import { importTestFile } from './import/import-test-file';
import { assessQuality } from './quality/assess';
import type { TestMetadata, TestRecord, TestType } from './record';
import { TEST_TYPES } from './record';
import type { AnalysisContext, AnalysisResult } from './result';
import { estimateStresses } from './stress/estimates';

/** Limit key of the departure threshold k (k x residual SD); read here, not by the quality grading. */
export const DEPARTURE_LIMIT_KEY = 'loading-departure.thresholdSd';

/**
 * Analyses one imported record.
 *
 * @param record the normalised record (SI arrays of equal length, >= 2 samples).
 * @param options type, metadata overrides (they win over the file's metadata), quality
 *   limits (plus `loading-departure.thresholdSd`, k of the leak-off threshold, default 3),
 *   friction coefficient (default 0.6), hand-set picks.
 * @returns the full analysis (SI); `typeInferred` true when neither options nor file gave the type.
 * @throws EngineError 'bad-metadata' when a surface gauge lacks TVD or mud density (or a
 *   stated stiffness input is invalid); 'no-rate-or-volume' when the record never pumps;
 *   'bad-argument' for an unknown type, unequal arrays or invalid hand-set picks or limits.
 * @example analyzeRecord(record, { overrides: { depthTvd: 1520, mudDensity: 1250 } }).stress.shmin
 */
export function analyzeRecord(record: TestRecord, options: AnalysisOptions = {}): AnalysisResult {
  const fileName = record.source?.fileName;
  const where = fileName ? { file: fileName } : {};
  const n = record.time.length;
  if (record.pressure.length !== n || record.rate.length !== n || record.volume.length !== n) {
    throw new EngineError('bad-argument', 'time, pressure, rate and volume of the record differ in length', where, 'arrays of equal length');
  }
  if (n < 2) throw new EngineError('too-few-points', `the record has ${n} sample(s)`, where, 'at least 2 samples');
  if (options.type !== undefined && !TEST_TYPES.includes(options.type)) {
    throw new EngineError('bad-argument', `unknown test type "${options.type}"`, where, TEST_TYPES.join(', '));
  }

  const metadata = mergeMetadata(record.metadata, options.overrides);
  const downhole = downholePressure(record.pressure, metadata, fileName);
  const pressure = downhole.pressure;
  const cycles = segmentCycles(record, { rateDerived: record.source?.derived?.rate === true });
  if (cycles.length === 0) {
    throw new EngineError('no-rate-or-volume', 'the record never pumps: no sample has a pump rate above zero', where, 'a pumping period in the rate or volume column');
  }

  const { [DEPARTURE_LIMIT_KEY]: departureSd, ...qualityLimits } = options.limits ?? {};
  if (departureSd !== undefined && !(departureSd > 0)) {
    throw new EngineError('bad-argument', `limit ${DEPARTURE_LIMIT_KEY} must be a positive number, got ${departureSd}`, where, 'a number above 0');
  }
  const features = cycles.map((cycle) => analyseLoading(record.time, pressure, record.volume, cycle, {
    departureSd: departureSd ?? DEFAULT_DEPARTURE_SD,
    gaugeResolution: metadata.gaugeResolution,
  }));

  const inferred = inferTestType({
    cycles,
    departed: features.map((f) => f.departureIndex !== null),
    brokeDown: features.map((f) => f.breakdownIndex !== null),
    time: record.time,
    rate: record.rate,
  });
  const statedType: TestType | undefined = options.type ?? metadata.testType;
  const type = statedType ?? inferred.type;
  const typeInferred = statedType === undefined;

  const warnings: string[] = [...(record.source?.warnings ?? [])];
  const expected = expectedLoadingSlope(metadata);
  let analysed = assembleCyclePicks({ type, time: record.time, pressure, rate: record.rate, cycles, features, expectedSlope: expected ? expected.slope : null }, warnings);
  if (options.manualPicks && options.manualPicks.length > 0) analysed = applyManualPicks(analysed, options.manualPicks, n);
  markClippedPicks(analysed, record.pressure, record.rate, metadata.gaugeRange, warnings);

  if (statedType !== undefined && statedType !== inferred.type) {
    warnings.push(`the record looks like a ${inferred.type.toUpperCase()} (${inferred.reasons.join('; ')}) but is analysed as the stated ${statedType.toUpperCase()}`);
  }
  for (const f of features) {
    if (f.fit === null) warnings.push(`no linear loading part was found in the cycle starting at ${record.time[f.peakIndex].toFixed(1)} s`);
  }

  const context: AnalysisContext = {
    type,
    typeInferred,
    time: record.time,
    rate: record.rate,
    volume: record.volume,
    gaugePressure: record.pressure,
    downholePressure: pressure,
    metadata,
    cycles: analysed,
  };
  const stress = estimateStresses(context, {
    frictionCoefficient: options.frictionCoefficient,
    metadataSource: {
      porePressure: options.overrides?.porePressure !== undefined ? 'given' : 'file',
      verticalStress: options.overrides?.verticalStress !== undefined ? 'given' : 'file',
    },
  });
  const quality = assessQuality(context, qualityLimits);

  return {
    type,
    typeInferred,
    typeReasons: inferred.reasons,
    samples: n,
    metadata,
    downholePressure: pressure,
    hydrostaticCorrection: downhole.correction,
    cycles: analysed,
    stress,
    quality,
    warnings,
  };
}

/**
 * Imports a file and analyses it (convenience for the command line and the app's worker).
 *
 * @param bytes file content. @param fileName name shown in errors and results.
 * @param options as {@link analyzeRecord}.
 * @returns the record and its analysis.
 * @throws EngineError from the import (with file, line and column) or from the analysis.
 * @example const { analysis } = await analyzeFile(bytes, 'xlot-a.csv', {});
 */
export async function analyzeFile(bytes: Uint8Array, fileName: string, options: AnalysisOptions = {}): Promise<{ record: TestRecord; analysis: AnalysisResult }> {
  const record = await importTestFile(bytes, fileName);
  try {
    return { record, analysis: analyzeRecord(record, options) };
  } catch (e) {
    throw e instanceof EngineError ? e.withFile(fileName) : e;
  }
}

/** Picks whose pressure is a recorded reading (ISIP, closure and extension are fitted values). */
const READING_PICKS: ReadonlySet<string> = new Set(['leakOff', 'breakdown', 'propagation', 'reopening', 'fitMaximum']);

/** Identical readings at the record maximum while pumping that mark a clipped gauge (the gauge-range criterion's default). */
const CLIPPED_RUN_SAMPLES = 5;

/**
 * Flags automatic reading picks (leak-off, breakdown, propagation, reopening, FIT maximum)
 * taken where the gauge clipped (in place): a reading at or above the
 * stated full-scale range, or inside a run of CLIPPED_RUN_SAMPLES or more identical readings
 * at the record's maximum while pumping. Such a pick's pressure is what the gauge could
 * show, not what the well saw, so it is kept, marked `bound: 'lower'`, and a warning says so
 * (a breakdown from a clipped gauge is a lower bound of the breakdown pressure, and so is a
 * tensile strength derived from it). Common practice: a saturated reading bounds the true
 * value from below. O(n) over the record, no per-sample objects.
 */
function markClippedPicks(cycles: AnalysisResult['cycles'], gauge: Float64Array, rate: Float64Array, range: number | undefined, warnings: string[]): void {
  let max = -Infinity;
  for (let i = 0; i < gauge.length; i++) if (gauge[i] > max) max = gauge[i];
  const atRange = (i: number): boolean => range !== undefined && range > 0 && gauge[i] >= range * (1 - 1e-9);
  const inFlatTop = (i: number): boolean => {
    if (gauge[i] !== max || !(rate[i] > 0)) return false;
    let a = i;
    let b = i;
    while (a > 0 && gauge[a - 1] === max && rate[a - 1] > 0) a--;
    while (b < gauge.length - 1 && gauge[b + 1] === max && rate[b + 1] > 0) b++;
    return b - a + 1 >= CLIPPED_RUN_SAMPLES;
  };
  for (const c of cycles) {
    for (const pick of Object.values(c.picks)) {
      if (!pick || pick.manual || !READING_PICKS.has(pick.kind)) continue;
      const i = pick.sampleIndex;
      if (i < 0 || i >= gauge.length || !(atRange(i) || inFlatTop(i))) continue;
      pick.bound = 'lower';
      warnings.push(`the ${pick.kind} of cycle ${c.cycle.index} (${(pick.pressure / 1e6).toFixed(2)} MPa) was read where the gauge clipped at ${(gauge[i] / 1e6).toFixed(2)} MPa gauge pressure: it is a lower bound, the true pressure was higher${pick.kind === 'breakdown' ? ', and so is a tensile strength Pb - Pr taken from it' : ''}`);
    }
  }
}

/** File metadata with the defined override values on top (undefined overrides do not erase). */
function mergeMetadata(file: TestMetadata, overrides: Partial<TestMetadata> | undefined): TestMetadata {
  const merged: TestMetadata = { ...file };
  if (!overrides) return merged;
  for (const [key, value] of Object.entries(overrides)) {
    if (value !== undefined) (merged as Record<string, unknown>)[key] = value;
  }
  return merged;
}
