import type { MissingRawFile, TeamIssue } from './api';
import { nowIso, type ArchiveContext } from './archive-context';
import { analysisOptions, foldPicks, gradeRow, recordOf, summaryFromAnalysis } from './archive-analysis';
import { derivedState } from './archive-events';
import { forgetList, rememberRows } from './archive-list';
import { getSettings } from './archive-settings';
import {
  nameKey, type StoredField, type StoredPick, type StoredSamples, type StoredTest, type StoredWell, type StressLedgerDb,
} from './db';
import { ArchiveError } from './errors';
import type { ArchiveEvent } from './events';
import { describeImportFailure } from './import-failure';
import { canonicalJson } from './journal/canonical';
import type { DerivedState, DerivedTest } from './journal/derived-types';
import { manualPicksOf, pickAuthorOf, picksKeyOf, type ManualPick } from './team-rebuild';
import type { TestRecord } from '../engine/record';
import type { AnalysisResult } from '../engine/result';

/**
 * The team rebuild: the tables brought in line with the state derived from the whole
 * review log after events from elsewhere arrived or a conflict was decided. Tests known
 * from the log are built from their raw files through the engine; the plan is made
 * (analysis included) before one write transaction. team-rebuild.ts holds the pure parts.
 */

/** One table rewrite planned by the team rebuild (analysis done before the transaction). */
interface RebuildPlan {
  fields: StoredField[];
  wells: StoredWell[];
  tests: StoredTest[];
  samples: StoredSamples[];
  grades: ReturnType<typeof gradeRow>[];
  picks: { testId: string; rows: StoredPick[] }[];
  deleted: string[];
  projectLimits: Record<string, number> | null;
  missing: MissingRawFile[];
  issues: TeamIssue[];
}

/** What a rebuild saw and left undone. */
export interface RebuildOutcome { state: DerivedState; events: ArchiveEvent[]; missing: MissingRawFile[]; issues: TeamIssue[] }

/**
 * Bring the tables in line with the state derived from the log: new tests (samples
 * built from raw files through the engine, no event written), review states,
 * reviewers, manual picks, limits, conflicts marks. Analysis runs before the write
 * transaction; the transaction is retried when the log grew meanwhile.
 */
export async function rebuildFromLog(context: ArchiveContext, raw: ReadonlyMap<string, Uint8Array>): Promise<RebuildOutcome> {
  const { db } = context;
  for (let attempt = 0; attempt < 4; attempt++) {
    const { state, events, count } = await derivedState(context);
    const plan = await planRebuild(context, state, events, raw);
    const touched: StoredTest[] = [];
    const done = await db.transaction('rw', db.tables, async () => {
      if ((await db.events.count()) !== count) return false;
      await writePlan(db, plan);
      touched.push(...plan.tests);
      return true;
    });
    if (done) {
      if (plan.deleted.length) forgetList(context); else rememberRows(context, touched);
      return { state, events, missing: plan.missing, issues: plan.issues };
    }
  }
  throw new ArchiveError('bad-state', 'The archive kept changing while team changes were applied; try again.');
}

/** The rows to write: new fields and wells, deleted tests, tests built from raw files, changed review and picks. Reads only. */
async function planRebuild(context: ArchiveContext, state: DerivedState, events: readonly ArchiveEvent[], raw: ReadonlyMap<string, Uint8Array>): Promise<RebuildPlan> {
  const { db } = context;
  const plan: RebuildPlan = { fields: [], wells: [], tests: [], samples: [], grades: [], picks: [], deleted: [], projectLimits: null, missing: [], issues: [] };
  const settings = await getSettings(context);
  let limits = settings.limits;
  if (events.some((e) => e.body.kind === 'limits-changed' && e.body.scope === 'project') && canonicalJson(state.projectLimits) !== canonicalJson(limits)) {
    limits = { ...state.projectLimits };
    plan.projectLimits = limits;
  }
  const fieldsById = new Map((await db.fields.toArray()).map((f) => [f.id, f]));
  const takenKeys = new Set([...fieldsById.values()].map((f) => f.nameKey));
  for (const field of Object.values(state.fields)) {
    const known = fieldsById.get(field.id);
    if (known) continue;
    // Two machines that named a field alike with different ids (archives made before
    // ids came from names): both kept, the second under a key that stays unique.
    let key = nameKey(field.name);
    if (takenKeys.has(key)) key = `${key}\u0001${field.id}`;
    takenKeys.add(key);
    const row = { id: field.id, name: field.name, nameKey: key };
    plan.fields.push(row);
    fieldsById.set(row.id, row);
  }
  const parseOptionsByImport = new Map<string, Record<string, unknown>>();
  for (const e of events) if (e.body.kind === 'test-imported' && e.body.parseOptions) parseOptionsByImport.set(e.id, e.body.parseOptions);
  const wellsById = new Map((await db.wells.toArray()).map((w) => [w.id, w]));
  for (const well of Object.values(state.wells)) {
    const known = wellsById.get(well.id);
    const row: StoredWell = {
      ...(known ?? {}), id: well.id, fieldId: well.fieldId, name: well.name, nameKey: nameKey(well.name),
      ...(well.location !== undefined ? { location: well.location } : {}),
      ...(well.rigFloorElevation !== undefined ? { rigFloorElevation: well.rigFloorElevation } : {}),
      ...(well.waterDepth !== undefined ? { waterDepth: well.waterDepth } : {}),
      ...(well.survey ? { survey: well.survey } : {}),
    };
    if (!known || canonicalJson(row) !== canonicalJson(known)) plan.wells.push(row);
    wellsById.set(row.id, row);
  }
  for (const test of Object.values(state.tests)) {
    const row = await db.tests.get(test.id);
    if (test.deleted) { if (row) plan.deleted.push(test.id); continue; }
    const manual = manualPicksOf(test);
    const pickAuthor = pickAuthorOf(test);
    const testLimits = Object.keys(test.limits).length ? { ...test.limits } : undefined;
    const review = {
      state: test.state, reviewer: test.reviewer, lastPickAuthor: pickAuthor,
      ...(test.openConflicts.length ? { openConflicts: [...test.openConflicts] } : {}),
    };
    if (!row) {
      const bytes = raw.get(test.fileHash) ?? (await db.rawFiles.get(test.fileHash))?.bytes;
      if (!bytes) { plan.missing.push({ testId: test.id, fileHash: test.fileHash, fileName: test.fileName }); continue; }
      const well = wellsById.get(test.wellId);
      const field = well ? fieldsById.get(well.fieldId) : undefined;
      if (!well || !field) {
        plan.issues.push({ kind: 'unknown-well', message: `test ${test.id} (${test.fileName}) names well ${test.wellId}, which this archive does not have; not shown yet` });
        continue;
      }
      const built = await buildTestFromRaw(context, test, bytes, parseOptionsByImport.get(test.importEventId), { ...limits, ...(testLimits ?? {}) }, manual);
      if ('issue' in built) { plan.issues.push(built.issue); continue; }
      const { parsed, analysis } = built;
      const stored: StoredTest = {
        id: test.id, fieldId: field.id, fieldName: field.name, wellId: well.id, wellName: well.name, wellNameKey: nameKey(well.name),
        ...summaryFromAnalysis(analysis), ...review, fileName: test.fileName, fileHash: test.fileHash,
        importedAt: test.importedAt, importedBy: test.importedBy, contractor: test.metadata.contractor,
        metadata: test.metadata, source: parsed.source, ...(testLimits ? { limits: testLimits } : {}),
      };
      plan.tests.push(stored);
      plan.samples.push({ testId: test.id, time: parsed.time, pressure: parsed.pressure, rate: parsed.rate, volume: parsed.volume });
      plan.grades.push(gradeRow(test.id, analysis, limits, nowIso(context)));
      plan.picks.push({ testId: test.id, rows: pickRowsOf(test, manual) });
      continue;
    }
    const current = foldPicks(await db.picks.where('testId').equals(test.id).sortBy('seq'));
    const picksChanged = picksKeyOf(current) !== picksKeyOf(manual);
    const limitsChanged = canonicalJson(row.limits ?? {}) !== canonicalJson(testLimits ?? {});
    let next: StoredTest = { ...row, ...review };
    if (!review.openConflicts) delete next.openConflicts;
    if (testLimits) next.limits = testLimits; else delete next.limits;
    if (picksChanged || limitsChanged) {
      const samples = await db.samples.get(test.id);
      if (samples) {
        try {
          const analysis = await context.engine.analyse(recordOf(next, samples), analysisOptions(next, limits, manual));
          next = { ...next, ...summaryFromAnalysis(analysis) };
          plan.grades.push(gradeRow(test.id, analysis, limits, nowIso(context)));
        } catch (error) {
          plan.issues.push({ kind: 'analysis-failed', message: `test ${test.id} could not be re-analysed with the merged picks: ${(error as Error).message}` });
        }
      }
      if (picksChanged) plan.picks.push({ testId: test.id, rows: pickRowsOf(test, manual) });
    }
    if (canonicalJson(summaryKey(next)) !== canonicalJson(summaryKey(row))) plan.tests.push(next);
  }
  return plan;
}

/** A test known from the log, parsed from its raw file and analysed; an unreadable file comes back as an issue. */
async function buildTestFromRaw(
  context: ArchiveContext, test: DerivedTest, bytes: Uint8Array, parseOptions: Record<string, unknown> | undefined, limits: Record<string, number>, manual: ManualPick[],
): Promise<{ parsed: TestRecord; analysis: AnalysisResult } | { issue: TeamIssue }> {
  try {
    const parsed = await context.engine.parse(bytes, test.fileName, parseOptions);
    const record: TestRecord = { ...parsed, metadata: test.metadata };
    const analysis = await context.engine.analyse(record, {
      type: test.typeInferred ? undefined : test.type, limits,
      manualPicks: manual.map(({ cycle, kind, pick, reason }) => ({ cycle, kind, pick, reason })),
    });
    return { parsed: record, analysis };
  } catch (error) {
    const failure = describeImportFailure(error, test.fileName);
    return { issue: { kind: 'raw-unreadable', message: `test ${test.id}: ${failure.message}`, file: test.fileName, line: failure.line, column: failure.column } };
  }
}

/** Write a plan; call inside the rebuild's read-write transaction. */
async function writePlan(db: StressLedgerDb, plan: RebuildPlan): Promise<void> {
  if (plan.fields.length) await db.fields.bulkPut(plan.fields);
  if (plan.wells.length) await db.wells.bulkPut(plan.wells);
  for (const id of plan.deleted) {
    await db.tests.delete(id);
    await db.samples.delete(id);
    await db.grades.delete(id);
    await db.picks.where('testId').equals(id).delete();
  }
  if (plan.tests.length) await db.tests.bulkPut(plan.tests);
  for (const samples of plan.samples) await db.samples.put(samples);
  if (plan.grades.length) await db.grades.bulkPut(plan.grades);
  for (const { testId, rows } of plan.picks) {
    await db.picks.where('testId').equals(testId).delete();
    if (rows.length) await db.picks.bulkAdd(rows);
  }
  if (plan.projectLimits) await db.settings.put({ key: 'limits', value: plan.projectLimits });
}

/** The parts of a test row the rebuild may change (compared to skip writes that change nothing). */
function summaryKey(row: StoredTest): unknown {
  return {
    state: row.state, reviewer: row.reviewer, lastPickAuthor: row.lastPickAuthor, openConflicts: row.openConflicts ?? [],
    limits: row.limits ?? {}, grade: row.grade, shmin: row.shmin, shminKind: row.shminKind, type: row.type, depthTvd: row.depthTvd,
  };
}

/** Picks table rows for the manual picks in force of a derived test. */
function pickRowsOf(test: DerivedTest, manual: ManualPick[]): StoredPick[] {
  return manual.map((p) => ({
    testId: test.id, cycle: p.cycle, kind: p.kind, pick: p.pick, reason: p.reason, author: p.author, time: p.time,
    eventId: test.picks[`${p.cycle}:${p.kind}`]?.eventId ?? '',
  }));
}
