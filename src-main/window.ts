import { BrowserWindow, screen, shell } from 'electron';
import { fitWindowToDisplays, type ShellStateStore, type WindowBounds } from './shell-state';
import { isAppUrl } from './app-scheme';

export interface WindowOptions {
  preloadPath: string;
  startUrl: string;
  store: ShellStateStore;
  developmentOrigin?: string;
}

/**
 * The main window, per the Electron security checklist: sandboxed renderer with context
 * isolation, no Node integration, web security on, no navigation away from the app, no new
 * windows (links to the web open in the system browser only when https), no webviews.
 */
export function createMainWindow(options: WindowOptions): BrowserWindow {
  const saved = fitWindowToDisplays(options.store.current().window, screen.getAllDisplays().map((d) => d.workArea));
  const window = new BrowserWindow({
    ...(saved.x !== undefined && saved.y !== undefined ? { x: saved.x, y: saved.y } : {}),
    width: saved.width,
    height: saved.height,
    minWidth: 900,
    minHeight: 600,
    show: false,
    title: 'Stress Ledger',
    backgroundColor: '#f4f4f1',
    webPreferences: {
      preload: options.preloadPath,
      sandbox: true,
      contextIsolation: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      webviewTag: false,
      spellcheck: false,
      navigateOnDragDrop: false,
    },
  });
  if (saved.maximized) window.maximize();
  window.once('ready-to-show', () => window.show());

  const contents = window.webContents;
  contents.on('will-navigate', (event, url) => {
    if (!isAppUrl(url, options.developmentOrigin)) event.preventDefault();
  });
  contents.on('will-redirect', (event, url) => {
    if (!isAppUrl(url, options.developmentOrigin)) event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(({ url }) => {
    if (url.startsWith('https://')) void shell.openExternal(url);
    return { action: 'deny' };
  });

  let saveTimer: NodeJS.Timeout | null = null;
  const rememberBounds = () => {
    if (saveTimer) clearTimeout(saveTimer);
    saveTimer = setTimeout(() => {
      if (window.isDestroyed()) return;
      const bounds = window.getNormalBounds();
      const state: WindowBounds = { x: bounds.x, y: bounds.y, width: bounds.width, height: bounds.height, maximized: window.isMaximized() };
      void options.store.setWindow(state);
    }, 400);
  };
  window.on('resize', rememberBounds);
  window.on('move', rememberBounds);
  window.on('maximize', rememberBounds);
  window.on('unmaximize', rememberBounds);
  window.on('close', () => {
    if (saveTimer) clearTimeout(saveTimer);
    const bounds = window.getNormalBounds();
    void options.store.setWindow({ x: bounds.x, y: bounds.y, width: bounds.width, height: bounds.height, maximized: window.isMaximized() });
  });

  void window.loadURL(options.startUrl);
  return window;
}
