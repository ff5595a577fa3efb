/**
 * Test type inference from the shape of the record, when neither the file nor the user
 * says which test it is. Rules, first match wins (common practice, the engine's own
 * thresholds; test shapes after White et al. 2002 and the US EPA Region 8 step-rate
 * procedure 1999, see METHODS.md):
 *
 * 1. srt: a pumping period holds 3 or more distinct rising rate levels, each held for at
 *    least 5 % of that period (and 5 samples).
 * 2. dfit: a single cycle whose shut-in lasts at least as long as its pumping and at
 *    least 30 min, with at most 16 m3 (about 100 bbl) pumped (a leak-off test is usually
 *    shut in for 10-20 min after a few minutes of pumping, so the 30 min decides; the ratio
 *    only keeps out long injections. A ratio of 4 missed DFITs pumped for 15-30 min, slowly
 *    in a soft system, and shut in for an hour, a common field schedule).
 * 3. xlot: 2 or more cycles and the first one broke down or departed from linear loading.
 * 4. lot: one cycle with a breakdown or a lasting departure from linear loading.
 * 5. fit: otherwise (stopped before any departure; also repeated limit tests).
 */
import type { TestType } from '../record';
import type { Cycle } from '../result';

/** What the inference looks at, per cycle in order. */
export interface TypeEvidence {
  cycles: Cycle[];
  /** Per cycle: a lasting departure from the loading line was found. */
  departed: boolean[];
  /** Per cycle: a breakdown (peak then drop while pumping) was found. */
  brokeDown: boolean[];
  /** Elapsed time, s (for durations). */
  time: Float64Array;
  /** Pump rate, m3/s (for rate levels). */
  rate: Float64Array;
}

/** Result of {@link inferTestType}. */
export interface InferredType {
  type: TestType;
  /** Plain-language reasons, the deciding one first. */
  reasons: string[];
}

/** Thresholds of the rules above. */
export const TYPE_RULES = {
  minimumRateSteps: 3,
  stepLevelTolerance: 0.1,
  stepMinimumFraction: 0.05,
  dfitShutInRatio: 1,
  dfitMinimumShutIn: 1800,
  dfitMaximumVolume: 16,
} as const;

/**
 * Infers the test type from the cycles and their loading features.
 *
 * @param evidence cycles (1-based, in time order), per-cycle departure and breakdown flags,
 *   time (s) and rate (m3/s) arrays of the record.
 * @returns the type and the reasons (never throws; a record without cycles is a 'fit' with a reason).
 * @example inferTestType(evidence).type // 'xlot' for two cycles after a breakdown
 */
export function inferTestType(evidence: TypeEvidence): InferredType {
  const { cycles, time, rate } = evidence;
  if (cycles.length === 0) return { type: 'fit', reasons: ['no pumping period was found; treated as a limit test'] };

  for (const cycle of cycles) {
    const levels = rateLevels(time, rate, cycle);
    if (levels.length >= TYPE_RULES.minimumRateSteps) {
      const shown = levels.map((q) => (q * 60).toFixed(3)).join(', ');
      return { type: 'srt', reasons: [`cycle ${cycle.index} holds ${levels.length} rising rate levels (${shown} m3/min)`] };
    }
  }

  if (cycles.length === 1) {
    const c = cycles[0];
    const pumping = time[c.pumpEnd] - time[c.pumpStart];
    const shutIn = time[c.shutInEnd] - time[c.pumpEnd];
    if (pumping > 0 && shutIn >= TYPE_RULES.dfitShutInRatio * pumping && shutIn >= TYPE_RULES.dfitMinimumShutIn && c.volumePumped <= TYPE_RULES.dfitMaximumVolume) {
      return {
        type: 'dfit',
        reasons: [`one injection of ${c.volumePumped.toFixed(2)} m3 followed by a shut-in ${(shutIn / pumping).toFixed(1)} times as long as the pumping (${(shutIn / 60).toFixed(0)} min)`],
      };
    }
  }

  const firstBroke = evidence.brokeDown[0] === true;
  const firstDeparted = evidence.departed[0] === true;
  if (cycles.length >= 2 && (firstBroke || firstDeparted)) {
    return {
      type: 'xlot',
      reasons: [`${cycles.length} pumping cycles, the first ${firstBroke ? 'with a breakdown' : 'departing from linear loading'}`],
    };
  }
  if (cycles.length === 1 && (firstBroke || firstDeparted)) {
    return { type: 'lot', reasons: [firstBroke ? 'one cycle with a breakdown' : 'one cycle departing from linear loading (leak-off)'] };
  }
  return {
    type: 'fit',
    reasons: [cycles.length === 1 ? 'one cycle stopped before any departure from linear loading' : `${cycles.length} cycles, none departing from linear loading`],
  };
}

/**
 * Distinct rising rate levels held within a cycle's pumping period, m3/s. A level is a run
 * of samples within `stepLevelTolerance` x the cycle's highest rate of the run's mean
 * (three deviating samples in a row start a new run, so spikes do not), lasting 5 % of
 * the period and 5 samples; consecutive levels closer than that tolerance merge. The rate is
 * first averaged over a centred window of 3 % of the pumping time (at least 1 sample each
 * side), so a pump whose rate wanders by a quarter within a minute still shows its steps;
 * running sums keep this O(n).
 *
 * @param time s. @param recordedRate pump rate as recorded, m3/s. @param cycle the cycle.
 * @returns the levels in time order (only those above the previous one are counted).
 * @example rateLevels(t, q, cycle).length // 4 for a four-step SRT
 */
export function rateLevels(time: Float64Array, recordedRate: Float64Array, cycle: Cycle): number[] {
  const s = cycle.pumpStart;
  const e = cycle.pumpEnd;
  const smooth = smoothedRate(time, recordedRate, s, e);
  let top = 0;
  for (let i = s; i <= e; i++) if (smooth[i - s] > top) top = smooth[i - s];
  if (!(top > 0)) return [];
  const tolerance = TYPE_RULES.stepLevelTolerance * top;
  const minimumDuration = TYPE_RULES.stepMinimumFraction * (time[e] - time[s]);
  const levels: number[] = [];
  let runStart = s;
  let sum = smooth[0];
  let count = 1;
  let deviating = 0;
  const close = (end: number): void => {
    const duration = time[end] - time[runStart];
    if (count >= 5 && duration >= minimumDuration) {
      const mean = sum / count;
      const previous = levels.length ? levels[levels.length - 1] : -Infinity;
      if (mean > previous + tolerance) levels.push(mean);
      else if (Math.abs(mean - previous) <= tolerance) levels[levels.length - 1] = Math.max(previous, mean);
    }
  };
  for (let i = s + 1; i <= e; i++) {
    const mean = sum / count;
    if (Math.abs(smooth[i - s] - mean) > tolerance) {
      deviating++;
      if (deviating >= 3) {
        close(i - 3);
        runStart = i - 2;
        sum = smooth[i - s - 2] + smooth[i - s - 1] + smooth[i - s];
        count = 3;
        deviating = 0;
      }
      continue;
    }
    deviating = 0;
    sum += smooth[i - s];
    count++;
  }
  close(e);
  return levels;
}

/**
 * Centred moving mean of rate[s..e] over half-width h samples, h from 1.5 % of the pumping
 * time on each side (so the window spans 3 %), at least 1; element k is the mean around sample s + k.
 */
function smoothedRate(time: Float64Array, rate: Float64Array, s: number, e: number): Float64Array {
  const count = e - s + 1;
  const out = new Float64Array(count);
  const interval = count > 1 ? (time[e] - time[s]) / (count - 1) : 1;
  const half = Math.max(1, Math.round((0.015 * (time[e] - time[s])) / Math.max(interval, 1e-9)));
  const prefix = new Float64Array(count + 1);
  for (let i = 0; i < count; i++) prefix[i + 1] = prefix[i] + rate[s + i];
  for (let i = 0; i < count; i++) {
    const a = Math.max(0, i - half);
    const b = Math.min(count - 1, i + half);
    out[i] = (prefix[b + 1] - prefix[a]) / (b - a + 1);
  }
  return out;
}
