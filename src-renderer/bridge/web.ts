import type { MenuCommand, PickedFile, StressLedgerBridge } from './types';

/**
 * The bridge in a plain browser: file inputs (files, or a folder via webkitdirectory),
 * drag and drop of files and folders, downloads through a Blob link, printing with the
 * browser's print dialog, and the shell's keyboard shortcuts mapped to the same menu
 * commands the Electron menu sends.
 */

declare const __APP_VERSION__: string | undefined;

const RECENT_KEY = 'stress-ledger.recent-files';
const MAXIMUM_RECENT = 10;

export interface WebBridgeEnvironment {
  document: Document;
  window: Window;
  storage?: Storage | null;
  version?: string;
}

/** The menu command a key press stands for (Ctrl or Cmd shortcuts), or null. */
export function menuCommandForKey(event: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>): MenuCommand | null {
  if (!(event.ctrlKey || event.metaKey) || event.altKey) return null;
  const key = event.key.toLowerCase();
  if (key === 'o') return event.shiftKey ? 'open-folder' : 'open-files';
  if (key === 'e' && !event.shiftKey) return 'export';
  if (key === 'p' && !event.shiftKey) return 'print-report';
  if (key === 'f' && !event.shiftKey) return 'find';
  if (key === 'z') return event.shiftKey ? 'redo' : 'undo';
  if (key === 'y' && !event.shiftKey) return 'redo';
  if ((key === '=' || key === '+') && !event.shiftKey) return 'zoom-in';
  if (key === '-' && !event.shiftKey) return 'zoom-out';
  if (key === '0' && !event.shiftKey) return 'zoom-reset';
  return null;
}

function isEditableTarget(target: EventTarget | null): boolean {
  const element = target as (HTMLElement & { readOnly?: boolean; type?: string }) | null;
  if (!element || typeof element.tagName !== 'string') return false;
  const tag = element.tagName.toLowerCase();
  if (tag === 'textarea') return !element.readOnly;
  if (tag === 'input') return !element.readOnly && !['checkbox', 'radio', 'button', 'submit', 'range', 'file'].includes(element.type ?? '');
  return element.isContentEditable === true;
}

/** Minimal shapes of the File and Directory Entries API used for dropped folders. */
interface EntryLike { isFile: boolean; isDirectory: boolean; name: string; fullPath?: string }
interface FileEntryLike extends EntryLike { file(success: (file: File) => void, failure?: (error: unknown) => void): void }
interface DirectoryEntryLike extends EntryLike { createReader(): { readEntries(success: (entries: EntryLike[]) => void, failure?: (error: unknown) => void): void } }

/** Every file under dropped entries (folders walked), with its path inside the drop. */
export async function filesFromEntries(entries: EntryLike[], maximum = 5000): Promise<{ file: File; relativePath: string }[]> {
  const out: { file: File; relativePath: string }[] = [];
  const walk = async (entry: EntryLike, prefix: string, depth: number): Promise<void> => {
    if (out.length >= maximum || entry.name.startsWith('.')) return;
    const relativePath = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isFile) {
      const file = await new Promise<File>((resolve, reject) => (entry as FileEntryLike).file(resolve, reject));
      out.push({ file, relativePath });
    } else if (entry.isDirectory && depth < 8) {
      const reader = (entry as DirectoryEntryLike).createReader();
      for (;;) {
        const batch = await new Promise<EntryLike[]>((resolve, reject) => reader.readEntries(resolve, reject));
        if (batch.length === 0) break;
        for (const child of batch.sort((a, b) => a.name.localeCompare(b.name))) await walk(child, relativePath, depth + 1);
      }
    }
  };
  for (const entry of entries) await walk(entry, '', 0);
  return out;
}

async function readAll(files: { file: File; relativePath: string }[]): Promise<PickedFile[]> {
  return Promise.all(files.map(async ({ file, relativePath }) => ({
    name: file.name, relativePath, bytes: new Uint8Array(await file.arrayBuffer()),
  })));
}

/** Files of a DataTransfer: folders through webkitGetAsEntry where the browser has it. */
export async function filesFromDataTransfer(transfer: DataTransfer): Promise<PickedFile[]> {
  const items = Array.from(transfer.items ?? []);
  const entries = items
    .filter((item) => item.kind === 'file')
    .map((item) => (item as DataTransferItem & { webkitGetAsEntry?: () => EntryLike | null }).webkitGetAsEntry?.() ?? null);
  if (entries.length > 0 && entries.every((e) => e !== null)) return readAll(await filesFromEntries(entries as EntryLike[]));
  return readAll(Array.from(transfer.files ?? []).map((file) => ({ file, relativePath: file.name })));
}

export function createWebBridge(environment: WebBridgeEnvironment): StressLedgerBridge {
  const { document: doc, window: win } = environment;
  const storage = environment.storage === undefined ? safeStorage(win) : environment.storage;

  const remember = (files: PickedFile[]) => {
    if (!storage || files.length === 0) return;
    const names = files.slice(0, MAXIMUM_RECENT).map((f) => f.relativePath);
    const old = readRecent(storage).filter((n) => !names.includes(n));
    storage.setItem(RECENT_KEY, JSON.stringify([...names, ...old].slice(0, MAXIMUM_RECENT)));
  };

  const pick = (configure: (input: HTMLInputElement) => void): Promise<PickedFile[]> => new Promise((resolve, reject) => {
    const input = doc.createElement('input');
    input.type = 'file';
    input.style.display = 'none';
    configure(input);
    let settled = false;
    const finish = (files: PickedFile[] | Error) => {
      if (settled) return;
      settled = true;
      input.remove();
      if (files instanceof Error) reject(files); else { remember(files); resolve(files); }
    };
    input.addEventListener('change', () => {
      const chosen = Array.from(input.files ?? []).map((file) => ({
        file, relativePath: (file as File & { webkitRelativePath?: string }).webkitRelativePath || file.name,
      }));
      readAll(chosen).then(finish, (e: unknown) => finish(e instanceof Error ? e : new Error(String(e))));
    });
    input.addEventListener('cancel', () => finish([]));
    doc.body.appendChild(input);
    input.click();
  });

  return {
    platform: 'web',
    openFiles(options) {
      return pick((input) => {
        input.multiple = options?.multiple !== false;
        if (options?.accept?.length) input.accept = options.accept.map((e) => (e.startsWith('.') ? e : `.${e}`)).join(',');
      });
    },
    openFolder() {
      return pick((input) => {
        input.multiple = true;
        input.setAttribute('webkitdirectory', '');
        input.setAttribute('directory', '');
      });
    },
    async saveFile(suggestedName, bytes, mimeType) {
      const blob = new Blob([bytes as Uint8Array<ArrayBuffer>], { type: mimeType });
      const url = URL.createObjectURL(blob);
      const link = doc.createElement('a');
      link.href = url;
      link.download = suggestedName;
      link.rel = 'noopener';
      link.style.display = 'none';
      doc.body.appendChild(link);
      link.click();
      link.remove();
      win.setTimeout(() => URL.revokeObjectURL(url), 60_000);
      return suggestedName;
    },
    async printReport() {
      win.print();
      return null;
    },
    onMenuCommand(listener) {
      const onKey = (event: KeyboardEvent) => {
        const command = menuCommandForKey(event);
        if (!command) return;
        if ((command === 'undo' || command === 'redo') && isEditableTarget(event.target)) return;
        event.preventDefault();
        listener(command);
      };
      win.addEventListener('keydown', onKey);
      return () => win.removeEventListener('keydown', onKey);
    },
    onFilesDropped(listener) {
      const onDragOver = (event: DragEvent) => {
        if (event.dataTransfer && Array.from(event.dataTransfer.types ?? []).includes('Files')) {
          event.preventDefault();
          event.dataTransfer.dropEffect = 'copy';
        }
      };
      const onDrop = (event: DragEvent) => {
        if (!event.dataTransfer || (event.dataTransfer.files?.length ?? 0) === 0) return;
        event.preventDefault();
        void filesFromDataTransfer(event.dataTransfer).then((files) => {
          remember(files);
          if (files.length) listener(files);
        });
      };
      win.addEventListener('dragover', onDragOver);
      win.addEventListener('drop', onDrop);
      return () => { win.removeEventListener('dragover', onDragOver); win.removeEventListener('drop', onDrop); };
    },
    async recentFiles() {
      return storage ? readRecent(storage) : [];
    },
    async appVersion() {
      return environment.version ?? (typeof __APP_VERSION__ === 'string' ? __APP_VERSION__ : '0.0.0');
    },
  };
}

function readRecent(storage: Storage): string[] {
  try {
    const value = JSON.parse(storage.getItem(RECENT_KEY) ?? '[]');
    return Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string').slice(0, MAXIMUM_RECENT) : [];
  } catch {
    return [];
  }
}

function safeStorage(win: Window): Storage | null {
  try { return win.localStorage; } catch { return null; }
}
