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
}
