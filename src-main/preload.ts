/// <reference lib="dom" />
import { contextBridge, ipcRenderer, webUtils } from 'electron';
import { CHANNELS, EVENTS } from './channels';
import type { MenuCommand, PickedFile, StressLedgerBridge, TeamFolderBridge, TeamFolderNotice } from '../src-renderer/bridge/types';

/**
 * The preload: exposes `window.stressLedger`, one named function per IPC message. The page
 * never sees ipcRenderer. Files dropped on the window are turned into paths here (the page
 * cannot see paths) and read by the main process.
 */

const MENU_COMMANDS: readonly MenuCommand[] = [
  'open-files', 'open-folder', 'export', 'undo', 'redo', 'find', 'zoom-in', 'zoom-out', 'zoom-reset', 'print-report', 'open-recent',
];

const menuListeners = new Set<(command: MenuCommand) => void>();
const teamListeners = new Set<(notice: TeamFolderNotice) => void>();
const TEAM_NOTICE_KINDS = ['journals-changed', 'reachability', 'written', 'error'];
const fileListeners = new Set<(files: PickedFile[]) => void>();

function isEditable(element: Element | null): boolean {
  if (!element) return false;
  if (element instanceof HTMLInputElement || element instanceof HTMLTextAreaElement) return !element.readOnly && !element.disabled;
  return element instanceof HTMLElement && element.isContentEditable;
}

ipcRenderer.on(EVENTS.menuCommand, (_event, command: unknown) => {
  if (typeof command !== 'string' || !MENU_COMMANDS.includes(command as MenuCommand)) return;
  // Undo and redo in a text field stay the field's own.
  if ((command === 'undo' || command === 'redo') && isEditable(document.activeElement)) {
    document.execCommand(command);
    return;
  }
  for (const listener of menuListeners) listener(command as MenuCommand);
});

function deliverFiles(files: PickedFile[]): void {
  if (files.length === 0) return;
  for (const listener of fileListeners) listener(files);
}

ipcRenderer.on(EVENTS.filesOpened, (_event, files: unknown) => {
  if (Array.isArray(files)) deliverFiles(files as PickedFile[]);
});

ipcRenderer.on(EVENTS.teamFolderChanged, (_event, notice: unknown) => {
  if (!notice || typeof notice !== 'object' || !TEAM_NOTICE_KINDS.includes((notice as { kind?: string }).kind ?? '')) return;
  for (const listener of teamListeners) listener(notice as TeamFolderNotice);
});

window.addEventListener('dragover', (event) => {
  if (event.dataTransfer?.types.includes('Files')) { event.preventDefault(); event.dataTransfer.dropEffect = 'copy'; }
});
window.addEventListener('drop', (event) => {
  const dropped = event.dataTransfer?.files;
  if (!dropped || dropped.length === 0) return;
  event.preventDefault();
  const paths = Array.from(dropped).map((file) => webUtils.getPathForFile(file)).filter((p) => p.length > 0);
  if (paths.length === 0) return;
  void (ipcRenderer.invoke(CHANNELS.readDroppedFiles, { paths }) as Promise<PickedFile[]>).then(deliverFiles);
});

const teamFolder: TeamFolderBridge = {
  chooseTeamFolder: () => ipcRenderer.invoke(CHANNELS.chooseTeamFolder),
  connectTeamFolder: ({ folder, author, device }) => ipcRenderer.invoke(CHANNELS.connectTeamFolder, { folder, author, device }),
  pushTeamEvents: (events) => ipcRenderer.invoke(CHANNELS.pushTeamEvents, { events }),
  readTeamChanges: () => ipcRenderer.invoke(CHANNELS.readTeamChanges),
  writeTeamRaw: (hash, bytes) => ipcRenderer.invoke(CHANNELS.writeTeamRaw, { hash, bytes }),
  readTeamRaw: (hash) => ipcRenderer.invoke(CHANNELS.readTeamRaw, { hash }),
  teamFolderStatus: () => ipcRenderer.invoke(CHANNELS.teamFolderStatus),
  onTeamFolderChanged(listener) {
    teamListeners.add(listener);
    return () => { teamListeners.delete(listener); };
  },
};

const bridge: StressLedgerBridge = {
  platform: 'electron',
  openFiles: (options) => ipcRenderer.invoke(CHANNELS.openFiles, options === undefined ? undefined : { ...options }),
  openFolder: () => ipcRenderer.invoke(CHANNELS.openFolder),
  saveFile: (suggestedName, bytes, mimeType) => ipcRenderer.invoke(CHANNELS.saveFile, { suggestedName, bytes, mimeType }),
  printReport: (suggestedName) => ipcRenderer.invoke(CHANNELS.printReport, { suggestedName }),
  onMenuCommand(listener) {
    menuListeners.add(listener);
    return () => { menuListeners.delete(listener); };
  },
  onFilesDropped(listener) {
    fileListeners.add(listener);
    return () => { fileListeners.delete(listener); };
  },
  recentFiles: () => ipcRenderer.invoke(CHANNELS.recentFiles),
  appVersion: () => ipcRenderer.invoke(CHANNELS.appVersion),
  teamFolder,
};

contextBridge.exposeInMainWorld('stressLedger', bridge);
