import type { StoredSamples, TestDetail, TestHeader } from './api';
import { announceChange, nowIso, type ArchiveContext } from './archive-context';
import { eventsForTest } from './archive-events';
import { rememberRows } from './archive-list';
import { getSettings } from './archive-settings';
import type { StoredPick, StoredTest } from './db';
import { ArchiveError } from './errors';
import { canonicalJson } from './journal/canonical';
import { toSummary } from './query';
import type { ManualPick } from './team-rebuild';
import type { AnalysisOptions } from '../engine/analysis-options';
import { downholePressure } from '../engine/analysis/downhole';
import { isEngineError } from '../engine/errors';
import type { TestRecord } from '../engine/record';
import type { AnalysisResult } from '../engine/result';
import { canonicalLimitKey } from '../engine/quality/limits';

/**
 * A stored test and its analysis: the engine record and options made from the rows, the
 * summary and grade rows made from the result, the manual picks in force, and reading a
 * test back re-analysed with the current limits (getTest, regradeAll).
 */

/** The stored test, or ArchiveError 'not-found'. */
export async function requireTest(context: ArchiveContext, testId: string): Promise<StoredTest> {
  const test = await context.db.tests.get(testId);
  if (!test) throw new ArchiveError('not-found', `No test with id ${testId}.`);
  return test;
}

/** Manual picks in force from the pick history (latest per cycle and kind, after the last reset). */
export function foldPicks(rows: StoredPick[]): ManualPick[] {
  const inForce = new Map<string, ManualPick>();
  for (const row of rows) {
    if (row.kind === 'reset') { inForce.clear(); continue; }
    inForce.set(`${row.cycle}:${row.kind}`, { cycle: row.cycle, kind: row.kind, pick: row.pick, reason: row.reason, author: row.author, time: row.time });
  }
  return [...inForce.values()].sort((a, b) => a.cycle - b.cycle || a.kind.localeCompare(b.kind));
}

/** The manual picks in force of a stored test, from its picks table rows. */
export async function manualPicksInForce(context: ArchiveContext, testId: string): Promise<ManualPick[]> {
  const rows = await context.db.picks.where('testId').equals(testId).sortBy('seq');
  return foldPicks(rows);
}

/** The engine record of a stored test and its samples. */
export function recordOf(test: StoredTest, samples: { time: Float64Array; pressure: Float64Array; rate: Float64Array; volume: Float64Array }): TestRecord {
  return { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume, metadata: test.metadata, source: test.source };
}

/** Limits with renamed keys under their current names, so a test's own value still wins over the project's. */
function canonicalLimits(limits: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [key, value] of Object.entries(limits)) out[canonicalLimitKey(key)] = value;
  return out;
}

/** Engine options for a stored test: its type unless inferred, project limits under its own, the manual picks. */
export function analysisOptions(test: StoredTest, limits: Record<string, number>, manualPicks: ManualPick[]): AnalysisOptions {
  return {
    type: test.typeInferred ? undefined : test.type,
    limits: test.limits ? { ...canonicalLimits(limits), ...canonicalLimits(test.limits) } : limits,
    manualPicks: manualPicks.map(({ cycle, kind, pick, reason }) => ({ cycle, kind, pick, reason })),
  };
}

/** The parts of a test row that come from its analysis. */
export function summaryFromAnalysis(analysis: AnalysisResult): Pick<StoredTest, 'type' | 'typeInferred' | 'depthTvd' | 'depthMd' | 'shmin' | 'shminKind' | 'grade'> {
  const shmin = analysis.stress.shmin;
  return {
    type: analysis.type,
    typeInferred: analysis.typeInferred,
    depthTvd: analysis.metadata.depthTvd ?? null,
    depthMd: analysis.metadata.depthMd ?? null,
    shmin: shmin ? shmin.value : null,
    shminKind: shmin ? shmin.kind : null,
    grade: analysis.quality.grade,
  };
}

/** The grades table row of an analysis under these limits. */
export function gradeRow(testId: string, analysis: AnalysisResult, limits: Record<string, number>, time: string) {
  return { testId, grade: analysis.quality.grade, quality: analysis.quality, limitsKey: canonicalJson(limits), computedAt: time };
}

/** A test with samples, re-analysed with its manual picks and the project limits; a changed summary is written back. */
export async function getTest(context: ArchiveContext, testId: string): Promise<TestDetail> {
  const { db } = context;
  // The reads go out together, and the review log is read while the engine analyses.
  const [test, samples, manualPicks, settings] = await Promise.all([
    requireTest(context, testId), db.samples.get(testId), manualPicksInForce(context, testId), getSettings(context),
  ]);
  if (!samples) throw new ArchiveError('not-found', `The samples of test ${testId} are missing.`);
  return analysedDetail(context, test, { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume }, manualPicks, settings.limits);
}

/** The stored test and its samples analysed; a changed grade or Shmin is written back to the summary. */
async function analysedDetail(context: ArchiveContext, test: StoredTest, samples: StoredSamples, manualPicks: ManualPick[],
  limits: Record<string, number>): Promise<TestDetail> {
  const { db } = context;
  const testId = test.id;
  const log = eventsForTest(context, testId);
  log.catch(() => { /* reported where awaited below */ });
  const analysis = await context.engine.analyse(recordOf(test, samples), analysisOptions(test, limits, manualPicks));
  const updated = { ...test, ...summaryFromAnalysis(analysis) };
  if (updated.grade !== test.grade || updated.shmin !== test.shmin || updated.shminKind !== test.shminKind) {
    await db.transaction('rw', [db.tests, db.grades], async () => {
      await db.tests.put(updated);
      await db.grades.put(gradeRow(testId, analysis, limits, nowIso(context)));
    });
    rememberRows(context, [updated]);
    announceChange(context);
  }
  return {
    summary: toSummary(updated),
    metadata: test.metadata,
    samples,
    analysis,
    manualPicks,
    log: await log,
  };
}

/**
 * A stored test read without analysing it: summary, metadata, samples, the manual picks in
 * force, and the downhole pressure (gauge readings plus the constant hydrostatic correction
 * of engine/analysis/downhole.ts; null when the metadata cannot give it).
 * @throws ArchiveError 'not-found' for an unknown test or missing samples.
 */
export async function getTestHeader(context: ArchiveContext, testId: string): Promise<TestHeader> {
  const [test, samples, manualPicks] = await Promise.all([
    requireTest(context, testId), context.db.samples.get(testId), manualPicksInForce(context, testId),
  ]);
  if (!samples) throw new ArchiveError('not-found', `The samples of test ${testId} are missing.`);
  let downhole: { pressure: Float64Array; correction: number } | null = null;
  try {
    downhole = downholePressure(samples.pressure, test.metadata, test.source.fileName);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    // No downhole series without TVD and mud density; the analysis names what is missing.
  }
  return {
    summary: toSummary(test),
    metadata: test.metadata,
    samples: { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume },
    manualPicks,
    downholePressure: downhole ? downhole.pressure : null,
    hydrostaticCorrection: downhole ? downhole.correction : null,
  };
}

/**
 * The detail of a test read with getTestHeader: the header's samples (not read again)
 * analysed with the manual picks and project limits in force now, exactly as getTest.
 * @throws ArchiveError 'not-found' when the test is no longer in the archive.
 */
export async function getTestDetail(context: ArchiveContext, header: TestHeader): Promise<TestDetail> {
  const testId = header.summary.id;
  const [test, manualPicks, settings] = await Promise.all([
    requireTest(context, testId), manualPicksInForce(context, testId), getSettings(context),
  ]);
  return analysedDetail(context, test, header.samples, manualPicks, settings.limits);
}

/** Re-analyse every test with the current limits; the number of summaries whose grade changed. */
export async function regradeAll(context: ArchiveContext, onProgress?: (done: number, total: number) => void): Promise<number> {
  const ids = (await context.db.tests.toCollection().primaryKeys()) as string[];
  let changedCount = 0;
  for (let i = 0; i < ids.length; i++) {
    const before = await context.db.tests.get(ids[i]);
    const detail = await getTest(context, ids[i]);
    if (before && before.grade !== detail.summary.grade) changedCount += 1;
    onProgress?.(i + 1, ids.length);
  }
  return changedCount;
}
