/**
 * Closure pick by the bilinear |dP/dt| versus P plot of the ISRM Suggested Methods (Haimson
 * & Cornet 2003), on bins evenly spaced in shut-in time.
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { ClosureCandidate } from '../result';
import { fitLine, fitLinearModel } from './least-squares';
import { declinesSignificantly, derivativesInVariable, MIN_VALID_BINS, nearestSampleIndex, peakRateBin } from './shut-in-derivatives';
import { filledSeries, type ShutInWindow } from './shut-in-window';

/** Smallest ratio between the two slopes of the bilinear |dP/dt| versus P fit. */
const BILINEAR_SLOPE_RATIO = 1.5;

/**
 * Closure by two straight lines on |dP/dt| versus P, closure at their intersection (ISRM
 * Suggested Methods, Haimson & Cornet 2003, IJRMMS 40:1011-1020); break chosen by least
 * total squared error; null unless the slopes differ 1.5 times or more and two lines fit
 * four times better than one. A gradual change (one parabola fits nearly as well) gives a
 * candidate marked `gradual: true`.
 *
 * @param time elapsed time, s. @param pressure downhole pressure, Pa. @param s the prepared shut-in.
 * @returns the candidate 'bilinear-dpdt' (pressure Pa, time s), or null. @throws nothing.
 * @example bilinearClosure(time, p, s)?.gradual
 */
export function bilinearClosure(time: ArrayLike<number>, pressure: ArrayLike<number>, s: ShutInWindow): ClosureCandidate | null {
  // Bins evenly spaced in time: the |dP/dt| versus P plot as the record samples it.
  const elapsed = filledSeries(s.last - s.first + 1, (i) => time[s.first + i] - s.t0);
  const d = derivativesInVariable(elapsed, pressure, time, s, false, 0.08, 100);
  const points: { p: number; r: number; k: number }[] = [];
  for (let k = d.lo; k <= d.hi; k++) {
    if (Number.isFinite(d.rate[k])) points.push({ p: d.bins.y[k], r: d.rate[k], k });
  }
  if (points.length < MIN_VALID_BINS || !declinesSignificantly(d, peakRateBin(d, d.lo, d.hi))) return null;
  const p = points.map((v) => v.p);
  const r = points.map((v) => v.r);
  let best: { rss: number; p: number; ratio: number } | null = null;
  for (let j = 3; j <= points.length - 3; j++) {
    const early = fitLine(p, r, 0, j - 1);
    const late = fitLine(p, r, j, points.length - 1);
    const rss = early.residualSd ** 2 * (early.n - 2) + late.residualSd ** 2 * (late.n - 2);
    if (Math.abs(early.slope - late.slope) <= 1e-12 * Math.max(Math.abs(early.slope), Math.abs(late.slope))) continue;
    const crossing = (late.intercept - early.intercept) / (early.slope - late.slope);
    const ratio = Math.max(early.slope / late.slope, late.slope / early.slope);
    if (!best || rss < best.rss) best = { rss, p: crossing, ratio };
  }
  if (!best) return null;
  const pMin = Math.min(...p);
  const pMax = Math.max(...p);
  if (!(best.p > pMin && best.p < pMax)) return null;
  // Two regimes must really be there: the slopes of one sign and differing by a factor of
  // BILINEAR_SLOPE_RATIO, and two lines fitting four times better than one (common practice).
  const single = fitLine(p, r);
  if (!(best.ratio >= BILINEAR_SLOPE_RATIO) || !(best.rss <= 0.25 * single.residualSd ** 2 * (single.n - 2))) return null;
  // A gradual change of regime (a leaking shut-in, a slowly closing fracture) is a curve, not
  // a corner: unless two lines fit four times better than one parabola, their intersection is
  // an artefact of the fit. The candidate is kept (its disagreement with the other methods is
  // the quality signal) but marked, so it is never taken as the cycle's closure pick (the
  // engine's own test; ISRM SM asks for a bilinear trend, Haimson & Cornet 2003).
  const gradual = !twoLinesBeatParabola(p, r, best.rss);
  // Time: the first bin whose pressure is at or below the intersection.
  let k = 0;
  while (k < points.length - 1 && points[k].p > best.p) k++;
  const t = d.bins.companion[points[k].k];
  return { method: 'bilinear-dpdt', pressure: best.p, time: t, sampleIndex: nearestSampleIndex(time, t), ...(gradual ? { gradual: true } : {}) };
}

/**
 * Two lines must leave at most this fraction of a parabola's residual sum of squares: the same
 * factor of four the lines must beat one straight line by. On the synthetic records the
 * gradual change of a leaking DFIT shut-in leaves 31-52 % (its intersection 1.3-1.5 MPa below
 * closure), tight shut-ins from 2000 m down 1-14 %, but shallow, short-pumped ones up to 55 %
 * with a good intersection: the test is a caution, not a sharp line. As the bilinear method
 * is last in preference, a mark only matters when no other method picks.
 */
const BILINEAR_OVER_PARABOLA = 0.25;

/** Whether two lines (rss given) fit r(p) clearly better than one parabola (4 vs 3 parameters). */
function twoLinesBeatParabola(p: number[], r: number[], twoLineRss: number): boolean {
  const mean = p.reduce((a, v) => a + v, 0) / p.length;
  const centred = p.map((v) => v - mean);
  try {
    const parabola = fitLinearModel([centred, centred.map((v) => v * v)], r, { intercept: true });
    return twoLineRss <= BILINEAR_OVER_PARABOLA * parabola.rss;
  } catch {
    return true; // a degenerate parabola (all p equal) cannot compete with the lines
  }
}
