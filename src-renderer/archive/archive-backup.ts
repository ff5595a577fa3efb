import { ensureDevice, nowIso, notifyListeners, type ArchiveContext } from './archive-context';
import { rebuildJournalRows } from './archive-events';
import { forgetList } from './archive-list';
import { decodeBackup, encodeBackup, type TableDump } from './backup';

/**
 * The whole archive as one backup file and back (the file format is backup.ts). A
 * restore replaces every table, so it is the one write the review log's append-only
 * hooks let through.
 */

/** Every table in one read transaction, encoded as a backup file. */
export async function exportBackup(context: ArchiveContext): Promise<Uint8Array> {
  const { db } = context;
  const dump: TableDump = {};
  await db.transaction('r', db.tables, async () => {
    for (const table of db.tables) dump[table.name] = await table.toArray();
  });
  return encodeBackup(dump, db.verno, nowIso(context));
}

/** Replace every table with the backup's rows (one transaction), then recount the journals. */
export async function restoreBackup(context: ArchiveContext, bytes: Uint8Array): Promise<void> {
  const { db } = context;
  const { tables } = decodeBackup(bytes, db.verno);
  context.restoring = true;
  try {
    await db.transaction('rw', db.tables, async () => {
      for (const table of db.tables) {
        await table.clear();
        const rows = tables[table.name] ?? [];
        if (rows.length) await table.bulkAdd(rows);
      }
    });
  } finally {
    context.restoring = false;
    forgetList(context);
  }
  context.channel?.postMessage('changed');
  await ensureDevice(context);
  await rebuildJournalRows(context);
  notifyListeners(context);
}
