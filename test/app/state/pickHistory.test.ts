import { describe, expect, it } from 'vitest';
import type { Pick } from '../../../src-renderer/engine/result';
import { canRedo, canUndo, emptyHistory, historyShortcut, recordEdit, redoStep, undoStep } from '../../../src-renderer/app/state/pickHistory';

const pick = (pressure: number, time: number): Pick => ({ kind: 'closure', pressure, time, method: 'manual', sampleIndex: Math.round(time), manual: true });

describe('pickHistory', () => {
  it('should undo an edit by applying its inverse, with the reason kept', () => {
    const auto = pick(30e6, 100);
    const moved = pick(29e6, 120);
    const h = recordEdit(emptyHistory('t1'), { cycle: 1, kind: 'closure', before: auto, after: moved, reason: 'tangent departs later' });
    const u = undoStep(h)!;
    expect(u.apply.after).toEqual(auto);
    expect(u.apply.before).toEqual(moved);
    expect(u.apply.reason).toBe('Undo: tangent departs later');
    expect(canUndo(u.next)).toBe(false);
    expect(canRedo(u.next)).toBe(true);
    const r = redoStep(u.next)!;
    expect(r.apply.after).toEqual(moved);
    expect(canRedo(r.next)).toBe(false);
  });

  it('should clear the redo stack when a new edit is made after an undo', () => {
    let h = recordEdit(emptyHistory('t1'), { cycle: 1, kind: 'isip', before: null, after: pick(1, 1), reason: 'a' });
    h = undoStep(h)!.next;
    h = recordEdit(h, { cycle: 1, kind: 'isip', before: null, after: pick(2, 2), reason: 'b' });
    expect(canRedo(h)).toBe(false);
    expect(h.done).toHaveLength(1);
  });

  it('should return null when there is nothing to undo or redo', () => {
    expect(undoStep(emptyHistory('x'))).toBeNull();
    expect(redoStep(emptyHistory('x'))).toBeNull();
  });

  it('should map the usual desktop shortcuts (common practice: Ctrl+Z, Ctrl+Shift+Z, Ctrl+Y)', () => {
    expect(historyShortcut({ key: 'z', ctrlKey: true, metaKey: false, shiftKey: false })).toBe('undo');
    expect(historyShortcut({ key: 'Z', ctrlKey: true, metaKey: false, shiftKey: true })).toBe('redo');
    expect(historyShortcut({ key: 'y', ctrlKey: true, metaKey: false, shiftKey: false })).toBe('redo');
    expect(historyShortcut({ key: 'z', ctrlKey: false, metaKey: false, shiftKey: false })).toBeNull();
  });
});
