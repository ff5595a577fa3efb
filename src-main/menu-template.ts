import type { MenuItemConstructorOptions } from 'electron';
import path from 'node:path';
import type { MenuCommand } from '../src-renderer/bridge/types';

/**
 * The native menu as a template, built without touching Electron so it can be tested.
 * Commands that the app handles (open, export, undo of pick edits, find, print) are sent
 * to the renderer; window and text-size items use Electron's roles.
 */
export interface MenuActions {
  /** Send a command to the focused window's app. */
  send(command: MenuCommand): void;
  /** Open one of the recent files. */
  openRecent(filePath: string): void;
  clearRecent(): void;
  /** Show the about box. */
  about(): void;
}

export interface MenuOptions {
  appName: string;
  platform: NodeJS.Platform;
  recentFiles: readonly string[];
  /** Show developer tools items (never in a packaged build). */
  developerTools: boolean;
}

export function buildMenuTemplate(options: MenuOptions, actions: MenuActions): MenuItemConstructorOptions[] {
  const mac = options.platform === 'darwin';
  const command = (label: string, cmd: MenuCommand, accelerator?: string): MenuItemConstructorOptions => ({
    label, ...(accelerator ? { accelerator } : {}), click: () => actions.send(cmd),
  });
  const recent: MenuItemConstructorOptions[] = options.recentFiles.length
    ? [
        ...options.recentFiles.map((file, i): MenuItemConstructorOptions => ({
          label: `${i + 1}  ${path.basename(file)}`, toolTip: file, click: () => actions.openRecent(file),
        })),
        { type: 'separator' },
        { label: 'Clear Recent', click: () => actions.clearRecent() },
      ]
    : [{ label: 'No recent files', enabled: false }];

  const fileMenu: MenuItemConstructorOptions = {
    label: '&File',
    submenu: [
      command('Open Files…', 'open-files', 'CmdOrCtrl+O'),
      command('Open Folder…', 'open-folder', 'CmdOrCtrl+Shift+O'),
      { label: 'Open Recent', submenu: recent },
      { type: 'separator' },
      command('Export…', 'export', 'CmdOrCtrl+E'),
      command('Print Report…', 'print-report', 'CmdOrCtrl+P'),
      { type: 'separator' },
      mac ? { role: 'close' } : { role: 'quit', label: 'Exit' },
    ],
  };
  const editMenu: MenuItemConstructorOptions = {
    label: '&Edit',
    submenu: [
      command('Undo Pick Change', 'undo', 'CmdOrCtrl+Z'),
      command('Redo Pick Change', 'redo', mac ? 'Shift+Cmd+Z' : 'Ctrl+Y'),
      { type: 'separator' },
      { role: 'cut' }, { role: 'copy' }, { role: 'paste' }, { role: 'selectAll' },
      { type: 'separator' },
      command('Find…', 'find', 'CmdOrCtrl+F'),
    ],
  };
  const viewMenu: MenuItemConstructorOptions = {
    label: '&View',
    submenu: [
      command('Zoom In', 'zoom-in', 'CmdOrCtrl+='),
      command('Zoom Out', 'zoom-out', 'CmdOrCtrl+-'),
      command('Reset Zoom', 'zoom-reset', 'CmdOrCtrl+0'),
      { type: 'separator' },
      { label: 'Text Size', submenu: [{ role: 'zoomIn', accelerator: 'CmdOrCtrl+Shift+=' }, { role: 'zoomOut', accelerator: 'CmdOrCtrl+Shift+-' }, { role: 'resetZoom', accelerator: 'CmdOrCtrl+Shift+0' }] },
      { role: 'togglefullscreen' },
      ...(options.developerTools ? [{ type: 'separator' } as const, { role: 'reload' } as const, { role: 'toggleDevTools' } as const] : []),
    ],
  };
  const windowMenu: MenuItemConstructorOptions = { label: '&Window', submenu: [{ role: 'minimize' }, ...(mac ? [{ role: 'zoom' } as const, { role: 'front' } as const] : [{ role: 'close' } as const])] };
  const helpMenu: MenuItemConstructorOptions = { label: '&Help', submenu: [{ label: `About ${options.appName}`, click: () => actions.about() }] };

  const template: MenuItemConstructorOptions[] = [fileMenu, editMenu, viewMenu, windowMenu, helpMenu];
  if (mac) {
    template.unshift({
      label: options.appName,
      submenu: [{ role: 'about' }, { type: 'separator' }, { role: 'hide' }, { role: 'hideOthers' }, { role: 'unhide' }, { type: 'separator' }, { role: 'quit' }],
    });
  }
  return template;
}
