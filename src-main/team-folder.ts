import { createHash, randomBytes } from 'node:crypto';
import { watch as watchFolder, type FSWatcher } from 'node:fs';
import { mkdir, open, readdir, readFile, rename, stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { ArchiveEvent } from '../src-renderer/archive/events';
import type { TeamJournalChanges, TeamRawRead } from '../src-renderer/bridge/types';
import { journalKeyOf } from '../src-renderer/archive/journal/causality';
import {
  eventHash, journalFileName, parseJournalFileName, readJournal, serializeEvent, startCursor,
  type JournalCursor,
} from '../src-renderer/archive/journal/journal-file';

/**
 * The team folder on disk (a shared or synced folder, e.g. a network drive):
 *
 *     <folder>/journals/<user>@<device>.jsonl   one per user and device, append-only
 *     <folder>/raw/<sha256>                     raw test files, stored once by content hash
 *
 * This device only ever appends to its own journal, so no two machines write the same
 * file and no locking is needed. Appends are one write of whole lines followed by
 * fsync; a crash can still leave a torn last line, which is cut off (and kept beside the
 * journal as `<journal>.torn-<time>`) before the next append. Other journals are read
 * incrementally from the byte offset reached before, a whole line at a time. When the
 * folder cannot be reached, events wait in memory and are written when it comes back
 * (the archive holds them anyway: `pushOwnEvents` is idempotent and catches up from
 * whatever the folder's journal already holds).
 */

export interface TeamFolderOptions {
  /** The chosen team folder. */
  folder: string;
  author: string;
  device: string;
  /** Polling interval for changes and for retrying an unreachable folder, ms (default 5000). */
  pollIntervalMs?: number;
  /** Also use fs.watch for prompt notifications (default true); polling always runs as the fallback. */
  useFsWatch?: boolean;
}

export type TeamFolderChange =
  | { kind: 'journals-changed'; files: string[] }
  | { kind: 'reachability'; reachable: boolean }
  | { kind: 'written'; writtenSeq: number }
  | { kind: 'error'; message: string };

export interface PushOutcome {
  /** Own events written now. */
  written: number;
  /** Own events still waiting (folder unreachable, or a gap before them). */
  waiting: number;
  writtenSeq: number;
  reachable: boolean;
  /** Set when a torn tail of the own journal was cut off before writing. */
  repaired?: { keptAs: string; bytes: number };
  /** Why waiting events could not be written, when not just unreachability. */
  problem?: string;
}

/** New events of one journal since the last read (the bridge's type, so main and renderer share one shape). */
export type JournalDelta = TeamJournalChanges;

/** Result of reading a raw file by hash. */
export type RawReadResult = TeamRawRead;

interface ReadState { offset: number; cursor: JournalCursor; size: number; mtimeMs: number; ino: number }

const HEX64 = /^[0-9a-f]{64}$/;

function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

export class TeamFolder {
  readonly folder: string;
  readonly journalsDir: string;
  readonly rawDir: string;
  readonly ownFile: string;
  private readonly journalKey: string;
  private readonly pollIntervalMs: number;
  private readonly useFsWatch: boolean;
  private queue: ArchiveEvent[] = [];
  private writtenSeqValue = 0;
  private ownChecked = false;
  private reachableValue: boolean | null = null;
  private readonly reads = new Map<string, ReadState>();
  private readonly listeners = new Set<(change: TeamFolderChange) => void>();
  private watcher: FSWatcher | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private debounce: ReturnType<typeof setTimeout> | null = null;
  private lastStats = new Map<string, string>();
  private busy: Promise<unknown> = Promise.resolve();

  constructor(options: TeamFolderOptions) {
    this.folder = options.folder;
    this.journalsDir = join(options.folder, 'journals');
    this.rawDir = join(options.folder, 'raw');
    this.ownFile = journalFileName(options.author, options.device);
    this.journalKey = `${options.author}@${options.device}`;
    this.pollIntervalMs = options.pollIntervalMs ?? 5000;
    this.useFsWatch = options.useFsWatch ?? true;
  }

  /** Highest own `seq` known to be in the folder's journal. */
  writtenSeq(): number { return this.writtenSeqValue; }

  /** Own events waiting to be written. */
  waiting(): readonly ArchiveEvent[] { return this.queue; }

  /** Whether the folder could be reached at the last attempt (null before any). */
  lastKnownReachable(): boolean | null { return this.reachableValue; }

  /** True when the folder exists and its journals and raw folders exist or could be made. */
  async isReachable(): Promise<boolean> {
    let reachable = false;
    try {
      if ((await stat(this.folder)).isDirectory()) {
        await mkdir(this.journalsDir, { recursive: true });
        await mkdir(this.rawDir, { recursive: true });
        reachable = true;
      }
    } catch {
      reachable = false;
    }
    if (reachable !== this.reachableValue) {
      const first = this.reachableValue === null;
      this.reachableValue = reachable;
      if (!first || !reachable) this.emit({ kind: 'reachability', reachable });
    }
    return reachable;
  }

  /**
   * Queue this device's events and write every one the folder's journal lacks, in
   * order. Events of other journals are ignored; events already written are skipped.
   * Safe to call with the whole local history after a restart.
   */
  pushOwnEvents(events: readonly ArchiveEvent[]): Promise<PushOutcome> {
    return this.serial(async () => {
      const known = new Set(this.queue.map((e) => e.seq));
      for (const e of events) {
        if (journalKeyOf(e) === this.journalKey && e.seq !== undefined && !known.has(e.seq)) { this.queue.push(e); known.add(e.seq); }
      }
      this.queue.sort((a, b) => a.seq! - b.seq!);
      return this.flushQueue();
    });
  }

  /** Try to write what is waiting (also done on every poll). */
  flush(): Promise<PushOutcome> {
    return this.serial(() => this.flushQueue());
  }

  private async flushQueue(): Promise<PushOutcome> {
    const outcome: PushOutcome = { written: 0, waiting: this.queue.length, writtenSeq: this.writtenSeqValue, reachable: false };
    if (!(await this.isReachable())) return outcome;
    outcome.reachable = true;
    if (!this.ownChecked) {
      const checked = await this.checkOwnJournal();
      if (checked.repaired) outcome.repaired = checked.repaired;
      if (checked.problem) { outcome.problem = checked.problem; return outcome; }
    }
    this.queue = this.queue.filter((e) => e.seq! > this.writtenSeqValue);
    const batch: ArchiveEvent[] = [];
    for (const e of this.queue) {
      if (e.seq !== this.writtenSeqValue + batch.length + 1) break;
      batch.push(e);
    }
    if (batch.length < this.queue.length && batch.length === 0) {
      outcome.problem = `own event ${this.writtenSeqValue + 1} is not in the queue; events from ${this.queue[0].seq} wait until it is given`;
    }
    if (batch.length) {
      const text = batch.map((e) => serializeEvent(e) + '\n').join('');
      try {
        await appendDurably(join(this.journalsDir, this.ownFile), Buffer.from(text, 'utf8'));
      } catch (e) {
        this.reachableValue = false;
        this.emit({ kind: 'error', message: `could not write ${this.ownFile}: ${(e as Error).message}; will retry` });
        outcome.reachable = false;
        return outcome;
      }
      this.writtenSeqValue += batch.length;
      this.queue = this.queue.slice(batch.length);
      this.emit({ kind: 'written', writtenSeq: this.writtenSeqValue });
    }
    return { ...outcome, written: batch.length, waiting: this.queue.length, writtenSeq: this.writtenSeqValue };
  }

  /**
   * Read the own journal once before appending: learn how far it goes, cut off a torn
   * tail (kept in a side file), add a missing final newline, and refuse to append when
   * the folder's journal holds a different history than this device.
   */
  private async checkOwnJournal(): Promise<{ repaired?: PushOutcome['repaired']; problem?: string }> {
    const path = join(this.journalsDir, this.ownFile);
    let bytes: Buffer;
    try {
      bytes = await readFile(path);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'ENOENT') { this.ownChecked = true; this.writtenSeqValue = 0; return {}; }
      throw e;
    }
    const text = bytes.toString('utf8');
    const read = readJournal(this.ownFile, text);
    const result: { repaired?: PushOutcome['repaired']; problem?: string } = {};
    const goodBytes = Buffer.byteLength(text.slice(0, read.goodLength), 'utf8');
    if (goodBytes < bytes.length) {
      const keptAs = `${this.ownFile}.torn-${new Date().toISOString().replace(/[:.]/g, '-')}`;
      await writeDurably(join(this.journalsDir, keptAs), bytes.subarray(goodBytes));
      const handle = await open(path, 'r+');
      try { await handle.truncate(goodBytes); await handle.sync(); } finally { await handle.close(); }
      result.repaired = { keptAs, bytes: bytes.length - goodBytes };
    } else if (read.issues.some((i) => i.kind === 'missing-newline')) {
      await appendDurably(path, Buffer.from('\n'));
    }
    const last = read.events[read.events.length - 1];
    const lastSeq = last?.seq ?? 0;
    const local = this.queue.find((e) => e.seq === lastSeq);
    if (last && local && eventHash(local) !== read.hashes[read.hashes.length - 1]) {
      result.problem = `${this.ownFile} in the team folder holds a different event ${lastSeq} than this device; not writing (another installation may use the same device id)`;
      return result;
    }
    this.writtenSeqValue = lastSeq;
    this.ownChecked = true;
    return result;
  }

  /**
   * New events of every journal in the folder since the last call (all of them on the
   * first call), a whole line at a time. A journal that shrank or was replaced is read
   * again from the start, with `fromStart` set.
   */
  readChanges(): Promise<JournalDelta[]> {
    return this.serial(async () => {
      if (!(await this.isReachable())) return [];
      const deltas: JournalDelta[] = [];
      for (const file of await this.journalFiles()) {
        const path = join(this.journalsDir, file);
        let info;
        try { info = await stat(path); } catch { continue; }
        let state = this.reads.get(file);
        let fromStart = false;
        if (!state || info.size < state.offset || info.ino !== state.ino) {
          fromStart = state !== undefined;
          state = { offset: 0, cursor: startCursor(file), size: 0, mtimeMs: 0, ino: info.ino };
        }
        if (info.size === state.offset && !fromStart && this.reads.has(file)) continue;
        const bytes = await readRange(path, state.offset, info.size);
        const lastNewline = bytes.lastIndexOf(10);
        const complete = lastNewline >= 0 ? bytes.subarray(0, lastNewline + 1) : bytes.subarray(0, 0);
        const read = readJournal(file, complete.toString('utf8'), state.cursor);
        const next: ReadState = { offset: state.offset + complete.length, cursor: read.cursor, size: info.size, mtimeMs: info.mtimeMs, ino: info.ino };
        this.reads.set(file, next);
        deltas.push({ file, events: read.events, issues: read.issues, fromStart, unterminatedBytes: bytes.length - complete.length });
      }
      return deltas;
    });
  }

  /** Journal file names in the folder. */
  async journalFiles(): Promise<string[]> {
    try {
      return (await readdir(this.journalsDir)).filter((f) => parseJournalFileName(f) !== null).sort();
    } catch {
      return [];
    }
  }

  /**
   * Store a raw test file by its SHA-256 (written to a temporary name, synced, renamed:
   * readers never see half a file). Does nothing when it is already there.
   * @returns the hash.
   * @throws Error when the folder cannot be reached (the caller keeps the file and retries).
   */
  async writeRaw(bytes: Uint8Array, expectedHash?: string): Promise<string> {
    const hash = sha256(bytes);
    if (expectedHash && expectedHash !== hash) throw new Error(`raw file content does not match hash ${expectedHash}`);
    if (!(await this.isReachable())) throw new Error(`team folder ${this.folder} cannot be reached`);
    const path = join(this.rawDir, hash);
    try {
      if ((await stat(path)).size === bytes.length) return hash;
    } catch { /* not there yet */ }
    const temp = join(this.rawDir, `.${hash}.${randomBytes(4).toString('hex')}.tmp`);
    await writeDurably(temp, bytes);
    await rename(temp, path);
    return hash;
  }

  /** Read a raw file by hash, checking the content against the hash. */
  async readRaw(hash: string): Promise<RawReadResult> {
    if (!HEX64.test(hash)) return { status: 'damaged', message: `${hash} is not a SHA-256 hash` };
    let bytes: Buffer;
    try {
      bytes = await readFile(join(this.rawDir, hash));
    } catch {
      return { status: 'missing' };
    }
    const actual = sha256(bytes);
    if (actual !== hash) return { status: 'damaged', message: `raw/${hash} has content with hash ${actual}; the file was damaged or replaced` };
    return { status: 'ok', bytes: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.length) };
  }

  /** Hashes of the raw files in the folder. */
  async rawHashes(): Promise<string[]> {
    try {
      return (await readdir(this.rawDir)).filter((f) => HEX64.test(f)).sort();
    } catch {
      return [];
    }
  }

  /**
   * Be told about changes: journals grown or replaced, the folder becoming reachable or
   * not, own events written. Uses fs.watch where it works and polls every
   * `pollIntervalMs` in any case (network and synced folders often send no events);
   * each poll also retries writing waiting events.
   * @returns a function that stops this listener (and the watching, after the last one).
   */
  watch(listener: (change: TeamFolderChange) => void): () => void {
    this.listeners.add(listener);
    if (!this.timer) {
      this.timer = setInterval(() => { void this.poll(); }, this.pollIntervalMs);
      void this.poll();
    }
    return () => {
      this.listeners.delete(listener);
      if (this.listeners.size === 0) this.close();
    };
  }

  /** Stop watching and polling. */
  close(): void {
    if (this.timer) clearInterval(this.timer);
    if (this.debounce) clearTimeout(this.debounce);
    this.timer = null;
    this.debounce = null;
    this.watcher?.close();
    this.watcher = null;
  }

  private async poll(): Promise<void> {
    try {
      const reachable = await this.isReachable();
      if (!reachable) { this.watcher?.close(); this.watcher = null; return; }
      if (this.useFsWatch && !this.watcher) this.startFsWatch();
      if (this.queue.length) await this.flush();
      await this.checkForChanges();
    } catch (e) {
      this.emit({ kind: 'error', message: (e as Error).message });
    }
  }

  private startFsWatch(): void {
    try {
      this.watcher = watchFolder(this.journalsDir, () => {
        if (this.debounce) clearTimeout(this.debounce);
        this.debounce = setTimeout(() => { void this.checkForChanges().catch(() => undefined); }, 50);
      });
      this.watcher.on('error', () => { this.watcher?.close(); this.watcher = null; });
    } catch {
      this.watcher = null; // polling carries on
    }
  }

  /** Compare size and modification time of every journal with the last look; emit the changed ones. */
  private async checkForChanges(): Promise<void> {
    const changed: string[] = [];
    const now = new Map<string, string>();
    for (const file of await this.journalFiles()) {
      try {
        const info = await stat(join(this.journalsDir, file));
        const sig = `${info.size}:${info.mtimeMs}:${info.ino}`;
        now.set(file, sig);
        if (this.lastStats.get(file) !== sig) changed.push(file);
      } catch { /* removed meanwhile */ }
    }
    this.lastStats = now;
    if (changed.length) this.emit({ kind: 'journals-changed', files: changed });
  }

  private emit(change: TeamFolderChange): void {
    for (const l of this.listeners) {
      try { l(change); } catch { /* a listener's fault is not the folder's */ }
    }
  }

  /** Run folder operations one at a time, so appends never interleave. */
  private serial<T>(work: () => Promise<T>): Promise<T> {
    const next = this.busy.then(work, work);
    this.busy = next.catch(() => undefined);
    return next;
  }
}

/**
 * Writes bytes in one go, then fsyncs, so a crash leaves at most a torn last line:
 * flag 'a' appends (journals), 'w' replaces (temporary raw files before their rename).
 */
async function writeDurably(path: string, bytes: Uint8Array, flag: 'a' | 'w' = 'w'): Promise<void> {
  const handle = await open(path, flag);
  try {
    let offset = 0;
    while (offset < bytes.length) {
      const { bytesWritten } = await handle.write(bytes, offset, bytes.length - offset);
      offset += bytesWritten;
    }
    await handle.sync();
  } finally {
    await handle.close();
  }
}

/** Appends bytes durably (see {@link writeDurably}). */
function appendDurably(path: string, bytes: Uint8Array): Promise<void> {
  return writeDurably(path, bytes, 'a');
}

async function readRange(path: string, start: number, end: number): Promise<Buffer> {
  if (end <= start) return Buffer.alloc(0);
  const handle = await open(path, 'r');
  try {
    const out = Buffer.alloc(end - start);
    let read = 0;
    while (read < out.length) {
      const { bytesRead } = await handle.read(out, read, out.length - read, start + read);
      if (bytesRead === 0) break;
      read += bytesRead;
    }
    return out.subarray(0, read);
  } finally {
    await handle.close();
  }
}
