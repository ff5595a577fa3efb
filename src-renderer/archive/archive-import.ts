import type { ImportFileInput, ImportOptions, ImportOutcome } from './api';
import { writeTransaction, type ArchiveContext } from './archive-context';
import { gradeRow, summaryFromAnalysis } from './archive-analysis';
import { appendEvent } from './archive-events';
import { getSettings } from './archive-settings';
import { findOrCreateField, findOrCreateWell } from './archive-wells';
import { nameKey, type StoredTest } from './db';
import { describeImportFailure } from './import-failure';
import { sha256HexAsync } from './journal/sha256';
import { normaliseUserName } from './review-rules';
import type { TestMetadata, TestRecord } from '../engine/record';

/**
 * Importing contractor files: each file is hashed (a file already held is reported as a
 * duplicate), parsed and analysed by the engine, then written whole in one transaction
 * (field, well, test, samples, raw file, grade and their events) or not at all.
 */

const DEFAULT_FIELD_NAME = 'Unassigned field';

/** Import files one after another; one outcome per file, in order. */
export async function importFiles(context: ArchiveContext, files: ImportFileInput[], user: string, options: ImportOptions = {}): Promise<ImportOutcome[]> {
  const importer = normaliseUserName(user);
  const outcomes: ImportOutcome[] = [];
  const limits = (await getSettings(context)).limits;
  for (let i = 0; i < files.length; i++) {
    outcomes.push(await importOne(context, files[i], importer, options, limits));
    options.onProgress?.(i + 1, files.length, files[i].name);
  }
  return outcomes;
}

async function importOne(
  context: ArchiveContext, file: ImportFileInput, user: string, options: ImportOptions, limits: Record<string, number>,
): Promise<ImportOutcome> {
  const { db, engine } = context;
  const fileName = file.name;
  try {
    const hash = await sha256HexAsync(file.bytes);
    const existing = await db.tests.where('fileHash').equals(hash).first();
    if (existing) return { fileName, status: 'duplicate', existingTestId: existing.id };
    const parsed = await engine.parse(file.bytes, fileName, options.parseOptions);
    const metadata: TestMetadata = { ...parsed.metadata, ...(options.overrides ?? {}) };
    const record: TestRecord = { ...parsed, metadata };
    const analysis = await engine.analyse(record, { type: options.type, overrides: options.overrides, limits });
    const testId = context.fixed ? `test-${hash.slice(0, 24)}` : crypto.randomUUID();
    const fieldName = cleanName(analysis.metadata.field ?? metadata.field) ?? options.defaultFieldName ?? DEFAULT_FIELD_NAME;
    const wellName = cleanName(analysis.metadata.well ?? metadata.well) ?? options.defaultWellName ?? fileName.replace(/\.[^.]+$/, '');
    const outcome = await writeTransaction(context, async (touch): Promise<ImportOutcome> => {
      const again = await db.tests.where('fileHash').equals(hash).first();
      if (again) return { fileName, status: 'duplicate', existingTestId: again.id };
      const fieldId = await findOrCreateField(context, fieldName, user);
      const well = await findOrCreateWell(context, fieldId, wellName, user);
      const { time } = await appendEvent(context, user, {
        kind: 'test-imported', testId, wellId: well.id, type: analysis.type, typeInferred: analysis.typeInferred,
        metadata: analysis.metadata, fileHash: hash, fileName, layout: parsed.source.layout,
        ...(options.parseOptions ? { parseOptions: options.parseOptions } : {}),
      });
      const row: StoredTest = {
        id: testId, fieldId, fieldName: (await db.fields.get(fieldId))!.name, wellId: well.id, wellName: well.name,
        wellNameKey: nameKey(well.name), ...summaryFromAnalysis(analysis), state: 'imported', reviewer: null,
        lastPickAuthor: null, fileName, fileHash: hash, importedAt: time, importedBy: user,
        contractor: analysis.metadata.contractor, metadata: analysis.metadata, source: parsed.source,
      };
      await db.tests.add(row);
      touch(row);
      await db.samples.add({ testId, time: parsed.time, pressure: parsed.pressure, rate: parsed.rate, volume: parsed.volume });
      if (!(await db.rawFiles.get(hash))) {
        await db.rawFiles.add({ hash, bytes: file.bytes, size: file.bytes.length, fileName, storedAt: time });
      }
      await db.grades.put(gradeRow(testId, analysis, limits, time));
      return { fileName, status: 'imported', testId };
    });
    return outcome;
  } catch (error) {
    return { fileName, status: 'failed', error: describeImportFailure(error, fileName) };
  }
}

/** A name from a file, trimmed with inner spaces collapsed; undefined when empty. */
function cleanName(name: string | undefined): string | undefined {
  const trimmed = name?.trim().replace(/\s+/g, ' ');
  return trimmed ? trimmed : undefined;
}
