import { app, BrowserWindow, dialog, Menu, session } from 'electron';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { APP_START_URL } from './app-scheme';
import { EVENTS } from './channels';
import { CONTENT_SECURITY_POLICY, DEVELOPMENT_CONTENT_SECURITY_POLICY } from './csp';
import { filesForRecentEntry, registerIpcHandlers } from './ipc';
import { buildMenuTemplate } from './menu-template';
import { enforceContentSecurityPolicy, handleAppScheme, registerAppScheme } from './protocol';
import { ShellStateStore } from './shell-state';
import { createMainWindow } from './window';
import type { MenuCommand } from '../src-renderer/bridge/types';

/** The Electron main process: one window serving the renderer from app://stress-ledger/. */

const here = path.dirname(fileURLToPath(import.meta.url));
const rendererDirectory = path.join(here, '../renderer');
const preloadPath = path.join(here, '../preload/index.cjs');
const developmentUrl = !app.isPackaged ? process.env.ELECTRON_RENDERER_URL : undefined;

registerAppScheme();
app.enableSandbox();
if (!app.requestSingleInstanceLock()) app.quit();

const store = new ShellStateStore(app.getPath('userData'), {
  async read(file) {
    try { return await readFile(file, 'utf8'); } catch { return null; }
  },
  async write(file, text) {
    await mkdir(path.dirname(file), { recursive: true });
    const temporary = `${file}.tmp`;
    await writeFile(temporary, text, 'utf8');
    await rename(temporary, file);
  },
});

let mainWindow: BrowserWindow | null = null;

function send(command: MenuCommand): void {
  const target = BrowserWindow.getFocusedWindow() ?? mainWindow;
  target?.webContents.send(EVENTS.menuCommand, command);
}

function refreshMenu(): void {
  const template = buildMenuTemplate(
    { appName: app.getName(), platform: process.platform, recentFiles: store.current().recentFiles, developerTools: !app.isPackaged },
    {
      send,
      openRecent: (filePath) => {
        void filesForRecentEntry(filePath).then(async (files) => {
          if (files.length === 0) {
            await dialog.showMessageBox({ type: 'warning', message: `${path.basename(filePath)} could not be read.`, detail: filePath });
            return;
          }
          await store.addRecent(filePath);
          refreshMenu();
          mainWindow?.webContents.send(EVENTS.filesOpened, files);
        });
      },
      clearRecent: () => { void store.clearRecent().then(refreshMenu); },
      about: () => {
        void dialog.showMessageBox({
          type: 'info', title: `About ${app.getName()}`, message: `${app.getName()} ${app.getVersion()}`,
          detail: 'Archive and quality review of borehole pressure tests. Results are for review by a qualified engineer, are not a substitute for the operator\'s well-control policy, and defer to local regulations and licensed practice.',
        });
      },
    },
  );
  Menu.setApplicationMenu(Menu.buildFromTemplate(template));
}

app.on('second-instance', () => {
  if (mainWindow) { if (mainWindow.isMinimized()) mainWindow.restore(); mainWindow.focus(); }
});

app.on('web-contents-created', (_event, contents) => {
  contents.on('will-attach-webview', (event) => event.preventDefault());
});

app.whenReady().then(async () => {
  await store.load();
  session.defaultSession.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  enforceContentSecurityPolicy(developmentUrl ? DEVELOPMENT_CONTENT_SECURITY_POLICY : CONTENT_SECURITY_POLICY);
  handleAppScheme(rendererDirectory);
  const { teamFolder } = registerIpcHandlers({ store, refreshMenu, developmentOrigin: developmentUrl });
  app.on('before-quit', () => teamFolder.close());
  refreshMenu();
  mainWindow = createMainWindow({ preloadPath, startUrl: developmentUrl ?? APP_START_URL, store, developmentOrigin: developmentUrl });
  mainWindow.on('closed', () => { mainWindow = null; });
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) {
      mainWindow = createMainWindow({ preloadPath, startUrl: developmentUrl ?? APP_START_URL, store, developmentOrigin: developmentUrl });
    }
  });
}).catch((error: unknown) => {
  dialog.showErrorBox('Stress Ledger could not start', String(error));
  app.quit();
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
