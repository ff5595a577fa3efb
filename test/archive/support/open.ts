import 'fake-indexeddb/auto';
import { Archive } from '../../../src-renderer/archive/archive';
import { StressLedgerDb } from '../../../src-renderer/archive/db';
import { createTestEngine, uniqueDatabaseName, type TestEngine } from './engine';

/** A fresh archive on fake-indexeddb with the test engine. */
export async function openTestArchive(name = uniqueDatabaseName()): Promise<{ archive: Archive; engine: TestEngine; name: string }> {
  const engine = createTestEngine();
  const archive = await Archive.open({ engine, db: new StressLedgerDb(name) });
  return { archive, engine, name };
}

/** Row counts of every table. */
export async function tableCounts(archive: Archive): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const table of archive.db.tables) out[table.name] = await table.count();
  return out;
}
