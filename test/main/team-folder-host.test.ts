import { mkdtemp, readFile, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { openTestArchive } from '../archive/support/open';
import { simpleFile } from '../archive/support/engine';
import { TeamFolderHost } from '../../src-main/team-folder-host';
import { parsePayload } from '../../src-main/ipc-schemas';
import { CHANNELS } from '../../src-main/channels';
import { TeamSync } from '../../src-renderer/archive/team-sync';
import { journalFileName, readJournal } from '../../src-renderer/archive/journal/journal-file';
import type { TeamFolderBridge, TeamFolderNotice } from '../../src-renderer/bridge/types';

// The real team folder (src-main/team-folder.ts) on a temporary directory, driven through
// the same calls the IPC handlers make (payloads checked by ipc-schemas.ts first), with
// two archives standing for two machines. Journal format and chain: archive/journal/journal-file.ts.
// SHA-256 of raw files: FIPS 180-4, computed here by Node's crypto as the reference.

const ANA = 'Ana Petrov';
const BEN = 'Ben Osei';
const cleanups: (() => Promise<void> | void)[] = [];
afterEach(async () => { for (const c of cleanups.splice(0).reverse()) await c(); });

/** What the preload and the IPC handlers do, without Electron: validate, then call the host. */
function bridgeOver(host: TeamFolderHost, listeners: Set<(n: TeamFolderNotice) => void>): TeamFolderBridge {
  return {
    chooseTeamFolder: async () => null,
    connectTeamFolder: async (options) => host.connect(parsePayload(CHANNELS.connectTeamFolder, options)),
    pushTeamEvents: async (events) => host.push(parsePayload(CHANNELS.pushTeamEvents, { events }).events as never),
    readTeamChanges: async () => host.readChanges(),
    writeTeamRaw: async (hash, bytes) => { const p = parsePayload(CHANNELS.writeTeamRaw, { hash, bytes }); return host.writeRaw(p.hash, p.bytes); },
    readTeamRaw: async (hash) => host.readRaw(parsePayload(CHANNELS.readTeamRaw, { hash }).hash),
    teamFolderStatus: async () => host.status(),
    onTeamFolderChanged: (listener) => { listeners.add(listener); return () => { listeners.delete(listener); }; },
  };
}

async function machine(folder: string, author: string) {
  const opened = await openTestArchive();
  const listeners = new Set<(n: TeamFolderNotice) => void>();
  const host = new TeamFolderHost({ notify: (n) => { for (const l of listeners) l(n); }, pollIntervalMs: 3_600_000, useFsWatch: false });
  const sync = new TeamSync(opened.archive, bridgeOver(host, listeners), { folder, author, intervalMs: 3_600_000, pushDelayMs: 3_600_000 });
  cleanups.push(() => { sync.stop(); host.close(); opened.archive.close(); });
  return { ...opened, host, sync };
}

async function teamDirectory(): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), 'stress-ledger-team-'));
  cleanups.push(() => rm(dir, { recursive: true, force: true }));
  return dir;
}

describe('team folder host', () => {
  it('should share tests and a sign-off between two machines through a real folder', async () => {
    const folder = await teamDirectory();
    const a = await machine(folder, ANA);
    await a.archive.importFiles([simpleFile('hf-1-fit.csv', 'HF-1', { peak: 30e6 }), simpleFile('hf-2-lot.csv', 'HF-2', { peak: 33e6 })], ANA);
    // A second user on the same device writes a journal of their own.
    const [first] = await a.archive.listTests({ sortBy: 'wellName', descending: false });
    await a.archive.comment(first.id, 'Cleo Varga', 'shoe depth checked against the casing tally');
    const startA = await a.sync.start();
    expect(startA).toMatchObject({ reachable: true, waiting: 0, lastError: null });
    const files = (await readdir(path.join(folder, 'journals'))).sort();
    expect(files).toEqual([journalFileName(ANA, a.archive.deviceId()), journalFileName('Cleo Varga', a.archive.deviceId())].sort());
    for (const file of files) {
      const read = readJournal(file, await readFile(path.join(folder, 'journals', file), 'utf8'));
      expect(read.issues).toEqual([]);
    }
    expect((await readdir(path.join(folder, 'raw'))).sort()).toEqual((await a.archive.listTests()).map((t) => t.fileHash).sort());

    const b = await machine(folder, BEN);
    await b.sync.start();
    expect((await b.archive.listTests()).map((t) => t.id).sort()).toEqual((await a.archive.listTests()).map((t) => t.id).sort());
    await b.archive.requestReview(first.id, BEN);
    await b.archive.signOff(first.id, BEN, 'picks agreed');
    await b.sync.syncNow();
    const backAtA = await a.sync.syncNow();
    expect(backAtA.lastApply).toMatchObject({ conflicts: [], findings: [] });
    expect((await a.archive.listTests()).find((t) => t.id === first.id)).toMatchObject({ state: 'accepted', reviewer: BEN });
    expect(b.host.status()).toMatchObject({ folder, author: BEN, device: b.archive.deviceId(), reachable: true });
  });

  it('should report an unreachable folder and write the waiting events once it exists', async () => {
    const parent = await teamDirectory();
    const folder = path.join(parent, 'not-yet-mounted');
    const a = await machine(folder, ANA);
    await a.archive.importFiles([simpleFile('hf-3-fit.csv', 'HF-3')], ANA);
    const offline = await a.sync.start();
    expect(offline.reachable).toBe(false);
    expect(offline.waiting).toBe((await a.archive.listEvents()).length);
    await import('node:fs/promises').then((fs) => fs.mkdir(folder));
    const online = await a.sync.syncNow();
    expect(online).toMatchObject({ reachable: true, waiting: 0 });
    const text = await readFile(path.join(folder, 'journals', journalFileName(ANA, a.archive.deviceId())), 'utf8');
    expect(readJournal('x', text).events.length).toBe((await a.archive.listEvents()).length);
  });

  it('should refuse calls before a folder is connected', async () => {
    const host = new TeamFolderHost({ notify: () => undefined });
    await expect(host.readChanges()).rejects.toThrow(/No team folder is connected/);
    await expect(host.push([])).rejects.toThrow(/No team folder is connected/);
    expect(host.status()).toEqual({ folder: null, author: null, device: null, reachable: null, writtenSeq: 0, waiting: 0 });
  });
});
