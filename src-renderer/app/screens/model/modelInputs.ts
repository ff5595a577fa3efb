/**
 * From archive rows to the model's test inputs. The archive keeps SI, so this only
 * renames fields; SHmax from the reopening relation comes from a test's analysis when
 * it has been loaded. Also the trend shape of the screen's choice (one line, depth
 * breaks, formations).
 */
import type { TestSummary } from '../../../archive/api';
import type { ModelTestInput } from '../../../engine/model/regional-model';
import type { TrendOptions } from '../../../engine/model/shmin-trend';
import { intervalsFromBreaks, intervalsFromFormations } from '../../../engine/model/trend-intervals';
import type { AnalysisResult } from '../../../engine/result';

/** How the screen fits the Shmin trend: one line, one line per depth interval between breaks, or one per formation. */
export type TrendChoice = 'one' | 'breaks' | 'formation';

/** Whether any of these tests names its formation (the screen offers "by formation" only then). */
export function testsHaveFormations(tests: readonly ModelTestInput[]): boolean {
  return tests.some((t) => !!t.formation?.trim());
}

/**
 * The trend options of the screen's choice, with notes for the provenance.
 *
 * @param choice one line, by depth breaks, or by formation.
 * @param tests the tests that may be fitted (the screen passes the chosen field's and wells' accepted tests).
 * @param breakDepths break TVDs, m (used with 'breaks'; none gives one line).
 * @returns options for buildRegionalModel (undefined: one line) and notes; 'formation' falls back
 *   to one line (with a note) when no test names its formation.
 * @throws EngineError 'bad-argument' from intervalsFromBreaks for an unusable break.
 */
export function trendOptionsForChoice(choice: TrendChoice, tests: readonly ModelTestInput[], breakDepths: number[]): { trend: TrendOptions | undefined; notes: string[] } {
  if (choice === 'breaks' && breakDepths.length) return { trend: { shape: { kind: 'intervals', intervals: intervalsFromBreaks(breakDepths) } }, notes: [] };
  if (choice === 'formation') {
    if (!testsHaveFormations(tests)) return { trend: undefined, notes: ['No test names its formation: one trend line for all depths.'] };
    const { intervals, notes } = intervalsFromFormations(tests.filter((t) => t.shmin?.kind === 'estimate'));
    return { trend: { shape: { kind: 'intervals', assignBy: 'formation', intervals } }, notes };
  }
  return { trend: undefined, notes: [] };
}

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
    ...(s.formation ? { formation: s.formation } : {}),
  };
}
