import { describe, expect, it } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';
import { decodeBackup, encodeBackup } from '../../src-renderer/archive/backup';
import { ArchiveError } from '../../src-renderer/archive/errors';
import type { Archive } from '../../src-renderer/archive/archive';

// A backup restores exactly when every table of the restored archive equals the original,
// row for row, typed arrays included (round-trip check; data set by this test).

async function dumpAll(archive: Archive): Promise<Record<string, unknown[]>> {
  const out: Record<string, unknown[]> = {};
  for (const table of archive.db.tables) out[table.name] = await table.toArray();
  return out;
}

describe('archive backup', () => {
  it('should restore every table exactly into another archive', async () => {
    const { archive } = await openTestArchive();
    const outcomes = await archive.importFiles([
      simpleFile('a.csv', 'HF-1', { tvd: 1000 }), simpleFile('b.csv', 'HF-2', { tvd: 2000, peak: 41e6 }),
    ], 'Ana Petrov');
    const id = outcomes[0].testId!;
    await archive.movePick(id, 1, 'isip', { kind: 'isip', pressure: 27.5e6, time: 30, method: 'manual', sampleIndex: 3 }, 'clear break', 'Ana Petrov');
    await archive.requestReview(id, 'Ana Petrov');
    await archive.signOff(id, 'Ben Osei', 'agree');
    await archive.setLimits({ minimumSamples: 4 }, 'Lead', 'project rule');
    await archive.saveMapping({ layout: 'l1', columns: [], savedBy: 'Ana Petrov' });
    const original = await dumpAll(archive);
    const bytes = await archive.exportBackup();

    const { archive: other } = await openTestArchive();
    await other.importFiles([simpleFile('unrelated.csv', 'X-1')], 'Someone Else');
    await other.restoreBackup(bytes);
    expect(await dumpAll(other)).toEqual(original);
    const restoredSamples = await other.db.samples.get(id);
    expect(restoredSamples!.pressure).toBeInstanceOf(Float64Array);
    expect(other.deviceId()).toBe(archive.deviceId());
    expect((await other.listTests({ state: 'accepted' })).map((t) => t.id)).toEqual([id]);
  });

  it('should carry numbers JSON cannot hold and typed arrays of every kind', () => {
    const tables = { t: [{ a: Number.NaN, b: Number.POSITIVE_INFINITY, c: -0, d: new Float64Array([1.5, Number.NaN]), e: new Uint8Array([1, 2, 3]), f: [new Int32Array([-7])] }] };
    const back = decodeBackup(encodeBackup(tables, 2, '2026-01-01T00:00:00.000Z'), 2).tables.t[0] as Record<string, unknown>;
    expect(back.a).toBeNaN();
    expect(back.b).toBe(Number.POSITIVE_INFINITY);
    expect(Object.is(back.c, -0)).toBe(true);
    expect(back.d).toEqual(new Float64Array([1.5, Number.NaN]));
    expect(back.e).toEqual(new Uint8Array([1, 2, 3]));
    expect(back.f).toEqual([new Int32Array([-7])]);
  });

  it('should refuse a file that is not a backup, a truncated one and another schema version', () => {
    const good = encodeBackup({ t: [{ x: new Float64Array([1, 2]) }] }, 2, '2026-01-01T00:00:00.000Z');
    const code = (fn: () => unknown) => { try { fn(); return 'none'; } catch (e) { return e instanceof ArchiveError ? e.code : 'other'; } };
    expect(code(() => decodeBackup(new TextEncoder().encode('time,pressure\n'), 2))).toBe('bad-backup');
    expect(code(() => decodeBackup(good.subarray(0, 20), 2))).toBe('bad-backup');
    expect(code(() => decodeBackup(good.subarray(0, good.length - 8), 2))).toBe('bad-backup');
    expect(code(() => decodeBackup(good, 3))).toBe('backup-version');
  });

  it('should leave the archive untouched when the backup is refused', async () => {
    const { archive } = await openTestArchive();
    await archive.importFiles([simpleFile('a.csv', 'HF-1')], 'Ana Petrov');
    const before = await dumpAll(archive);
    await expect(archive.restoreBackup(new Uint8Array([1, 2, 3]))).rejects.toBeInstanceOf(ArchiveError);
    expect(await dumpAll(archive)).toEqual(before);
  });
});
