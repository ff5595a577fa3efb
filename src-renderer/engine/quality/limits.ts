/**
 * Every default quality limit in one place, each with its key, value, unit, rationale
 * and source. A project overrides any of them by key (AnalysisOptions.limits).
 *
 * Sources are named in each entry; "common practice" marks a trade habit without a
 * single published source, "chosen" a value this product picked and explains.
 * The reopening-below-breakdown bound of 'second-cycle' (ratio 1) is physical, not a tunable
 * limit, and lives with its criterion (criteria/second-cycle.ts).
 *
 * Limits grade records for review by a qualified engineer; they are not a substitute
 * for the operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';

/**
 * How a limit is shown and typed on screens (the value itself stays SI):
 * 'percent' a fraction shown in % (0.1 -> 10 %), 'r2' a coefficient of determination
 * shown as a plain number, 'ratio' a dimensionless ratio (x), 'count' a whole number,
 * 'duration-min' seconds shown in minutes, 'duration-s' seconds shown in seconds,
 * 'pressure-rate' Pa/s shown as a pressure per minute (kPa/min or psi/min).
 */
export type LimitDisplay = 'percent' | 'r2' | 'ratio' | 'count' | 'duration-min' | 'duration-s' | 'pressure-rate';

export interface QualityLimit {
  /** Stable key: "<criterion id>.<name>". */
  key: string;
  value: number;
  /** SI unit of the value, or "1" for a ratio. */
  unit: string;
  rationale: string;
  source: string;
  /** How screens show and take this value (see LimitDisplay). */
  display: LimitDisplay;
}

export const DEFAULT_LIMITS: readonly QualityLimit[] = [
  {
    key: 'loading-linearity.minR2', value: 0.995, unit: '1', display: 'r2',
    rationale: 'The loading part of pressure against volume should be a straight line; a lower R2 means air, a toe, unsteady rate or early leak-off.',
    source: 'contracts/cli.md example limit; straight loading line is good practice (METHODS.md, White et al. 2002).',
  },
  {
    key: 'loading-stiffness.minRatio', value: 0.5, unit: '1', display: 'ratio',
    rationale: 'Field loading slopes are softer than 1/(c V) (air, casing expansion, filtration, temperature); below half the expected slope the line holds air or the volume is wrong.',
    source: 'chosen; field slopes softer than computed: Altun, Langlinais & Bourgoyne (2001), SPE D&C 16(2).',
  },
  {
    key: 'loading-stiffness.maxRatio', value: 1.5, unit: '1', display: 'ratio',
    rationale: 'A slope much stiffer than 1/(c V) is not physical: the stated system volume or compressibility is too large, or the rate is wrong.',
    source: 'chosen; allows for the usual uncertainty of stated volume and compressibility (Bourgoyne et al. 1986 ch. 3, from memory).',
  },
  {
    key: 'rate-stability.maxCv', value: 0.10, unit: '1', display: 'percent',
    rationale: 'Coefficient of variation (SD / mean) of the pump rate while pumping (inside each step for a step-rate test); an unsteady rate bends the loading line.',
    source: 'common practice: constant low rate, about 0.25-0.5 bbl/min (METHODS.md good practice).',
  },
  {
    key: 'shut-in-stability.minDuration', value: 600, unit: 's', display: 'duration-min',
    rationale: 'The shut-in must be recorded long enough to pick ISIP and closure: at least 10 minutes.',
    source: 'common practice: shut-in recorded until the pressure stabilises (METHODS.md good practice).',
  },
  {
    key: 'shut-in-stability.maxEndDeclineRate', value: 5e3 / 60, unit: 'Pa/s', display: 'pressure-rate',
    rationale: 'Pressure decline over the last 2 minutes of the shut-in (least-squares slope) must have slowed below 5 kPa/min (about 0.7 psi/min); a decline that keeps going points to a leak (valve, casing, surface lines) or a shut-in stopped too early.',
    source: 'chosen; stabilised shut-in is common practice (METHODS.md good practice).',
  },
  {
    key: 'shut-in-stability.endWindow', value: 120, unit: 's', display: 'duration-min',
    rationale: 'Length of the final window over which the end decline rate is measured.',
    source: 'chosen.',
  },
  {
    key: 'cycle-repeat.maxRepeatDifference', value: 0.05, unit: '1', display: 'percent',
    rationale: 'ISIP and closure of the last two cycles of an extended leak-off test must each repeat within 5 % of their mean; a larger difference means the fracture was still growing or a pick is off, which lowers the confidence in Shmin.',
    source: 'common practice: two or more cycles with ISIP and closure repeating (METHODS.md good practice; Zoback et al. 2003); 5 % chosen, as for pick-agreement.',
  },
  {
    key: 'sampling.maxInterval', value: 1, unit: 's', display: 'duration-s',
    rationale: 'Median sample interval: a second or faster, so that leak-off, breakdown and ISIP are resolved.',
    source: 'common practice: sampling of a second or faster (METHODS.md good practice).',
  },
  {
    key: 'sampling.minLoadingSamples', value: 20, unit: '1', display: 'count',
    rationale: 'Samples in the fitted linear loading part of the first cycle; fewer cannot establish a line or its departure.',
    source: 'chosen.',
  },
  {
    key: 'gauge-range.maxFraction', value: 0.95, unit: '1', display: 'percent',
    rationale: 'Highest gauge reading over the gauge full-scale range; near full scale the gauge may saturate and its accuracy is poorest.',
    source: 'common practice: a gauge whose range is not reached (METHODS.md good practice).',
  },
  {
    key: 'gauge-range.maxFlatTopSamples', value: 5, unit: '1', display: 'count',
    rationale: 'A run of this many or more consecutive identical readings at the record maximum, while pumping, is taken as clipping.',
    source: 'chosen.',
  },
  {
    key: 'pick-agreement.maxSpreadFraction', value: 0.05, unit: '1', display: 'percent',
    rationale: 'Spread (max - min) of the closure picks by different methods, over their mean; their agreement is itself a quality signal.',
    source: 'ISRM Suggested Methods Part 3, Haimson & Cornet (2003), IJRMMS 40:1011-1020 (use several methods); 5 % chosen.',
  },
];

/**
 * Keys a limit had before it was renamed -> its key now. Saved project and test limits under an
 * old key still apply: resolveLimits reads them as the new key.
 * 'second-cycle.maxRepeatDifference' moved when the ISIP / closure repeat became its own
 * criterion, 'cycle-repeat'.
 */
export const LIMIT_KEY_ALIASES: Readonly<Record<string, string>> = {
  'second-cycle.maxRepeatDifference': 'cycle-repeat.maxRepeatDifference',
};

/** The limit entries by key. */
const BY_KEY: ReadonlyMap<string, QualityLimit> = new Map(DEFAULT_LIMITS.map((l) => [l.key, l]));

/**
 * The current key of a limit key, through LIMIT_KEY_ALIASES.
 * @param key a limit key, current or old. @returns the current key (the key itself when it is no alias). @throws nothing.
 * @example canonicalLimitKey('second-cycle.maxRepeatDifference') // 'cycle-repeat.maxRepeatDifference'
 */
export function canonicalLimitKey(key: string): string {
  return Object.prototype.hasOwnProperty.call(LIMIT_KEY_ALIASES, key) ? LIMIT_KEY_ALIASES[key] : key;
}

/** Resolved limits: key -> value. */
export type LimitValues = Readonly<Record<string, number>>;

/**
 * Merge project overrides into the default limits.
 *
 * @param overrides key -> value (keys from DEFAULT_LIMITS, or an old key of LIMIT_KEY_ALIASES,
 *   read as its current key; values finite, in the limit's unit). When an old key and its
 *   current key are both given, the current key's value wins.
 * @returns every default key with its value, overrides applied (current keys only).
 * @throws EngineError 'bad-argument' for an unknown key or a non-finite value.
 * @example resolveLimits({'loading-linearity.minR2': 0.99})['loading-linearity.minR2'] // 0.99
 */
export function resolveLimits(overrides: Record<string, number> = {}): LimitValues {
  const values: Record<string, number> = {};
  for (const l of DEFAULT_LIMITS) values[l.key] = l.value;
  const entries = Object.entries(overrides);
  // Old keys first, so that a current key given beside its old one wins.
  const ordered = [...entries.filter(([k]) => canonicalLimitKey(k) !== k), ...entries.filter(([k]) => canonicalLimitKey(k) === k)];
  for (const [key, value] of ordered) {
    const current = canonicalLimitKey(key);
    if (!BY_KEY.has(current)) {
      throw new EngineError('bad-argument', `unknown quality limit "${key}"`, {}, `one of ${[...BY_KEY.keys()].join(', ')}`);
    }
    if (!Number.isFinite(value)) {
      throw new EngineError('bad-argument', `quality limit "${key}" is not a finite number`, {}, `a number in ${BY_KEY.get(current)?.unit}`);
    }
    values[current] = value;
  }
  return values;
}

/**
 * The documented limit entry for a key (an old key of LIMIT_KEY_ALIASES gives the entry of its
 * current key, whose `key` field is the current one).
 * @param key limit key. @returns the entry, or null for an unknown key. @throws nothing.
 * @example limitDefinition('sampling.maxInterval')?.unit // 's'
 */
export function limitDefinition(key: string): QualityLimit | null {
  return BY_KEY.get(canonicalLimitKey(key)) ?? null;
}
