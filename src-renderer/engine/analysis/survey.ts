/**
 * Directional survey by the minimum curvature method: positions (TVD, north, east) from
 * measured depth, inclination and azimuth stations, and TVD at any measured depth by
 * following the circular arc between stations (not a straight line).
 *
 *   cos(beta) = cos(I2 - I1) - sin(I1) sin(I2) (1 - cos(A2 - A1))
 *   RF = (2 / beta) tan(beta / 2)  (RF -> 1 as beta -> 0)
 *   dN = dMD/2 (sin I1 cos A1 + sin I2 cos A2) RF, dE likewise with sin A, dV with cos I
 *
 * Verified against the ISCWSA standard well paths (ISCWSA clearance set r4, 2017, and the
 * MWD error-model test wells of SPE 67616). Depths are for review by a qualified engineer;
 * they are not a substitute for the operator's well-control policy and defer to local
 * regulations and licensed practice.
 */
import { EngineError } from '../errors';

/** One survey station as measured: MD (m, or any length unit), inclination and azimuth in degrees. */
export interface SurveyStation {
  md: number;
  inc: number;
  azi: number;
}

/** A station with its computed position and the dogleg severity of the interval ending at it. */
export interface SurveyPoint extends SurveyStation {
  tvd: number;
  north: number;
  east: number;
  /** Dogleg severity of the interval from the previous station, degrees per 30 length units (0 at the first). */
  dogleg: number;
}

const DEG = Math.PI / 180;

/** Unit tangent (north, east, down) of an inclination/azimuth in degrees. */
function tangent(inc: number, azi: number): [number, number, number] {
  const i = inc * DEG;
  const a = azi * DEG;
  return [Math.sin(i) * Math.cos(a), Math.sin(i) * Math.sin(a), Math.cos(i)];
}

/** Angle between two unit vectors, robust for small and large angles (atan2 of |cross| and dot). */
function angleBetween(t1: [number, number, number], t2: [number, number, number]): number {
  const cx = t1[1] * t2[2] - t1[2] * t2[1];
  const cy = t1[2] * t2[0] - t1[0] * t2[2];
  const cz = t1[0] * t2[1] - t1[1] * t2[0];
  const dot = t1[0] * t2[0] + t1[1] * t2[1] + t1[2] * t2[2];
  return Math.atan2(Math.hypot(cx, cy, cz), dot);
}

/**
 * Offset (north, east, down) along the circular arc from a station with tangent t1 towards
 * one with tangent t2 (dogleg beta over course length L), after arc length s (0 <= s <= L):
 * integral of the slerp tangent, (L/beta)/sin(beta) [(cos(beta - phi) - cos beta) t1 +
 * (1 - cos phi) t2], phi = beta s / L; at s = L this is L/2 RF (t1 + t2). Series for tiny beta.
 */
function arcOffset(t1: [number, number, number], t2: [number, number, number], beta: number, length: number, s: number): [number, number, number] {
  const f = length > 0 ? s / length : 0;
  let c1: number;
  let c2: number;
  if (beta < 1e-6) {
    c1 = length * (f - (f * f) / 2);
    c2 = (length * f * f) / 2;
  } else {
    const phi = beta * f;
    const k = length / beta / Math.sin(beta);
    c1 = k * (Math.cos(beta - phi) - Math.cos(beta));
    c2 = k * (1 - Math.cos(phi));
  }
  return [c1 * t1[0] + c2 * t2[0], c1 * t1[1] + c2 * t2[1], c1 * t1[2] + c2 * t2[2]];
}

function validate(stations: readonly SurveyStation[]): void {
  if (stations.length === 0) throw new EngineError('bad-survey', 'the survey has no stations', {}, 'at least one station');
  stations.forEach((s, i) => {
    const where = { line: i + 1 };
    if (!Number.isFinite(s.md)) throw new EngineError('bad-survey', `station ${i + 1}: measured depth is not a number`, where, 'a finite MD');
    if (!Number.isFinite(s.inc) || s.inc < 0 || s.inc > 180) {
      throw new EngineError('bad-survey', `station ${i + 1}: inclination ${s.inc} is outside 0-180 degrees`, where, 'inclination from 0 to 180 degrees');
    }
    if (!Number.isFinite(s.azi)) throw new EngineError('bad-survey', `station ${i + 1}: azimuth is not a number`, where, 'a finite azimuth in degrees');
    if (i > 0 && !(s.md > stations[i - 1].md)) {
      throw new EngineError('bad-survey', `station ${i + 1}: measured depth ${s.md} does not increase (previous ${stations[i - 1].md})`, where, 'measured depth increasing station by station');
    }
  });
}

/**
 * Minimum curvature positions of a survey (the industry-standard method; formulas above,
 * as in the ISCWSA standard well-path listings). Azimuths are used as given (any finite
 * value; grid or true north is the caller's choice).
 *
 * @param stations MD (length unit, increasing), inclination 0-180 degrees, azimuth degrees.
 * @param start position of the first station, same length unit; default the origin.
 * @returns one point per station: MD, inc, azi, TVD, north, east, dogleg severity in degrees
 *   per 30 length units (deg/30 m for metres).
 * @throws EngineError 'bad-survey' naming the station (1-based, also as `line`) when MD does
 *   not increase, an inclination is outside 0-180, an azimuth is not finite, the direction
 *   reverses between two stations (dogleg 180 degrees), or there are no stations.
 * @example minimumCurvature([{ md: 0, inc: 0, azi: 0 }, { md: 100, inc: 10, azi: 90 }])
 */
export function minimumCurvature(stations: readonly SurveyStation[], start: { tvd: number; north: number; east: number } = { tvd: 0, north: 0, east: 0 }): SurveyPoint[] {
  validate(stations);
  if (![start.tvd, start.north, start.east].every(Number.isFinite)) {
    throw new EngineError('bad-survey', 'the start position is not finite', {}, 'finite TVD, north and east');
  }
  const out: SurveyPoint[] = [{ ...pick(stations[0]), tvd: start.tvd, north: start.north, east: start.east, dogleg: 0 }];
  for (let i = 1; i < stations.length; i++) {
    const a = stations[i - 1];
    const b = stations[i];
    const t1 = tangent(a.inc, a.azi);
    const t2 = tangent(b.inc, b.azi);
    const beta = angleBetween(t1, t2);
    if (Math.PI - beta < 1e-9) {
      throw new EngineError('bad-survey', `station ${i + 1}: the direction reverses (dogleg of 180 degrees), so no arc joins it to station ${i}`, { line: i + 1 }, 'a dogleg below 180 degrees between stations');
    }
    const length = b.md - a.md;
    const [dn, de, dv] = arcOffset(t1, t2, beta, length, length);
    const previous = out[i - 1];
    out.push({
      ...pick(b),
      tvd: previous.tvd + dv,
      north: previous.north + dn,
      east: previous.east + de,
      dogleg: (beta / DEG) * (30 / length),
    });
  }
  return out;
}

function pick(s: SurveyStation): SurveyStation {
  return { md: s.md, inc: s.inc, azi: s.azi };
}

/**
 * Position, inclination and azimuth at any measured depth within the surveyed range,
 * following the minimum-curvature arc between the bracketing stations.
 *
 * @param path output of {@link minimumCurvature}. @param md measured depth, same unit.
 * @returns the interpolated point (dogleg of its interval), or null when md lies outside
 *   the first and last station.
 * @throws EngineError 'bad-argument' for a non-finite md or an empty path.
 * @example positionAtMd(path, 1234.5)?.tvd
 */
export function positionAtMd(path: readonly SurveyPoint[], md: number): SurveyPoint | null {
  if (!Number.isFinite(md)) throw new EngineError('bad-argument', `measured depth ${md} is not a number`, {}, 'a finite MD');
  if (path.length === 0) throw new EngineError('bad-argument', 'the survey path is empty', {}, 'a computed survey path');
  if (md < path[0].md || md > path[path.length - 1].md) return null;
  let lo = 0;
  let hi = path.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (path[mid].md <= md) lo = mid;
    else hi = mid;
  }
  const a = path[lo];
  if (md === a.md || path.length === 1) return { ...a };
  const b = path[hi];
  const t1 = tangent(a.inc, a.azi);
  const t2 = tangent(b.inc, b.azi);
  const beta = angleBetween(t1, t2);
  const length = b.md - a.md;
  const s = md - a.md;
  const [dn, de, dv] = arcOffset(t1, t2, beta, length, s);
  // Tangent at s: slerp of t1 and t2.
  const f = s / length;
  const w1 = beta < 1e-6 ? 1 - f : Math.sin((1 - f) * beta) / Math.sin(beta);
  const w2 = beta < 1e-6 ? f : Math.sin(f * beta) / Math.sin(beta);
  const t = [w1 * t1[0] + w2 * t2[0], w1 * t1[1] + w2 * t2[1], w1 * t1[2] + w2 * t2[2]];
  const horizontal = Math.hypot(t[0], t[1]);
  const inc = Math.atan2(horizontal, t[2]) / DEG;
  let azi = horizontal > 1e-12 ? Math.atan2(t[1], t[0]) / DEG : a.azi;
  if (azi < 0) azi += 360;
  return { md, inc, azi, tvd: a.tvd + dv, north: a.north + dn, east: a.east + de, dogleg: b.dogleg };
}

/**
 * True vertical depth at a measured depth by minimum curvature between stations.
 *
 * @param path output of {@link minimumCurvature}. @param md measured depth, same unit.
 * @returns TVD, or null when md lies outside the surveyed range.
 * @throws EngineError 'bad-argument' for a non-finite md or an empty path.
 * @example tvdAtMd(path, 2500) // metres
 */
export function tvdAtMd(path: readonly SurveyPoint[], md: number): number | null {
  return positionAtMd(path, md)?.tvd ?? null;
}

/**
 * The shallowest measured depth at which the path reaches a true vertical depth (the
 * first crossing: a path that turns upward can reach a TVD twice), solved by bisection on
 * the minimum-curvature arc to 1e-12 relative.
 *
 * @param path output of {@link minimumCurvature}. @param tvd true vertical depth, same unit.
 * @returns MD, or null when the path never reaches that TVD.
 * @throws EngineError 'bad-argument' for a non-finite tvd or an empty path.
 * @example mdAtTvd(path, 1800)
 */
export function mdAtTvd(path: readonly SurveyPoint[], tvd: number): number | null {
  if (!Number.isFinite(tvd)) throw new EngineError('bad-argument', `TVD ${tvd} is not a number`, {}, 'a finite TVD');
  if (path.length === 0) throw new EngineError('bad-argument', 'the survey path is empty', {}, 'a computed survey path');
  if (path[0].tvd === tvd) return path[0].md;
  const tvdAt = (md: number) => (positionAtMd(path, md) as SurveyPoint).tvd;
  for (let i = 1; i < path.length; i++) {
    // Within one arc TVD has at most one turning point; 16 pieces isolate it.
    const pieces = 16;
    let previousMd = path[i - 1].md;
    let previousTvd = path[i - 1].tvd;
    for (let p = 1; p <= pieces; p++) {
      const md = p === pieces ? path[i].md : path[i - 1].md + ((path[i].md - path[i - 1].md) * p) / pieces;
      const value = p === pieces ? path[i].tvd : tvdAt(md);
      if ((previousTvd - tvd) * (value - tvd) <= 0) {
        let lo = previousMd;
        let hi = md;
        let loSign = previousTvd - tvd;
        if (loSign === 0) return lo;
        const tolerance = 1e-12 * Math.max(1, Math.abs(hi));
        for (let iteration = 0; iteration < 200 && hi - lo > tolerance; iteration++) {
          const mid = (lo + hi) / 2;
          const sign = tvdAt(mid) - tvd;
          if (sign === 0) return mid;
          if (sign * loSign > 0) {
            lo = mid;
            loSign = sign;
          } else hi = mid;
        }
        return (lo + hi) / 2;
      }
      previousMd = md;
      previousTvd = value;
    }
  }
  return null;
}
