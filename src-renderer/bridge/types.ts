import type { ArchiveEvent } from '../archive/events';
import type { JournalIssue } from '../archive/journal/journal-file';

/**
 * The bridge between the renderer and the system. Electron's preload exposes one
 * implementation as `window.stressLedger`; the web build provides another (file inputs,
 * drag and drop, downloads). Screens use only this interface.
 */

/** A file the user opened or dropped, read whole. */
export interface PickedFile {
  name: string;
  /** Path inside a picked folder, or the file name. */
  relativePath: string;
  bytes: Uint8Array;
}

export type MenuCommand =
  | 'open-files' | 'open-folder' | 'export' | 'undo' | 'redo' | 'find'
  | 'zoom-in' | 'zoom-out' | 'zoom-reset' | 'print-report' | 'open-recent';

export interface StressLedgerBridge {
  /** 'electron' or 'web'. */
  readonly platform: 'electron' | 'web';
  openFiles(options?: { accept?: string[]; multiple?: boolean }): Promise<PickedFile[]>;
  openFolder(): Promise<PickedFile[]>;
  /** Save bytes: a native save dialog in Electron, a download in the browser. Returns the saved name or null if cancelled. */
  saveFile(suggestedName: string, bytes: Uint8Array, mimeType: string): Promise<string | null>;
  /** Print the current window to PDF (Electron) or open the browser's print dialog (web). */
  printReport(suggestedName: string): Promise<string | null>;
  /** Subscribe to native menu commands; returns an unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
  /** Files dropped on the window (Electron delivers paths read by main; web reads DataTransfer). */
  onFilesDropped(listener: (files: PickedFile[]) => void): () => void;
  /** Recent archives / recently opened files list, kept by the shell. */
  recentFiles(): Promise<string[]>;
  appVersion(): Promise<string>;
  /** The shared team folder (Electron only; the browser build shares through bundles). */
  readonly teamFolder?: TeamFolderBridge;
}

/** Where the team folder connection stands. */
export interface TeamFolderInfo {
  /** The connected folder, or null before connectTeamFolder. */
  folder: string | null;
  author: string | null;
  device: string | null;
  /** Whether the folder could be reached at the last attempt (null before any). */
  reachable: boolean | null;
  /** Highest own `seq` of the connected user's journal in the folder. */
  writtenSeq: number;
  /** Own events handed over but not yet written (folder unreachable). */
  waiting: number;
}

/** What one push did, per own journal (one per user on this device). */
export interface TeamPushResult {
  reachable: boolean;
  journals: { journal: string; written: number; waiting: number; writtenSeq: number; problem?: string; repaired?: { keptAs: string; bytes: number } }[];
}

/** A journal problem found while reading the folder (torn tail, broken chain ...). */
/** A problem found reading a journal (the journal reader's own issue type). */
export type TeamJournalIssue = JournalIssue;

/** New events of one journal file since the last read. */
export interface TeamJournalChanges {
  file: string;
  events: ArchiveEvent[];
  issues: TeamJournalIssue[];
  /** Read again from the start (the file shrank or was replaced). */
  fromStart: boolean;
  /** Bytes after the last newline not yet read. */
  unterminatedBytes: number;
}

export type TeamRawRead =
  | { status: 'ok'; bytes: Uint8Array }
  | { status: 'missing' }
  | { status: 'damaged'; message: string };

/** What the folder watcher reports. */
export type TeamFolderNotice =
  | { kind: 'journals-changed'; files: string[] }
  | { kind: 'reachability'; reachable: boolean }
  | { kind: 'written'; writtenSeq: number }
  | { kind: 'error'; message: string };

/**
 * The shared team folder, through the main process (src-main/team-folder.ts). One named
 * function per IPC message; every payload is checked in main.
 */
export interface TeamFolderBridge {
  /** Native folder dialog; the chosen absolute path, or null when cancelled. */
  chooseTeamFolder(): Promise<string | null>;
  /** Use `folder` for `author` on `device` (this archive's device id); starts watching it. */
  connectTeamFolder(options: { folder: string; author: string; device: string }): Promise<TeamFolderInfo>;
  /** Write this device's events the folder lacks (other devices' events are ignored). Idempotent. */
  pushTeamEvents(events: ArchiveEvent[]): Promise<TeamPushResult>;
  /** New events of every journal in the folder since the last call (all on the first). */
  readTeamChanges(): Promise<TeamJournalChanges[]>;
  /** Store a raw test file by its SHA-256 (nothing happens when it is there). Returns the hash. */
  writeTeamRaw(hash: string, bytes: Uint8Array): Promise<string>;
  readTeamRaw(hash: string): Promise<TeamRawRead>;
  teamFolderStatus(): Promise<TeamFolderInfo>;
  /** Changes the folder watcher saw; returns an unsubscribe function. */
  onTeamFolderChanged(listener: (notice: TeamFolderNotice) => void): () => void;
}
