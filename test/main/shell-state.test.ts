import { describe, expect, it } from 'vitest';
import {
  addRecentFile, DEFAULT_WINDOW, fitWindowToDisplays, MAXIMUM_RECENT_FILES, parseShellState, serialiseShellState, ShellStateStore,
} from '../../src-main/shell-state';

// Window placement rules are common practice for desktop apps: restore the last size and
// place, but never off every screen (e.g. after a monitor was unplugged).

describe('shell-state', () => {
  it('should read back what it wrote', () => {
    const state = { window: { x: 10, y: 20, width: 1200, height: 800, maximized: true }, recentFiles: ['/a.csv'] };
    expect(parseShellState(serialiseShellState(state))).toEqual(state);
  });

  it('should fall back to defaults for a missing, damaged or invalid file', () => {
    expect(parseShellState(null)).toEqual({ window: DEFAULT_WINDOW, recentFiles: [] });
    expect(parseShellState('{not json')).toEqual({ window: DEFAULT_WINDOW, recentFiles: [] });
    expect(parseShellState(JSON.stringify({ window: { width: 'big' }, recentFiles: [] })).window).toEqual(DEFAULT_WINDOW);
  });

  it('should keep recent files newest first, without duplicates, at most ten', () => {
    let list: string[] = [];
    for (let i = 0; i < 12; i++) list = addRecentFile(list, `/data/f${i}.csv`);
    list = addRecentFile(list, '/data/f5.csv');
    expect(list[0]).toBe('/data/f5.csv');
    expect(list).toHaveLength(MAXIMUM_RECENT_FILES);
    expect(new Set(list).size).toBe(list.length);
  });

  it('should keep a position on a display and drop one that is off every display', () => {
    const displays = [{ x: 0, y: 0, width: 1920, height: 1080 }];
    expect(fitWindowToDisplays({ x: 100, y: 50, width: 1400, height: 900, maximized: false }, displays)).toEqual({ x: 100, y: 50, width: 1400, height: 900, maximized: false });
    expect(fitWindowToDisplays({ x: 2500, y: 50, width: 1400, height: 900, maximized: false }, displays)).toEqual({ width: 1400, height: 900, maximized: false });
  });

  it('should shrink a window larger than the display and keep the minimum size', () => {
    const displays = [{ x: 0, y: 0, width: 1280, height: 720 }];
    expect(fitWindowToDisplays({ width: 3000, height: 2000, maximized: false }, displays)).toMatchObject({ width: 1280, height: 720 });
    expect(fitWindowToDisplays({ width: 300, height: 200, maximized: false }, displays)).toMatchObject({ width: 900, height: 600 });
  });

  it('should store window and recent files in one JSON file under the given folder', async () => {
    const files = new Map<string, string>();
    const access = { read: async (p: string) => files.get(p) ?? null, write: async (p: string, t: string) => { files.set(p, t); } };
    const store = new ShellStateStore('/home/ana/.config/Stress Ledger', access);
    await store.load();
    await store.setWindow({ x: 5, y: 6, width: 1000, height: 700, maximized: false });
    await store.addRecent('/data/hf-1.csv');
    expect([...files.keys()]).toEqual(['/home/ana/.config/Stress Ledger/shell-state.json']);
    const again = new ShellStateStore('/home/ana/.config/Stress Ledger', access);
    expect(await again.load()).toEqual({ window: { x: 5, y: 6, width: 1000, height: 700, maximized: false }, recentFiles: ['/data/hf-1.csv'] });
  });
});
