import { mkdtemp, readdir, readFile, rm, writeFile, appendFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { TeamFolder, type TeamFolderChange } from '../../src-main/team-folder';
import { JournalWriter } from '../../src-renderer/archive/journal/writer';
import { readJournal, serializeEvent } from '../../src-renderer/archive/journal/journal-file';
import type { ArchiveEvent } from '../../src-renderer/archive/events';

// Real temporary directories (os.tmpdir()); synthetic events of the invented Harrow Flats field.

let root: string;
beforeEach(async () => { root = await mkdtemp(join(tmpdir(), 'stress-ledger-team-')); });
afterEach(async () => { await rm(root, { recursive: true, force: true }); });

function comments(writer: JournalWriter, n: number): ArchiveEvent[] {
  return Array.from({ length: n }, (_, i) => writer.append({ kind: 'comment', testId: 'hf3-lot-1', text: `note ${i}: Cobalt Ridge report checked` }).event);
}

function waitFor(check: () => boolean, timeoutMs = 5000): Promise<void> {
  const start = Date.now();
  return new Promise((resolve, reject) => {
    const tick = () => {
      if (check()) return resolve();
      if (Date.now() - start > timeoutMs) return reject(new Error('timed out waiting'));
      setTimeout(tick, 20);
    };
    tick();
  });
}

describe('TeamFolder', () => {
  it('should append own events and let another device read them, then only what is new', async () => {
    const annaWriter = new JournalWriter('Anna', 'laptop-7');
    const anna = new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' });
    const ben = new TeamFolder({ folder: root, author: 'Ben', device: 'desk-2' });
    const first = comments(annaWriter, 3);
    expect(await anna.pushOwnEvents(first)).toMatchObject({ written: 3, waiting: 0, writtenSeq: 3, reachable: true });
    const d1 = await ben.readChanges();
    expect(d1).toHaveLength(1);
    expect(d1[0]).toMatchObject({ file: 'Anna@laptop-7.jsonl', issues: [], fromStart: false, unterminatedBytes: 0 });
    expect(d1[0].events).toEqual(first);
    const more = comments(annaWriter, 2);
    await anna.pushOwnEvents([...first, ...more]); // the whole history again: only the new ones are written
    const d2 = await ben.readChanges();
    expect(d2[0].events).toEqual(more);
    expect(await ben.readChanges()).toEqual([]);
    const text = await readFile(join(root, 'journals', 'Anna@laptop-7.jsonl'), 'utf8');
    expect(text).toBe([...first, ...more].map((e) => serializeEvent(e) + '\n').join(''));
  });

  it('should not read a line still being written, and read it once complete', async () => {
    const annaWriter = new JournalWriter('Anna', 'laptop-7');
    const events = comments(annaWriter, 2);
    await mkdir(join(root, 'journals'), { recursive: true });
    const path = join(root, 'journals', 'Anna@laptop-7.jsonl');
    const line2 = serializeEvent(events[1]);
    await writeFile(path, serializeEvent(events[0]) + '\n' + line2.slice(0, 20));
    const ben = new TeamFolder({ folder: root, author: 'Ben', device: 'desk-2' });
    const d1 = await ben.readChanges();
    expect(d1[0].events).toEqual([events[0]]);
    expect(d1[0].unterminatedBytes).toBe(20);
    await appendFile(path, line2.slice(20) + '\n');
    const d2 = await ben.readChanges();
    expect(d2[0].events).toEqual([events[1]]);
    expect(d2[0].issues).toEqual([]);
  });

  it('should cut off a torn last line before appending, keep the torn bytes aside, and lose no event', async () => {
    const annaWriter = new JournalWriter('Anna', 'laptop-7');
    const before = comments(annaWriter, 3);
    await new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' }).pushOwnEvents(before);
    const path = join(root, 'journals', 'Anna@laptop-7.jsonl');
    // A crash in the middle of writing event 4: only part of its line reached the disk.
    const fourth = comments(annaWriter, 1);
    await appendFile(path, serializeEvent(fourth[0]).slice(0, 55));
    expect(readJournal('Anna@laptop-7.jsonl', await readFile(path, 'utf8')).issues.map((i) => i.kind)).toEqual(['torn-tail']);
    // After restart: the archive offers its whole history again.
    const restarted = new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' });
    const outcome = await restarted.pushOwnEvents([...before, ...fourth]);
    expect(outcome.repaired?.bytes).toBe(55);
    expect(outcome).toMatchObject({ written: 1, writtenSeq: 4 });
    const read = readJournal('Anna@laptop-7.jsonl', await readFile(path, 'utf8'));
    expect(read.issues).toEqual([]);
    expect(read.events).toEqual([...before, ...fourth]);
    const side = (await readdir(join(root, 'journals'))).filter((f) => f.includes('.torn-'));
    expect(side).toHaveLength(1);
    expect(await readFile(join(root, 'journals', side[0]), 'utf8')).toBe(serializeEvent(fourth[0]).slice(0, 55));
  });

  it('should queue events while the folder is missing and write them when it appears', async () => {
    const folder = join(root, 'not-yet-mounted');
    const annaWriter = new JournalWriter('Anna', 'laptop-7');
    const anna = new TeamFolder({ folder, author: 'Anna', device: 'laptop-7' });
    const events = comments(annaWriter, 4);
    expect(await anna.pushOwnEvents(events)).toMatchObject({ written: 0, waiting: 4, reachable: false });
    expect(anna.waiting()).toHaveLength(4);
    await mkdir(folder);
    expect(await anna.flush()).toMatchObject({ written: 4, waiting: 0, writtenSeq: 4, reachable: true });
    const read = readJournal('Anna@laptop-7.jsonl', await readFile(join(folder, 'journals', 'Anna@laptop-7.jsonl'), 'utf8'));
    expect(read.events).toEqual(events);
  });

  it('should refuse to append when the folder holds a different history under the same user and device', async () => {
    const one = new JournalWriter('Anna', 'laptop-7');
    const other = new JournalWriter('Anna', 'laptop-7');
    await new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' }).pushOwnEvents(comments(one, 2));
    const mine = [other.append({ kind: 'comment', testId: 'hf3-lot-1', text: 'a different first note' }).event, other.append({ kind: 'comment', testId: 'hf3-lot-1', text: 'and a second' }).event];
    const outcome = await new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' }).pushOwnEvents(mine);
    expect(outcome.written).toBe(0);
    expect(outcome.problem).toContain('different event 2');
  });

  it('should store raw files once by hash and detect a damaged copy', async () => {
    const folder = new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' });
    const bytes = new TextEncoder().encode('time_s,pressure_kPa,rate_m3min\n0,101.3,0\n1,850.0,0.25\n');
    const hash = await folder.writeRaw(bytes);
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    expect(await folder.writeRaw(bytes)).toBe(hash);
    expect(await folder.rawHashes()).toEqual([hash]);
    const read = await folder.readRaw(hash);
    expect(read.status).toBe('ok');
    if (read.status === 'ok') expect(Array.from(read.bytes)).toEqual(Array.from(bytes));
    expect(await folder.readRaw('0'.repeat(64))).toEqual({ status: 'missing' });
    await writeFile(join(root, 'raw', hash), 'tampered');
    expect((await folder.readRaw(hash)).status).toBe('damaged');
    await expect(folder.writeRaw(bytes, 'f'.repeat(64))).rejects.toThrow('does not match');
  });

  for (const useFsWatch of [true, false]) {
    it(`should notify when another device's journal grows (${useFsWatch ? 'fs.watch' : 'polling only'})`, async () => {
      const changes: TeamFolderChange[] = [];
      const ben = new TeamFolder({ folder: root, author: 'Ben', device: 'desk-2', pollIntervalMs: 100, useFsWatch });
      await ben.isReachable();
      const stop = ben.watch((c) => changes.push(c));
      try {
        await new Promise((r) => setTimeout(r, 150));
        changes.length = 0;
        const anna = new TeamFolder({ folder: root, author: 'Anna', device: 'laptop-7' });
        await anna.pushOwnEvents(comments(new JournalWriter('Anna', 'laptop-7'), 2));
        await waitFor(() => changes.some((c) => c.kind === 'journals-changed' && c.files.includes('Anna@laptop-7.jsonl')));
        const delta = await ben.readChanges();
        expect(delta.find((d) => d.file === 'Anna@laptop-7.jsonl')?.events).toHaveLength(2);
      } finally {
        stop();
      }
    });
  }

  it('should report the folder coming back and write what waited, while watching', async () => {
    const folder = join(root, 'share');
    const changes: TeamFolderChange[] = [];
    const anna = new TeamFolder({ folder, author: 'Anna', device: 'laptop-7', pollIntervalMs: 100 });
    await anna.pushOwnEvents(comments(new JournalWriter('Anna', 'laptop-7'), 3));
    const stop = anna.watch((c) => changes.push(c));
    try {
      await mkdir(folder);
      await waitFor(() => changes.some((c) => c.kind === 'written' && c.writtenSeq === 3));
      expect(changes.some((c) => c.kind === 'reachability' && c.reachable)).toBe(true);
      expect(anna.waiting()).toHaveLength(0);
    } finally {
      stop();
    }
  });
});
