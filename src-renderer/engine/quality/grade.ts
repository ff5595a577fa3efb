/**
 * The letter grade A (best) to E (unusable) from the quality criteria.
 *
 * Relation to the published ranking. Morawietz et al. (2020), "An open-access stress
 * magnitude database for Germany and adjacent regions", Geothermal Energy 8,
 * doi:10.1186/s40517-020-00178-5, introduced the first quality ranking for stress
 * magnitude data, with classes set by the test type and the uncertainty of the value
 * (METHODS.md). Only the paper's abstract and its figure of schematic FIT / LOT / XLOT
 * pressure curves (after White et al. 2002) could be read here, not its ranking table; the
 * scale below follows its principle (test type caps the best class, uncertainty lowers it;
 * FIT and LOT rank low), not its exact class boundaries, which are not reproduced.
 *
 * - Ceiling by test type (what the test can measure at best): XLOT and DFIT A (closure
 *   of a repeated cycle or a long falloff estimates Shmin); SRT B (extension pressure
 *   includes near-well friction); LOT B (single cycle); FIT C (a lower bound only, so it can
 *   never be better than C).
 * - Ceiling by the best Shmin pick found: ISIP or propagation only (upper bounds) B;
 *   leak-off only C; FIT maximum C; no pick at all E.
 * - Each failed major criterion lowers the grade one letter; failed minor criteria lower
 *   it one letter per two (rounded up), so a minor failure weighs half a major one.
 * - A major criterion that cannot be judged (pass null) caps the grade at B: an A must be
 *   shown, not assumed.
 *
 * Grades are values, never exceptions. For review by a qualified engineer; not a
 * substitute for the operator's well-control policy; defers to local regulations and
 * licensed practice.
 */
import type { TestType } from '../record';
import { GRADES } from '../result';
import type { CriterionResult, Grade, PickKind } from '../result';

/** Best grade each test type can reach (see the module comment). */
export const GRADE_CEILING_BY_TYPE: Readonly<Record<TestType, Grade>> = {
  xlot: 'A', dfit: 'A', srt: 'B', lot: 'B', fit: 'C',
};

/** Best grade by the pick Shmin comes from. */
export const GRADE_CEILING_BY_SHMIN_SOURCE: Readonly<Partial<Record<PickKind, Grade>>> = {
  closure: 'A', extension: 'B', isip: 'B', propagation: 'B', leakOff: 'C', fitMaximum: 'C',
};

const TYPE_REASON: Readonly<Record<TestType, string>> = {
  xlot: 'an extended leak-off test can reach A',
  dfit: 'a diagnostic fracture injection test can reach A',
  srt: 'a step-rate test can reach at best B, its extension pressure including near-well friction',
  lot: 'a single-cycle leak-off test can reach at best B',
  fit: 'a formation integrity test only bounds Shmin from below, so it can reach at best C',
};

function worse(a: Grade, b: Grade): Grade {
  return GRADES.indexOf(a) >= GRADES.indexOf(b) ? a : b;
}

/**
 * Grade from the criteria, the test type and where Shmin came from.
 *
 * @param type test type.
 * @param criteria criterion results (only those that apply to the type).
 * @param shminSource the pick kind Shmin came from, or null when no pick estimates or bounds it.
 * @returns {grade, explanation} with every reason in plain words.
 * @throws nothing.
 * @example gradeFromCriteria('fit', [], 'fitMaximum').grade // 'C'
 */
export function gradeFromCriteria(type: TestType, criteria: readonly CriterionResult[], shminSource: PickKind | null): { grade: Grade; explanation: string } {
  const reasons: string[] = [];
  let ceiling = GRADE_CEILING_BY_TYPE[type];
  reasons.push(`Best possible ${ceiling}: ${TYPE_REASON[type]}.`);
  if (shminSource === null) {
    return { grade: 'E', explanation: `${reasons[0]} Graded E: no pick estimates or bounds Shmin, so the test is unusable for the stress model.` };
  }
  const bySource = GRADE_CEILING_BY_SHMIN_SOURCE[shminSource] ?? 'C';
  if (worse(bySource, ceiling) !== ceiling) {
    ceiling = bySource;
    reasons.push(`Capped at ${bySource}: Shmin comes from the ${shminSource} pick only.`);
  }
  const unjudgedMajor = criteria.filter((c) => c.severity === 'major' && c.pass === null);
  if (unjudgedMajor.length > 0 && worse(ceiling, 'B') === 'B' && ceiling !== 'B') {
    ceiling = 'B';
    reasons.push(`Capped at B: ${unjudgedMajor.map((c) => c.id).join(', ')} could not be judged.`);
  }
  const majors = criteria.filter((c) => c.severity === 'major' && c.pass === false);
  const minors = criteria.filter((c) => c.severity === 'minor' && c.pass === false);
  const steps = majors.length + Math.ceil(minors.length / 2);
  const index = Math.min(GRADES.length - 1, GRADES.indexOf(ceiling) + steps);
  const grade = GRADES[index];
  if (majors.length > 0) reasons.push(`Failed major criteria (one letter each): ${majors.map((c) => c.id).join(', ')}.`);
  if (minors.length > 0) reasons.push(`Failed minor criteria (one letter per two): ${minors.map((c) => c.id).join(', ')}.`);
  if (steps === 0) reasons.push('Every criterion that could be judged passed.');
  reasons.push(`Grade ${grade}.`);
  return { grade, explanation: reasons.join(' ') };
}
