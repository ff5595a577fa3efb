/**
 * Depth intervals for a piecewise Shmin trend, from chosen break depths (TVD, m) or from
 * the formation names the tests carry.
 */
import { EngineError } from '../errors';
import { UNNAMED_FORMATION, type DepthInterval } from './shmin-trend';

/**
 * Depth intervals split at the given TVDs: [0, b1), [b1, b2), ... [bn, infinity), named
 * by their limits ("0-1500 m", "1500 m and deeper").
 *
 * @param breaks TVDs of the breaks, m, positive, finite (any order; repeats are dropped).
 * @returns the intervals, shallowest first; one interval from 0 with no breaks.
 * @throws EngineError 'bad-argument' for a non-positive or non-finite break.
 * @example intervalsFromBreaks([1500]) // [{name: '0-1500 m', top: 0, base: 1500}, {name: '1500 m and deeper', top: 1500, base: Infinity}]
 */
export function intervalsFromBreaks(breaks: number[]): DepthInterval[] {
  for (const b of breaks) {
    if (!(b > 0) || !Number.isFinite(b)) throw new EngineError('bad-argument', `trend break at ${b} m is not usable`, {}, 'a TVD > 0 m');
  }
  const sorted = [...new Set(breaks)].sort((a, b) => a - b);
  const edges = [0, ...sorted];
  return edges.map((top, i) => {
    const base = i + 1 < edges.length ? edges[i + 1] : Infinity;
    return { name: base === Infinity ? (top === 0 ? 'all depths' : `${top} m and deeper`) : `${top}-${base} m`, top, base };
  });
}

/** Formation intervals and plain-words notes on how they were drawn. */
export interface FormationIntervals {
  /** One interval per formation name, shallowest first; named as first written. */
  intervals: DepthInterval[];
  notes: string[];
}

/**
 * One depth interval per formation name (case and surrounding blanks ignored; tests with no
 * name form the group {@link UNNAMED_FORMATION}), for a trend fitted with assignBy
 * 'formation'. The fit takes each test by its name; the interval limits only say where each
 * line is drawn and sampled: formations are ordered by their shallowest test, the first
 * starts at 0 m, the last runs on without a base, and neighbours meet midway between the
 * deepest test of the upper and the shallowest of the lower (midway between their middle
 * depths when their tests overlap in depth, which the notes state). A project choice.
 *
 * @param tests the tests to be fitted: formation name (optional) and TVD in m (null or <= 0: left out).
 * @returns the intervals (a single unnamed interval from 0 m when no test has a TVD) and notes.
 * @throws nothing.
 * @example intervalsFromFormations([{ formation: 'Ashgrove Shale', tvd: 900 }, { formation: 'Millrace Sandstone', tvd: 1900 }]).intervals
 *   // [{ name: 'Ashgrove Shale', top: 0, base: 1400 }, { name: 'Millrace Sandstone', top: 1400, base: Infinity }]
 */
export function intervalsFromFormations(tests: readonly { formation?: string; tvd: number | null }[]): FormationIntervals {
  const groups = new Map<string, { name: string; min: number; max: number; n: number }>();
  for (const t of tests) {
    if (t.tvd === null || !(t.tvd > 0) || !Number.isFinite(t.tvd)) continue;
    const name = t.formation?.trim() || UNNAMED_FORMATION;
    const key = name.toLowerCase();
    const g = groups.get(key);
    if (g) {
      g.min = Math.min(g.min, t.tvd);
      g.max = Math.max(g.max, t.tvd);
      g.n += 1;
    } else groups.set(key, { name, min: t.tvd, max: t.tvd, n: 1 });
  }
  const ordered = [...groups.values()].sort((a, b) => a.min - b.min || a.max - b.max || a.name.localeCompare(b.name));
  if (ordered.length === 0) return { intervals: [{ name: UNNAMED_FORMATION, top: 0, base: Infinity }], notes: ['Trend by formation: no test with a TVD.'] };
  const notes = [`Trend by formation: one line per formation name in the files (${ordered.map((g) => `${g.name}: ${g.n} test${g.n === 1 ? '' : 's'}`).join(', ')}); lines meet midway between neighbouring formations' tests.`];
  const unnamed = groups.get(UNNAMED_FORMATION);
  if (unnamed) notes.push(`${unnamed.n} test${unnamed.n === 1 ? ' carries' : 's carry'} no formation name: fitted together as "${UNNAMED_FORMATION}".`);
  const intervals: DepthInterval[] = [];
  let top = 0;
  ordered.forEach((g, i) => {
    const next = ordered[i + 1];
    let base = Infinity;
    if (next) {
      const overlap = g.max > next.min;
      base = overlap ? ((g.min + g.max) / 2 + (next.min + next.max) / 2) / 2 : (g.max + next.min) / 2;
      // Keep the limits strictly increasing (10 cm apart at least) whatever the overlap.
      if (!(base > top)) base = top + 0.1;
      if (overlap) notes.push(`Formations ${g.name} (tests ${g.min}-${g.max} m) and ${next.name} (${next.min}-${next.max} m) overlap in depth: each test is fitted with its own formation, the lines change at ${base.toFixed(1)} m.`);
    }
    intervals.push({ name: g.name, top, base });
    top = base;
  });
  return { intervals, notes };
}
