import { describe, expect, it } from 'vitest';
import type { MenuItemConstructorOptions } from 'electron';
import { buildMenuTemplate } from '../../src-main/menu-template';
import type { MenuCommand } from '../../src-renderer/bridge/types';

// The usual desktop shortcuts (common practice on Windows and Linux): Ctrl+O open, Ctrl+Z/Ctrl+Y
// undo/redo, Ctrl+F find, Ctrl+P print; Ctrl+E for export is this product's choice.

function flatten(items: MenuItemConstructorOptions[]): MenuItemConstructorOptions[] {
  return items.flatMap((item) => [item, ...(Array.isArray(item.submenu) ? flatten(item.submenu) : [])]);
}

function build(recentFiles: string[] = [], platform: NodeJS.Platform = 'linux') {
  const sent: MenuCommand[] = [];
  const opened: string[] = [];
  let cleared = 0;
  const template = buildMenuTemplate(
    { appName: 'Stress Ledger', platform, recentFiles, developerTools: false },
    { send: (c) => sent.push(c), openRecent: (p) => opened.push(p), clearRecent: () => { cleared += 1; }, about: () => undefined },
  );
  return { template, items: flatten(template), sent, opened, cleared: () => cleared };
}

function click(item: MenuItemConstructorOptions | undefined) {
  (item!.click as unknown as () => void)();
}

describe('menu-template', () => {
  it('should send each app command with its shortcut', () => {
    const { items, sent } = build();
    const expected: [string, MenuCommand, string][] = [
      ['Open Files…', 'open-files', 'CmdOrCtrl+O'],
      ['Open Folder…', 'open-folder', 'CmdOrCtrl+Shift+O'],
      ['Export…', 'export', 'CmdOrCtrl+E'],
      ['Print Report…', 'print-report', 'CmdOrCtrl+P'],
      ['Undo Pick Change', 'undo', 'CmdOrCtrl+Z'],
      ['Redo Pick Change', 'redo', 'Ctrl+Y'],
      ['Find…', 'find', 'CmdOrCtrl+F'],
      ['Zoom In', 'zoom-in', 'CmdOrCtrl+='],
      ['Zoom Out', 'zoom-out', 'CmdOrCtrl+-'],
      ['Reset Zoom', 'zoom-reset', 'CmdOrCtrl+0'],
    ];
    for (const [label, command, accelerator] of expected) {
      const item = items.find((i) => i.label === label);
      expect(item?.accelerator, label).toBe(accelerator);
      click(item);
      expect(sent.at(-1)).toBe(command);
    }
  });

  it('should list recent files by name and open the full path', () => {
    const { items, opened, cleared } = build(['/data/hf/HF-3 LOT.csv', '/data/hf/HF-4 FIT.xlsx']);
    const first = items.find((i) => i.label === '1  HF-3 LOT.csv');
    expect(first?.toolTip).toBe('/data/hf/HF-3 LOT.csv');
    click(first);
    expect(opened).toEqual(['/data/hf/HF-3 LOT.csv']);
    click(items.find((i) => i.label === 'Clear Recent'));
    expect(cleared()).toBe(1);
  });

  it('should show a disabled placeholder when there is no recent file', () => {
    const { items } = build([]);
    expect(items.find((i) => i.label === 'No recent files')?.enabled).toBe(false);
  });

  it('should use no shortcut twice', () => {
    const { items } = build(['/a.csv']);
    const accelerators = items.map((i) => i.accelerator).filter(Boolean);
    expect(new Set(accelerators).size).toBe(accelerators.length);
  });

  it('should add the application menu and Cmd redo on macOS, and hide developer tools', () => {
    const { template, items } = build([], 'darwin');
    expect(template[0].label).toBe('Stress Ledger');
    expect(items.find((i) => i.label === 'Redo Pick Change')?.accelerator).toBe('Shift+Cmd+Z');
    expect(items.some((i) => i.role === 'toggleDevTools')).toBe(false);
  });
});
