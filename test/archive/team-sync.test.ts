import { afterEach, describe, expect, it, vi } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';
import { FakeSharedFolder, fakeTeamFolderBridge } from './support/fake-team-folder';
import { TeamSync } from '../../src-renderer/archive/team-sync';
import { journalFileName } from '../../src-renderer/archive/journal/journal-file';

// Team folder sync against an in-memory folder that keeps the real folder's rules (each
// device appends only its own journal, in order; src-main/team-folder.ts). Offline-first
// behaviour (changes wait and are written when the folder is back) is the product's
// documented design (archive/journal/README-section.md). Records are synthetic.

const ANA = 'Ana Petrov';
const BEN = 'Ben Osei';
const running: TeamSync[] = [];

afterEach(() => { for (const sync of running.splice(0)) sync.stop(); });

async function machine(shared: FakeSharedFolder, author: string) {
  const opened = await openTestArchive();
  const bridge = fakeTeamFolderBridge(shared);
  const sync = new TeamSync(opened.archive, bridge, { folder: '/team/harrow-flats', author, intervalMs: 3_600_000, pushDelayMs: 5 });
  running.push(sync);
  return { ...opened, bridge, sync };
}

describe('team sync', () => {
  it('should write own events and raw files, and bring another machine the same tests', async () => {
    const shared = new FakeSharedFolder();
    const a = await machine(shared, ANA);
    const [outcome] = await a.archive.importFiles([simpleFile('hf-1-fit.csv', 'HF-1', { peak: 30e6 })], ANA);
    const started = await a.sync.start();
    expect(started).toMatchObject({ running: true, reachable: true, waiting: 0, lastError: null });
    expect(started.lastSync).not.toBeNull();
    const file = journalFileName(ANA, a.archive.deviceId());
    expect(shared.journals.get(file)!.length).toBe((await a.archive.listEvents()).length);
    const [summary] = await a.archive.listTests();
    expect(shared.raw.has(summary.fileHash)).toBe(true);
    expect((await a.archive.syncStatus(ANA)).waiting).toEqual([]);

    const b = await machine(shared, BEN);
    const atB = await b.sync.start();
    expect(atB.lastApply).toMatchObject({ conflicts: [], missingRawFiles: [] });
    expect(atB.lastApply!.added).toBe((await a.archive.listEvents()).length);
    expect((await b.archive.listTests()).map((t) => t.id)).toEqual([outcome.testId]);
  });

  it('should keep changes waiting while the folder is unreachable and write them when it is back', async () => {
    const shared = new FakeSharedFolder();
    const a = await machine(shared, ANA);
    await a.archive.importFiles([simpleFile('hf-1-fit.csv', 'HF-1')], ANA);
    await a.sync.start();
    const b = await machine(shared, BEN);
    await b.sync.start();
    shared.setReachable(false);
    const [test] = await a.archive.listTests();
    await a.archive.requestReview(test.id, ANA);
    const offline = await a.sync.syncNow();
    expect(offline).toMatchObject({ reachable: false, waiting: 1 });
    expect((await a.archive.syncStatus(ANA, { folderReachable: false })).waiting.map((w) => w.kind)).toEqual(['review-requested']);
    // Back online: the watcher's notice starts a sync on both machines.
    shared.setReachable(true);
    await vi.waitFor(async () => {
      expect(a.sync.state()).toMatchObject({ reachable: true, waiting: 0 });
      expect((await b.archive.listTests())[0].state).toBe('in-review');
    });
    expect((await a.archive.syncStatus(ANA)).waiting).toEqual([]);
  });

  it('should write a local change shortly after it is made and let the other machine apply it on notice', async () => {
    const shared = new FakeSharedFolder();
    const a = await machine(shared, ANA);
    await a.archive.importFiles([simpleFile('hf-2-lot.csv', 'HF-2', { type: 'lot' })], ANA);
    await a.sync.start();
    const b = await machine(shared, BEN);
    await b.sync.start();
    const [test] = await b.archive.listTests();
    await b.archive.requestReview(test.id, BEN);
    await b.archive.signOff(test.id, BEN, 'closure agreed');
    // No explicit sync: B's change is pushed after the short delay, A hears of it from the watcher.
    await vi.waitFor(async () => {
      expect((await a.archive.listTests())[0]).toMatchObject({ state: 'accepted', reviewer: BEN });
    });
  });

  it('should fetch a raw file that arrives after its import event', async () => {
    const shared = new FakeSharedFolder();
    const a = await machine(shared, ANA);
    await a.archive.importFiles([simpleFile('hf-3-fit.csv', 'HF-3')], ANA);
    await a.sync.start();
    const [summary] = await a.archive.listTests();
    const bytes = shared.raw.get(summary.fileHash)!;
    shared.raw.delete(summary.fileHash);
    const b = await machine(shared, BEN);
    const first = await b.sync.start();
    expect(first.missingRawFiles).toBe(1);
    expect(await b.archive.listTests()).toEqual([]);
    shared.raw.set(summary.fileHash, bytes);
    const second = await b.sync.syncNow();
    expect(second.missingRawFiles).toBe(0);
    expect((await b.archive.listTests()).map((t) => t.id)).toEqual([summary.id]);
  });

  it('should share one sync among calls made while it is queued, and stop cleanly', async () => {
    const shared = new FakeSharedFolder();
    const a = await machine(shared, ANA);
    await a.sync.start();
    const pushesBefore = a.bridge.calls.push;
    const first = a.sync.syncNow();
    const second = a.sync.syncNow();
    expect(second).toBe(first);
    await Promise.all([first, second]);
    expect(a.bridge.calls.push - pushesBefore).toBe(1);
    a.sync.stop();
    expect(a.sync.state().running).toBe(false);
    expect(shared.watchers.size).toBe(0);
  });
});
