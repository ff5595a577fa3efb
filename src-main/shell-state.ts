import { z } from 'zod';
import path from 'node:path';

/**
 * What the shell remembers between runs, in one JSON file under userData: the window's
 * size and position, and the recently opened files. Pure parsing, merging and clamping;
 * reading and writing the file take injected functions so they are testable.
 */

export interface WindowBounds { x?: number; y?: number; width: number; height: number; maximized: boolean }
export interface ShellState { window: WindowBounds; recentFiles: string[] }
export interface Rectangle { x: number; y: number; width: number; height: number }

export const SHELL_STATE_FILE = 'shell-state.json';
export const MAXIMUM_RECENT_FILES = 10;
export const DEFAULT_WINDOW: WindowBounds = { width: 1400, height: 900, maximized: false };
export const MINIMUM_WINDOW = { width: 900, height: 600 };

const stateSchema = z.object({
  window: z.object({
    x: z.number().int().optional(),
    y: z.number().int().optional(),
    width: z.number().int().min(100).max(20000),
    height: z.number().int().min(100).max(20000),
    maximized: z.boolean(),
  }),
  recentFiles: z.array(z.string().min(1).max(4096)).max(100),
});

/** The state held in a file's text; defaults for anything missing or damaged. */
export function parseShellState(text: string | null): ShellState {
  if (!text) return { window: { ...DEFAULT_WINDOW }, recentFiles: [] };
  try {
    const result = stateSchema.safeParse(JSON.parse(text));
    if (result.success) return { window: result.data.window, recentFiles: result.data.recentFiles.slice(0, MAXIMUM_RECENT_FILES) };
  } catch {
    /* damaged file: start from defaults */
  }
  return { window: { ...DEFAULT_WINDOW }, recentFiles: [] };
}

export function serialiseShellState(state: ShellState): string {
  return JSON.stringify(state, null, 2) + '\n';
}

/** The recent list with `filePath` first, without duplicates, at most MAXIMUM_RECENT_FILES long. */
export function addRecentFile(list: readonly string[], filePath: string): string[] {
  const key = (p: string) => path.resolve(p);
  const next = [filePath, ...list.filter((p) => key(p) !== key(filePath))];
  return next.slice(0, MAXIMUM_RECENT_FILES);
}

/**
 * Window bounds that are visible on one of the displays: a saved position that lies off
 * every display (unplugged monitor) is dropped so the window opens centred; size is kept
 * within the display and above the minimum.
 */
export function fitWindowToDisplays(bounds: WindowBounds, workAreas: readonly Rectangle[]): WindowBounds {
  const largest = workAreas.reduce<Rectangle | null>((best, a) => (!best || a.width * a.height > best.width * best.height ? a : best), null);
  const maxWidth = largest ? largest.width : bounds.width;
  const maxHeight = largest ? largest.height : bounds.height;
  const width = Math.max(MINIMUM_WINDOW.width, Math.min(bounds.width, maxWidth));
  const height = Math.max(MINIMUM_WINDOW.height, Math.min(bounds.height, maxHeight));
  const out: WindowBounds = { width, height, maximized: bounds.maximized };
  if (bounds.x === undefined || bounds.y === undefined) return out;
  const visible = workAreas.some((a) => overlap(a, { x: bounds.x!, y: bounds.y!, width, height }) >= 0.5 * Math.min(width * height, a.width * a.height));
  if (visible) { out.x = bounds.x; out.y = bounds.y; }
  return out;
}

function overlap(a: Rectangle, b: Rectangle): number {
  const w = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
  return w > 0 && h > 0 ? w * h : 0;
}

export interface TextFileAccess {
  read(filePath: string): Promise<string | null>;
  write(filePath: string, text: string): Promise<void>;
}

/** Keeps the shell state in `directory/shell-state.json`, written atomically by the injected writer. */
export class ShellStateStore {
  private state: ShellState = { window: { ...DEFAULT_WINDOW }, recentFiles: [] };
  private readonly file: string;
  constructor(directory: string, private readonly files: TextFileAccess) {
    this.file = path.join(directory, SHELL_STATE_FILE);
  }
  async load(): Promise<ShellState> {
    this.state = parseShellState(await this.files.read(this.file));
    return this.current();
  }
  current(): ShellState { return { window: { ...this.state.window }, recentFiles: [...this.state.recentFiles] }; }
  async setWindow(bounds: WindowBounds): Promise<void> { this.state.window = { ...bounds }; await this.save(); }
  async addRecent(filePath: string): Promise<string[]> { this.state.recentFiles = addRecentFile(this.state.recentFiles, filePath); await this.save(); return [...this.state.recentFiles]; }
  async clearRecent(): Promise<void> { this.state.recentFiles = []; await this.save(); }
  private save(): Promise<void> { return this.files.write(this.file, serialiseShellState(this.state)); }
}
