import type { ApplyOutcome, TeamArchiveService, TeamIssue } from './api';
import type { ArchiveEvent } from './events';
import type { TeamFolderBridge, TeamFolderNotice } from '../bridge/types';

/**
 * Keeps an archive in step with the shared team folder: writes this device's events (and
 * the raw files of its imports) the folder lacks, reads everyone else's new events on
 * start, on a timer and when the folder watcher reports a change, and applies them
 * (Archive.applyEvents: merge, conflicts, rebuilt tables). Raw files of tests imported
 * elsewhere are fetched from the folder before applying, and retried on every sync while
 * missing. Nothing is lost while the folder is unreachable: the archive holds every
 * event, and the next sync writes what is waiting.
 */

export type TeamSyncArchive = Pick<TeamArchiveService,
  'deviceId' | 'listEvents' | 'applyEvents' | 'rawFile' | 'missingRawFiles' | 'markSynced' | 'subscribe'>;

export interface TeamSyncOptions {
  /** The team folder (as chosen with chooseTeamFolder). */
  folder: string;
  /** The signed-in user. */
  author: string;
  /** Time between syncs, ms (default 15 000). */
  intervalMs?: number;
  /** Wait after a local change before writing it, ms (default 300), so a burst of changes is one write. */
  pushDelayMs?: number;
  /** Clock for `lastSync` (tests). */
  now?: () => Date;
}

export interface TeamSyncState {
  folder: string;
  /** True between start() and stop(). */
  running: boolean;
  /** True while a sync is in progress. */
  syncing: boolean;
  /** Whether the folder could be reached at the last attempt (null before any). */
  reachable: boolean | null;
  /** Own events of this device not yet in the folder. */
  waiting: number;
  /** When the last sync that reached the folder ended (ISO 8601), or null. */
  lastSync: string | null;
  /** Why the last sync failed, or null. */
  lastError: string | null;
  /** What the last applied batch of changes did (conflicts, findings, issues). */
  lastApply: ApplyOutcome | null;
  /** Journal damage and write problems seen by the last sync. */
  issues: TeamIssue[];
  /** Tests known from the log whose raw file is not here yet. */
  missingRawFiles: number;
}

export class TeamSync {
  private readonly archive: TeamSyncArchive;
  private readonly bridge: TeamFolderBridge;
  private readonly options: Required<Omit<TeamSyncOptions, 'now'>> & { now: () => Date };
  private current: TeamSyncState;
  private readonly listeners = new Set<(state: TeamSyncState) => void>();
  private readonly rawWritten = new Set<string>();
  private timer: ReturnType<typeof setInterval> | null = null;
  private pushTimer: ReturnType<typeof setTimeout> | null = null;
  private unsubscribers: (() => void)[] = [];
  private chain: Promise<unknown> = Promise.resolve();
  private queued: { kind: 'sync' | 'push'; promise: Promise<TeamSyncState> } | null = null;

  constructor(archive: TeamSyncArchive, bridge: TeamFolderBridge, options: TeamSyncOptions) {
    if (!options.folder || !options.author) throw new TypeError('TeamSync needs a team folder and a user name');
    this.archive = archive;
    this.bridge = bridge;
    this.options = { intervalMs: 15_000, pushDelayMs: 300, now: () => new Date(), ...options };
    this.current = {
      folder: options.folder, running: false, syncing: false, reachable: null, waiting: 0,
      lastSync: null, lastError: null, lastApply: null, issues: [], missingRawFiles: 0,
    };
  }

  /** The sync status now (a copy). */
  state(): TeamSyncState {
    return { ...this.current, issues: [...this.current.issues] };
  }

  /** Be told when the status changes; returns an unsubscribe function. */
  subscribe(listener: (state: TeamSyncState) => void): () => void {
    this.listeners.add(listener);
    return () => { this.listeners.delete(listener); };
  }

  private update(patch: Partial<TeamSyncState>): void {
    this.current = { ...this.current, ...patch };
    const snapshot = this.state();
    for (const listener of [...this.listeners]) {
      try { listener(snapshot); } catch { /* a listener's fault is its own */ }
    }
  }

  /**
   * Connect the folder for this user and device, sync once, then keep syncing: on the
   * timer, on the folder watcher's notices and shortly after every local change.
   * @returns the status after the first sync (a failed sync is reported in it, not thrown).
   */
  async start(): Promise<TeamSyncState> {
    if (this.current.running) return this.state();
    this.update({ running: true });
    try {
      const info = await this.bridge.connectTeamFolder({ folder: this.options.folder, author: this.options.author, device: this.archive.deviceId() });
      this.update({ reachable: info.reachable });
    } catch (error) {
      this.update({ reachable: false, lastError: messageOf(error) });
    }
    this.unsubscribers.push(this.bridge.onTeamFolderChanged((notice) => this.onNotice(notice)));
    this.unsubscribers.push(this.archive.subscribe(() => this.schedulePush()));
    this.timer = setInterval(() => { void this.syncNow(); }, this.options.intervalMs);
    return this.syncNow();
  }

  /** Stop the timer and listeners (a sync in progress finishes). */
  stop(): void {
    if (this.timer) clearInterval(this.timer);
    if (this.pushTimer) clearTimeout(this.pushTimer);
    this.timer = null;
    this.pushTimer = null;
    for (const stop of this.unsubscribers.splice(0)) stop();
    this.update({ running: false });
  }

  private onNotice(notice: TeamFolderNotice): void {
    if (notice.kind === 'journals-changed') void this.syncNow();
    else if (notice.kind === 'reachability') {
      this.update({ reachable: notice.reachable });
      if (notice.reachable) void this.syncNow();
    } else if (notice.kind === 'error') this.update({ lastError: notice.message });
  }

  private schedulePush(): void {
    if (!this.current.running) return;
    if (this.pushTimer) clearTimeout(this.pushTimer);
    this.pushTimer = setTimeout(() => { this.pushTimer = null; void this.pushNow(); }, this.options.pushDelayMs);
  }

  /** Write what is waiting and take in others' changes now. Calls made while one is queued share it. */
  syncNow(): Promise<TeamSyncState> {
    return this.enqueue('sync', async () => {
      await this.pushOwn();
      await this.pullOthers();
    });
  }

  /** Write this device's waiting events (and raw files) now, without reading. */
  pushNow(): Promise<TeamSyncState> {
    return this.enqueue('push', () => this.pushOwn());
  }

  private enqueue(kind: 'sync' | 'push', work: () => Promise<void>): Promise<TeamSyncState> {
    if (this.queued && (this.queued.kind === kind || this.queued.kind === 'sync')) return this.queued.promise;
    const run = async (): Promise<TeamSyncState> => {
      if (this.queued?.promise === promise) this.queued = null;
      this.update({ syncing: true, issues: [] });
      try {
        await work();
        this.update({ syncing: false, lastError: null, ...(this.current.reachable ? { lastSync: this.options.now().toISOString() } : {}) });
      } catch (error) {
        this.update({ syncing: false, lastError: messageOf(error) });
      }
      return this.state();
    };
    const promise = this.chain.then(run, run);
    this.chain = promise;
    this.queued = { kind, promise };
    return promise;
  }

  /** Raw files of this device's imports first (so readers find them), then the events. */
  private async pushOwn(): Promise<void> {
    const device = this.archive.deviceId();
    const own = (await this.archive.listEvents()).filter((e) => e.device === device);
    const issues: TeamIssue[] = [];
    for (const e of own) {
      if (e.body.kind !== 'test-imported' || this.rawWritten.has(e.body.fileHash)) continue;
      const bytes = await this.archive.rawFile(e.body.fileHash);
      if (!bytes) continue;
      try {
        await this.bridge.writeTeamRaw(e.body.fileHash, bytes);
        this.rawWritten.add(e.body.fileHash);
      } catch (error) {
        issues.push({ kind: 'raw-not-written', message: `raw file of ${e.body.fileName} not written yet: ${messageOf(error)}`, file: e.body.fileName });
        break;
      }
    }
    const result = await this.bridge.pushTeamEvents(own);
    let waiting = 0;
    for (const journal of result.journals) {
      waiting += journal.waiting;
      if (journal.writtenSeq > 0) await this.archive.markSynced(journal.journal, journal.writtenSeq);
      if (journal.problem) issues.push({ kind: 'write-refused', message: journal.problem });
      if (journal.repaired) issues.push({ kind: 'torn-tail-repaired', message: `the end of ${journal.journal}'s journal was cut short by an earlier crash; ${journal.repaired.bytes} bytes kept as ${journal.repaired.keptAs}` });
    }
    this.update({ reachable: result.reachable, waiting, issues: [...this.current.issues, ...issues] });
  }

  /** Read others' new events and raw files, and apply them. */
  private async pullOthers(): Promise<void> {
    if (this.current.reachable === false) return;
    const changes = await this.bridge.readTeamChanges();
    const events: ArchiveEvent[] = [];
    const issues: TeamIssue[] = [];
    for (const change of changes) {
      events.push(...change.events);
      for (const i of change.issues) issues.push({ kind: i.kind, message: i.message, file: i.file, line: i.line, column: i.column });
    }
    const wanted = new Map<string, string>();
    for (const e of events) {
      if (e.body.kind === 'test-imported' && !wanted.has(e.body.fileHash) && !(await this.archive.rawFile(e.body.fileHash))) wanted.set(e.body.fileHash, e.body.fileName);
    }
    for (const missing of await this.archive.missingRawFiles()) wanted.set(missing.fileHash, missing.fileName);
    const raw = new Map<string, Uint8Array>();
    for (const [hash, fileName] of wanted) {
      const read = await this.bridge.readTeamRaw(hash);
      if (read.status === 'ok') raw.set(hash, read.bytes);
      else if (read.status === 'damaged') issues.push({ kind: 'raw-damaged', message: read.message, file: fileName });
    }
    let lastApply = this.current.lastApply;
    let missingRawFiles = this.current.missingRawFiles;
    if (events.length || raw.size) {
      lastApply = await this.archive.applyEvents(events, raw);
      issues.push(...lastApply.issues);
      missingRawFiles = lastApply.missingRawFiles.length;
    }
    this.update({ lastApply, missingRawFiles, issues: [...this.current.issues, ...issues] });
  }
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
