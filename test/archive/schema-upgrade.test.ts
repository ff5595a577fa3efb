import 'fake-indexeddb/auto';
import Dexie from 'dexie';
import { describe, expect, it } from 'vitest';
import { SCHEMA_V1, SCHEMA_V2, SCHEMA_V3, StressLedgerDb, CURRENT_SCHEMA_VERSION } from '../../src-renderer/archive/db';
import { eventHash } from '../../src-renderer/archive/journal/journal-file';
import { Archive } from '../../src-renderer/archive/archive';
import { createTestEngine, uniqueDatabaseName } from './support/engine';

// Dexie's documented upgrade model (dexie.org "Database Versioning"): old version blocks
// stay, a new version block carries the data change in upgrade(). Here version 1 is seeded
// by a Dexie that knows only version 1, then the current database opens it.

describe('archive schema upgrade', () => {
  it('should keep the published version blocks unchanged', () => {
    // Published schemas: editing them would corrupt archives already on disk.
    expect(SCHEMA_V1).toEqual({
      fields: 'id, &nameKey',
      wells: 'id, fieldId, [fieldId+nameKey]',
      tests: 'id, fieldId, wellId, type, grade, state, depthTvd, wellName, fileHash, importedAt',
      samples: 'testId',
      rawFiles: 'hash',
      picks: '++seq, testId',
      grades: 'testId, grade',
      events: 'id, clock, testId, [testId+clock], [journal+clock]',
      users: 'name',
      mappings: 'layout',
    });
    expect(SCHEMA_V2.settings).toBe('key');
    expect(SCHEMA_V3).toEqual({ ...SCHEMA_V2, journals: 'key' });
    expect(CURRENT_SCHEMA_VERSION).toBe(3);
  });

  it('should open a version 1 archive with its data intact and upgraded', async () => {
    const name = uniqueDatabaseName();
    const old = new Dexie(name);
    old.version(1).stores(SCHEMA_V1);
    await old.open();
    await old.table('fields').add({ id: 'f1', name: 'Harrow Flats', nameKey: 'harrow flats' });
    await old.table('wells').add({ id: 'w1', fieldId: 'f1', name: 'HF-12', nameKey: 'hf-12' });
    await old.table('users').bulkAdd([
      { name: 'Ana Petrov', createdAt: '2026-01-01T00:00:00.000Z', unitSystem: 'oilfield' },
      { name: 'Ben Osei', createdAt: '2026-01-02T00:00:00.000Z', unitSystem: 'si' },
      { name: 'Cleo Varga', createdAt: '2026-01-03T00:00:00.000Z', unitSystem: 'oilfield' },
    ]);
    const time = new Float64Array([0, 10, 20]);
    await old.table('samples').add({ testId: 't1', time, pressure: new Float64Array([1e5, 2e6, 3e6]), rate: new Float64Array(3), volume: new Float64Array(3) });
    await old.table('tests').add({
      id: 't1', fieldId: 'f1', fieldName: 'Harrow Flats', wellId: 'w1', wellName: 'HF-12', type: 'lot', typeInferred: false,
      depthTvd: 2100, depthMd: 2300, shmin: 3e6, shminKind: 'estimate', grade: 'B', state: 'accepted', reviewer: 'Ben Osei',
      lastPickAuthor: 'Ana Petrov', fileName: 'hf12.csv', fileHash: 'ab'.repeat(32), importedAt: '2026-01-05T00:00:00.000Z',
      importedBy: 'Ana Petrov', metadata: { well: 'HF-12' },
      source: { fileName: 'hf12.csv', format: 'delimited', layout: 'x', columns: [], derived: { rate: false, volume: false }, warnings: [] },
    });
    await old.table('events').add({
      id: 'e1', author: 'Ana Petrov', device: 'device-from-v1', time: '2026-01-05T00:00:00.000Z', clock: 7, prev: '',
      body: { kind: 'comment', testId: 't1', text: 'from version 1' }, testId: 't1', journal: 'Ana Petrov@device-from-v1', hash: 'cd'.repeat(32),
    });
    old.close();

    const archive = await Archive.open({ engine: createTestEngine(), db: new StressLedgerDb(name) });
    expect(archive.db.verno).toBe(3);
    // Two of three users chose oilfield units in version 1.
    expect(await archive.getSettings()).toEqual({ limits: {}, unitSystem: 'oilfield' });
    const users = await archive.db.users.toArray();
    expect(users.map((u) => u.name)).toEqual(['Ana Petrov', 'Ben Osei', 'Cleo Varga']);
    expect(users.every((u) => !('unitSystem' in u))).toBe(true);
    // The journal continues on the same device with the next Lamport clock and the chain.
    expect(archive.deviceId()).toBe('device-from-v1');
    await archive.comment('t1', 'Ana Petrov', 'after the upgrade');
    const events = await archive.eventsForTest('t1');
    expect(events.map((e) => [e.clock, e.prev])).toEqual([[7, ''], [8, 'cd'.repeat(32)]]);
    // The version 1 event counts as the journal's first (no number yet); the next one is 2.
    expect(events[1].seq).toBe(2);
    // Rows intact, the new index filled.
    const [summary] = await archive.listTests({ wellSearch: 'hf-1' });
    expect(summary).toMatchObject({ id: 't1', state: 'accepted', grade: 'B', depthTvd: 2100, reviewer: 'Ben Osei' });
    expect(await archive.db.tests.where('wellNameKey').equals('hf-12').count()).toBe(1);
    const samples = await archive.db.samples.get('t1');
    expect(Array.from(samples!.time)).toEqual([0, 10, 20]);
    archive.close();
  });

  it('should start a new archive at the current version with default settings', async () => {
    const archive = await Archive.open({ engine: createTestEngine(), db: new StressLedgerDb(uniqueDatabaseName()) });
    expect(archive.db.verno).toBe(CURRENT_SCHEMA_VERSION);
    expect(await archive.getSettings()).toEqual({ limits: {}, unitSystem: 'si' });
    expect(archive.deviceId()).toMatch(/^[0-9a-f-]{36}$/);
    expect(await archive.isEmpty()).toBe(true);
  });

  it('should open a version 2 archive and count its journals, so new events continue each chain', async () => {
    const name = uniqueDatabaseName();
    const old = new Dexie(name);
    old.version(1).stores(SCHEMA_V1);
    old.version(2).stores(SCHEMA_V2);
    await old.open();
    await old.table('settings').bulkPut([{ key: 'device', value: 'dev-a' }, { key: 'limits', value: {} }, { key: 'unitSystem', value: 'si' }]);
    // Synthetic log: Ana on this device (one event before numbering, two numbered), Ben on another device (numbered 1 and 3: 2 missing).
    const ana1 = { id: 'a1', author: 'Ana Petrov', device: 'dev-a', time: '2026-02-01T08:00:00.000Z', clock: 1, prev: '', body: { kind: 'comment', testId: 't1', text: 'first' } };
    const ana2 = { id: 'a2', author: 'Ana Petrov', device: 'dev-a', time: '2026-02-01T08:01:00.000Z', clock: 2, prev: eventHash(ana1 as never), seq: 2, seen: {}, body: { kind: 'comment', testId: 't1', text: 'second' } };
    const ben1 = { id: 'b1', author: 'Ben Osei', device: 'dev-b', time: '2026-02-01T08:02:00.000Z', clock: 3, prev: '', seq: 1, seen: {}, body: { kind: 'comment', testId: 't1', text: 'ben one' } };
    const ben3 = { id: 'b3', author: 'Ben Osei', device: 'dev-b', time: '2026-02-01T08:04:00.000Z', clock: 9, prev: 'ef'.repeat(32), seq: 3, seen: {}, body: { kind: 'comment', testId: 't1', text: 'ben three' } };
    for (const e of [ana1, ana2, ben1, ben3]) {
      await old.table('events').add({ ...e, testId: 't1', journal: `${e.author}@${e.device}`, hash: eventHash(e as never) });
    }
    old.close();

    const archive = await Archive.open({ engine: createTestEngine(), db: new StressLedgerDb(name) });
    expect(archive.db.verno).toBe(3);
    const journals = await archive.db.journals.orderBy('key').toArray();
    expect(journals.map((j) => [j.key, j.seq, j.lastSeq, j.clock, j.events])).toEqual([
      ['Ana Petrov@dev-a', 2, 2, 2, 2],
      ['Ben Osei@dev-b', 1, 3, 9, 2],
    ]);
    await archive.setLimits({ minimumSamples: 3 }, 'Ana Petrov', 'field standard after the upgrade');
    const last = (await archive.listEvents()).at(-1)!;
    // Lamport clock: highest held + 1; seen holds Ben's journal only as far as it has no gap.
    expect(last).toMatchObject({ seq: 3, clock: 10, prev: eventHash(ana2 as never), seen: { 'Ben Osei@dev-b': 1 } });
    archive.close();
  });
});
