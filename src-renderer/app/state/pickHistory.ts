import type { Pick, PickKind } from '../../engine/result';

/** One hand edit of a pick: what it was, what it became, and why. */
export interface PickEdit {
  cycle: number;
  kind: PickKind;
  before: Pick | null;
  after: Pick | null;
  reason: string;
}

/** Undo and redo stacks of pick edits for one test. Immutable: every operation returns a new history. */
export interface PickHistory {
  testId: string;
  done: PickEdit[];
  undone: PickEdit[];
}

export function emptyHistory(testId: string): PickHistory {
  return { testId, done: [], undone: [] };
}

/** Records a new edit; clears the redo stack (a new edit branches history). */
export function recordEdit(history: PickHistory, edit: PickEdit, limit = 200): PickHistory {
  const done = [...history.done, edit];
  if (done.length > limit) done.splice(0, done.length - limit);
  return { ...history, done, undone: [] };
}

/**
 * The edit that undoing would apply (the inverse of the last edit) and the
 * history after it; null when there is nothing to undo.
 */
export function undoStep(history: PickHistory): { apply: PickEdit; next: PickHistory } | null {
  const last = history.done[history.done.length - 1];
  if (!last) return null;
  const apply: PickEdit = { cycle: last.cycle, kind: last.kind, before: last.after, after: last.before, reason: `Undo: ${last.reason}` };
  return { apply, next: { ...history, done: history.done.slice(0, -1), undone: [...history.undone, last] } };
}

/** The edit that redoing would apply again and the history after it; null when nothing to redo. */
export function redoStep(history: PickHistory): { apply: PickEdit; next: PickHistory } | null {
  const last = history.undone[history.undone.length - 1];
  if (!last) return null;
  const apply: PickEdit = { ...last, reason: `Redo: ${last.reason}` };
  return { apply, next: { ...history, done: [...history.done, last], undone: history.undone.slice(0, -1) } };
}

export function canUndo(history: PickHistory): boolean { return history.done.length > 0; }
export function canRedo(history: PickHistory): boolean { return history.undone.length > 0; }

/** Keyboard shortcut to history command: Ctrl/Cmd+Z undo, Ctrl/Cmd+Shift+Z or Ctrl+Y redo. */
export function historyShortcut(e: { key: string; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean }): 'undo' | 'redo' | null {
  if (!(e.ctrlKey || e.metaKey)) return null;
  const k = e.key.toLowerCase();
  if (k === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (k === 'y' && !e.shiftKey) return 'redo';
  return null;
}
