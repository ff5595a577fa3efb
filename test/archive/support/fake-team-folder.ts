import type { ArchiveEvent } from '../../../src-renderer/archive/events';
import type { TeamFolderBridge, TeamFolderInfo, TeamFolderNotice, TeamPushResult } from '../../../src-renderer/bridge/types';
import { journalFileName } from '../../../src-renderer/archive/journal/journal-file';
import { journalKeyOf } from '../../../src-renderer/archive/journal/causality';
import { sha256Hex } from '../../../src-renderer/archive/journal/sha256';

/**
 * An in-memory team folder shared by several fake bridges (one per machine): journals as
 * event lists by file name, raw files by hash, a reachability switch, and the watcher's
 * notices. It keeps the real folder's rules: each device appends only its own journals,
 * in `seq` order without gaps; readers get what is new since their last read.
 */
export class FakeSharedFolder {
  readonly journals = new Map<string, ArchiveEvent[]>();
  readonly raw = new Map<string, Uint8Array>();
  reachable = true;
  readonly watchers = new Set<(notice: TeamFolderNotice) => void>();

  notify(notice: TeamFolderNotice): void {
    for (const watcher of this.watchers) watcher(notice);
  }

  setReachable(reachable: boolean): void {
    this.reachable = reachable;
    this.notify({ kind: 'reachability', reachable });
  }
}

export function fakeTeamFolderBridge(shared: FakeSharedFolder): TeamFolderBridge & { calls: Record<string, number> } {
  let connection: { folder: string; author: string; device: string } | null = null;
  const cursors = new Map<string, number>();
  const calls: Record<string, number> = { push: 0, read: 0, writeRaw: 0, readRaw: 0 };
  let waiting = 0;
  const info = (): TeamFolderInfo => ({
    folder: connection?.folder ?? null, author: connection?.author ?? null, device: connection?.device ?? null,
    reachable: shared.reachable, writtenSeq: connection ? shared.journals.get(journalFileName(connection.author, connection.device))?.length ?? 0 : 0, waiting,
  });
  const unreachable = () => new Error('team folder cannot be reached');
  return {
    calls,
    async chooseTeamFolder() { return '/team/harrow-flats'; },
    async connectTeamFolder(options) { connection = { ...options }; return info(); },
    async pushTeamEvents(events) {
      calls.push += 1;
      if (!connection) throw new Error('not connected');
      const byJournal = new Map<string, ArchiveEvent[]>();
      for (const e of events) {
        if (e.device !== connection.device) continue;
        const key = journalKeyOf(e);
        byJournal.set(key, [...(byJournal.get(key) ?? []), e]);
      }
      const result: TeamPushResult = { reachable: shared.reachable, journals: [] };
      waiting = 0;
      for (const [key, list] of byJournal) {
        const file = journalFileName(list[0].author, list[0].device);
        const existing = shared.journals.get(file) ?? [];
        const pending = list.filter((e) => (e.seq ?? 0) > existing.length).sort((a, b) => a.seq! - b.seq!);
        if (!shared.reachable) {
          waiting += pending.length;
          result.journals.push({ journal: key, written: 0, waiting: pending.length, writtenSeq: existing.length });
          continue;
        }
        let written = 0;
        for (const e of pending) {
          if (e.seq !== existing.length + 1) break;
          existing.push(e);
          written += 1;
        }
        shared.journals.set(file, existing);
        waiting += pending.length - written;
        result.journals.push({ journal: key, written, waiting: pending.length - written, writtenSeq: existing.length });
        if (written) shared.notify({ kind: 'journals-changed', files: [file] });
      }
      return result;
    },
    async readTeamChanges() {
      calls.read += 1;
      if (!shared.reachable) return [];
      const out = [];
      for (const [file, events] of shared.journals) {
        const from = cursors.get(file) ?? 0;
        if (from >= events.length) continue;
        cursors.set(file, events.length);
        out.push({ file, events: events.slice(from), issues: [], fromStart: false, unterminatedBytes: 0 });
      }
      return out;
    },
    async writeTeamRaw(hash, bytes) {
      calls.writeRaw += 1;
      if (!shared.reachable) throw unreachable();
      if (sha256Hex(bytes) !== hash) throw new Error(`raw file content does not match hash ${hash}`);
      shared.raw.set(hash, bytes);
      return hash;
    },
    async readTeamRaw(hash) {
      calls.readRaw += 1;
      const bytes = shared.raw.get(hash);
      return bytes ? { status: 'ok', bytes } : { status: 'missing' };
    },
    async teamFolderStatus() { return info(); },
    onTeamFolderChanged(listener) {
      shared.watchers.add(listener);
      return () => { shared.watchers.delete(listener); };
    },
  };
}
