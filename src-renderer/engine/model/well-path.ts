/**
 * A well's path for the stress model: the minimum-curvature positions of its survey
 * (analysis/survey.ts) with the well taken as vertical above the first station, and the
 * conversions between MD and TVD the model needs (the table's MD column, an MD-indexed
 * density log). Depths in m below the rig floor; angles in degrees.
 */
import { EngineError } from '../errors';
import { mdAtTvd, minimumCurvature, tvdAtMd, type SurveyPoint, type SurveyStation } from '../analysis/survey';

/** A surveyed well: its name, the computed path and the statement of how it was built. */
export interface WellPath {
  well: string;
  path: SurveyPoint[];
  provenance: string;
}

/**
 * The path of a well from its survey stations by minimum curvature, starting at TVD = MD of
 * the first station (vertical above it: common practice when the survey starts below the
 * rig floor, exact when it starts at MD 0).
 *
 * @param well well name. @param stations MD (m, increasing), inclination 0-180 and azimuth in degrees, at least two.
 * @returns the {@link WellPath}.
 * @throws EngineError 'too-few-points' with fewer than two stations; 'bad-survey' from the survey validation.
 * @example wellPathFromSurvey('HF-3', stations).path[1].tvd
 */
export function wellPathFromSurvey(well: string, stations: readonly SurveyStation[]): WellPath {
  if (stations.length < 2) throw new EngineError('too-few-points', `the survey of ${well} has ${stations.length} station(s)`, {}, 'at least two survey stations');
  const first = stations[0];
  const path = minimumCurvature(stations, { tvd: first.md, north: 0, east: 0 });
  const last = path[path.length - 1];
  return {
    well,
    path,
    provenance: `MD of ${well} from its survey (${stations.length} stations, MD ${first.md}-${last.md} m) by minimum curvature${first.md > 0 ? `, vertical above ${first.md} m MD` : ''}; MD is given only within the surveyed depths.`,
  };
}

/**
 * Measured depth at a TVD along the well (the shallowest crossing), or null outside the
 * surveyed depths.
 *
 * @param well from {@link wellPathFromSurvey}. @param tvd TVD below rig floor, m.
 * @returns MD in m or null.
 * @throws EngineError 'bad-argument' for a non-finite TVD.
 * @example measuredDepthAtTvd(well, 2000) // e.g. 2240.5
 */
export function measuredDepthAtTvd(well: WellPath, tvd: number): number | null {
  return mdAtTvd(well.path, tvd);
}

/**
 * TVD at a measured depth: minimum curvature within the survey, the MD itself above the
 * first station (vertical), and below the last station the last direction held.
 *
 * @param well from {@link wellPathFromSurvey}. @param md MD below rig floor, m, finite.
 * @returns TVD in m.
 * @throws EngineError 'bad-argument' for a non-finite MD.
 * @example trueVerticalDepthAtMd(well, 2500)
 */
export function trueVerticalDepthAtMd(well: WellPath, md: number): number {
  const path = well.path;
  if (!Number.isFinite(md)) throw new EngineError('bad-argument', `MD ${md} is not a number`, {}, 'a finite MD in m');
  if (md <= path[0].md) return path[0].tvd - (path[0].md - md);
  const last = path[path.length - 1];
  if (md >= last.md) return last.tvd + (md - last.md) * Math.cos((last.inc * Math.PI) / 180);
  return tvdAtMd(path, md) as number;
}
