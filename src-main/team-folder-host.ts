import type { ArchiveEvent } from '../src-renderer/archive/events';
import type { TeamFolderInfo, TeamFolderNotice, TeamJournalChanges, TeamPushResult, TeamRawRead } from '../src-renderer/bridge/types';
import { TeamFolder } from './team-folder';

/**
 * The main process's side of the team-folder bridge functions: one connected folder, a
 * TeamFolder per user who made events on this device (each writes only its own journal),
 * and the watcher's notices forwarded to the renderer. Payloads arrive already checked
 * (ipc-schemas.ts); this class holds no Electron code so it is tested on a real folder.
 */

export interface TeamFolderHostOptions {
  /** Deliver a watcher notice to the renderer. */
  notify(notice: TeamFolderNotice): void;
  /** Polling interval of the folder, ms (TeamFolder's default when absent). */
  pollIntervalMs?: number;
  useFsWatch?: boolean;
}

export class TeamFolderHost {
  private readonly options: TeamFolderHostOptions;
  private connection: { folder: string; author: string; device: string } | null = null;
  private primary: TeamFolder | null = null;
  private readonly byAuthor = new Map<string, TeamFolder>();
  private stopWatching: (() => void) | null = null;

  constructor(options: TeamFolderHostOptions) {
    this.options = options;
  }

  /**
   * Use `folder` for `author` on `device`: starts watching it and reports whether it can
   * be reached now. Connecting again (another folder or user) closes the old connection.
   */
  async connect(options: { folder: string; author: string; device: string }): Promise<TeamFolderInfo> {
    this.close();
    this.connection = { ...options };
    this.primary = this.folderFor(options.author);
    await this.primary.isReachable();
    this.stopWatching = this.primary.watch((change) => this.options.notify(change));
    return this.status();
  }

  private folderFor(author: string): TeamFolder {
    const connection = this.requireConnection();
    let folder = this.byAuthor.get(author);
    if (!folder) {
      folder = new TeamFolder({
        folder: connection.folder, author, device: connection.device,
        pollIntervalMs: this.options.pollIntervalMs, useFsWatch: this.options.useFsWatch,
      });
      this.byAuthor.set(author, folder);
    }
    return folder;
  }

  private requireConnection(): { folder: string; author: string; device: string } {
    if (!this.connection) throw new Error('No team folder is connected; choose one first.');
    return this.connection;
  }

  /**
   * Write this device's events the folder lacks, each user's to their own journal.
   * Events of other devices are ignored (they are in their own device's journals).
   */
  async push(events: readonly ArchiveEvent[]): Promise<TeamPushResult> {
    const { device } = this.requireConnection();
    const byAuthor = new Map<string, ArchiveEvent[]>();
    for (const e of events) {
      if (e.device !== device) continue;
      const list = byAuthor.get(e.author);
      if (list) list.push(e); else byAuthor.set(e.author, [e]);
    }
    const result: TeamPushResult = { reachable: true, journals: [] };
    for (const [author, list] of [...byAuthor].sort((a, b) => (a[0] < b[0] ? -1 : 1))) {
      const outcome = await this.folderFor(author).pushOwnEvents(list);
      result.reachable &&= outcome.reachable;
      result.journals.push({
        journal: `${author}@${device}`, written: outcome.written, waiting: outcome.waiting, writtenSeq: outcome.writtenSeq,
        ...(outcome.problem ? { problem: outcome.problem } : {}), ...(outcome.repaired ? { repaired: outcome.repaired } : {}),
      });
    }
    if (byAuthor.size === 0) result.reachable = await this.primaryFolder().isReachable();
    return result;
  }

  private primaryFolder(): TeamFolder {
    this.requireConnection();
    return this.primary!;
  }

  /** New events of every journal in the folder since the last call. */
  async readChanges(): Promise<TeamJournalChanges[]> {
    return this.primaryFolder().readChanges();
  }

  /** Store a raw file by hash; throws when the content does not match or the folder is unreachable. */
  async writeRaw(hash: string, bytes: Uint8Array): Promise<string> {
    return this.primaryFolder().writeRaw(bytes, hash);
  }

  async readRaw(hash: string): Promise<TeamRawRead> {
    return this.primaryFolder().readRaw(hash);
  }

  status(): TeamFolderInfo {
    const connection = this.connection;
    const primary = this.primary;
    return {
      folder: connection?.folder ?? null, author: connection?.author ?? null, device: connection?.device ?? null,
      reachable: primary?.lastKnownReachable() ?? null,
      writtenSeq: primary?.writtenSeq() ?? 0,
      waiting: [...this.byAuthor.values()].reduce((n, f) => n + f.waiting().length, 0),
    };
  }

  /** Stop watching and forget the connection. */
  close(): void {
    this.stopWatching?.();
    this.stopWatching = null;
    for (const folder of this.byAuthor.values()) folder.close();
    this.byAuthor.clear();
    this.primary = null;
    this.connection = null;
  }
}
