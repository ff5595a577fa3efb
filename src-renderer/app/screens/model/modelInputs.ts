/**
 * From archive rows to the model's test inputs. The archive keeps SI, so this only
 * renames fields; SHmax from the reopening relation comes from a test's analysis when
 * it has been loaded.
 */
import type { TestSummary } from '../../../archive/api';
import type { ModelTestInput } from '../../../engine/model/regional-model';
import type { AnalysisResult } from '../../../engine/result';

/**
 * The model's view of one archived test.
 *
 * @param s the archive summary (state, grade, reviewer, TVD, Shmin in Pa).
 * @param analysis the test's analysis, when loaded, for the reopening SHmax and its cautions.
 * @returns the ModelTestInput (Shmin "from" is taken from the analysis when present, else "closure" for estimates and "fitMaximum" for bounds).
 */
export function modelInputFromSummary(s: TestSummary, analysis?: AnalysisResult | null): ModelTestInput {
  const shmax = analysis?.stress.shmax ?? null;
  const shminFrom = analysis?.stress.shmin?.from ?? (s.shminKind === 'estimate' ? 'closure' : 'fitMaximum');
  return {
    testId: s.id,
    file: s.fileName,
    well: s.wellName,
    field: s.fieldName,
    type: s.type,
    tvd: s.depthTvd,
    md: s.depthMd,
    shmin: s.shmin !== null && s.shminKind ? { value: s.shmin, kind: s.shminKind, from: shminFrom } : null,
    grade: s.grade,
    state: s.state,
    reviewer: s.reviewer,
    shmaxReopening: shmax && shmax.value !== null
      ? { value: shmax.value, cautions: [...shmax.cautions, ...(shmax.detectability ? [shmax.detectability.message] : [])] }
      : null,
  };
}
