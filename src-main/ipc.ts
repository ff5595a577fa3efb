import { app, BrowserWindow, dialog, ipcMain, type IpcMainInvokeEvent } from 'electron';
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { CHANNELS, EVENTS } from './channels';
import { isAppUrl } from './app-scheme';
import { parsePayload, PAYLOAD_SCHEMAS, type PayloadOf } from './ipc-schemas';
import { IMPORTABLE_EXTENSIONS, readChosenPaths } from './files';
import type { ShellStateStore } from './shell-state';
import { TeamFolderHost } from './team-folder-host';
import type { PickedFile } from '../src-renderer/bridge/types';
import type { ArchiveEvent } from '../src-renderer/archive/events';

type Channel = keyof typeof PAYLOAD_SCHEMAS;

export interface IpcContext {
  store: ShellStateStore;
  /** Rebuild the menu (after the recent list changed). */
  refreshMenu(): void;
  /** Origin of the development server, when running under it. */
  developmentOrigin?: string;
  /** The team folder connection (default: one whose notices go to every window). */
  teamFolder?: TeamFolderHost;
}

/**
 * Register one handler per bridge function. Each refuses a sender frame that is not the
 * app's own page, then validates its payload with zod before doing anything.
 */
export function registerIpcHandlers(context: IpcContext): { teamFolder: TeamFolderHost } {
  const handle = <C extends Channel>(channel: C, work: (payload: PayloadOf<C>, window: BrowserWindow) => Promise<unknown>) => {
    ipcMain.handle(channel, async (event: IpcMainInvokeEvent, payload: unknown) => {
      if (!isAppUrl(event.senderFrame?.url, context.developmentOrigin)) {
        throw new Error(`Refused ${channel}: the request did not come from the app's page.`);
      }
      const window = BrowserWindow.fromWebContents(event.sender);
      if (!window) throw new Error(`Refused ${channel}: no window.`);
      return work(parsePayload(channel, payload), window);
    });
  };

  const remember = async (paths: string[]) => {
    for (const p of paths.slice(0, 10).reverse()) await context.store.addRecent(p);
    context.refreshMenu();
  };

  handle(CHANNELS.openFiles, async (payload, window) => {
    const extensions = (payload?.accept ?? IMPORTABLE_EXTENSIONS).map((e) => e.replace(/^\./, ''));
    const result = await dialog.showOpenDialog(window, {
      title: 'Open test files',
      properties: payload?.multiple === false ? ['openFile'] : ['openFile', 'multiSelections'],
      filters: [{ name: 'Test files', extensions }, { name: 'All files', extensions: ['*'] }],
    });
    if (result.canceled) return [];
    await remember(result.filePaths);
    return (await readChosenPaths(result.filePaths)).files;
  });

  handle(CHANNELS.openFolder, async (_payload, window) => {
    const result = await dialog.showOpenDialog(window, { title: 'Open a folder of test files', properties: ['openDirectory'] });
    if (result.canceled || result.filePaths.length === 0) return [];
    await remember(result.filePaths);
    return (await readChosenPaths(result.filePaths)).files;
  });

  handle(CHANNELS.readDroppedFiles, async (payload) => {
    await remember(payload.paths);
    return (await readChosenPaths(payload.paths)).files;
  });

  handle(CHANNELS.saveFile, async (payload, window) => {
    const extension = path.extname(payload.suggestedName).replace(/^\./, '');
    const result = await dialog.showSaveDialog(window, {
      title: 'Save',
      defaultPath: path.join(app.getPath('documents'), payload.suggestedName),
      filters: extension ? [{ name: extension.toUpperCase(), extensions: [extension] }] : [],
    });
    if (result.canceled || !result.filePath) return null;
    await writeFile(result.filePath, payload.bytes);
    return path.basename(result.filePath);
  });

  handle(CHANNELS.printReport, async (payload, window) => {
    const result = await dialog.showSaveDialog(window, {
      title: 'Save report as PDF',
      defaultPath: path.join(app.getPath('documents'), payload.suggestedName),
      filters: [{ name: 'PDF', extensions: ['pdf'] }],
    });
    if (result.canceled || !result.filePath) return null;
    const pdf = await window.webContents.printToPDF({ printBackground: true, pageSize: 'A4', displayHeaderFooter: false, preferCSSPageSize: true });
    await writeFile(result.filePath, pdf);
    return path.basename(result.filePath);
  });

  handle(CHANNELS.recentFiles, async () => context.store.current().recentFiles);
  handle(CHANNELS.appVersion, async () => app.getVersion());

  const teamFolder = context.teamFolder ?? new TeamFolderHost({
    notify: (notice) => { for (const window of BrowserWindow.getAllWindows()) window.webContents.send(EVENTS.teamFolderChanged, notice); },
  });

  handle(CHANNELS.chooseTeamFolder, async (_payload, window) => {
    const result = await dialog.showOpenDialog(window, { title: 'Choose the team folder', properties: ['openDirectory', 'createDirectory'] });
    return result.canceled || result.filePaths.length === 0 ? null : result.filePaths[0];
  });
  handle(CHANNELS.connectTeamFolder, async (payload) => teamFolder.connect(payload));
  // Each event's shape was checked by the payload schema (journal/validate.ts).
  handle(CHANNELS.pushTeamEvents, async (payload) => teamFolder.push(payload.events as ArchiveEvent[]));
  handle(CHANNELS.readTeamChanges, async () => teamFolder.readChanges());
  handle(CHANNELS.writeTeamRaw, async (payload) => teamFolder.writeRaw(payload.hash, payload.bytes));
  handle(CHANNELS.readTeamRaw, async (payload) => teamFolder.readRaw(payload.hash));
  handle(CHANNELS.teamFolderStatus, async () => teamFolder.status());
  return { teamFolder };
}

/** Read files for a recent-list entry and hand them to the window's app. */
export async function filesForRecentEntry(filePath: string): Promise<PickedFile[]> {
  return (await readChosenPaths([filePath])).files;
}
