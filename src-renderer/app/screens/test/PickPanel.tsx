import type { UnitSystem } from '../../../engine/units/unitSystem';
import type { PickKind } from '../../../engine/result';
import { PickMarker } from '../../components/Badges';
import { PICK_STYLE } from '../../charts/style';
import { pickKey, type PlacedPick } from '../../charts/options';
import { formatQuantity, unitLabel } from '../../format/units';
import { methodWords } from '../../format/methodWords';

export function PickPanel({ picks, units, selected, onSelect, onEdit, onAdd, onReset, canUndo, canRedo, onUndo, onRedo }: {
  picks: PlacedPick[]; units: UnitSystem; selected: string | null;
  onSelect: (key: string) => void; onEdit: (cycle: number, kind: PickKind) => void; onAdd: () => void; onReset: (() => void) | null;
  canUndo: boolean; canRedo: boolean; onUndo: () => void; onRedo: () => void;
}) {
  return (
    <section className="panel stack" aria-labelledby="picks-title" data-testid="picks-panel">
      <div className="row">
        <h2 id="picks-title" style={{ margin: 0 }}>Picks</h2>
        <span className="spacer" />
        <button type="button" className="btn small" onClick={onUndo} disabled={!canUndo} title="Undo (Ctrl+Z)" data-testid="undo">Undo</button>
        <button type="button" className="btn small" onClick={onRedo} disabled={!canRedo} title="Redo (Ctrl+Shift+Z)" data-testid="redo">Redo</button>
        <button type="button" className="btn small" onClick={onAdd} data-testid="add-pick">Add…</button>
        {onReset && <button type="button" className="btn small" onClick={onReset} data-testid="reset-picks">Automatic…</button>}
      </div>
      <p className="hint drag-hint">Drag a marker on a chart, or choose Edit to type a position. Every change needs a reason.</p>
      <table className="plain">
        <thead><tr><th>Pick</th><th className="num">Pressure ({unitLabel(units, 'pressure')})</th><th className="num">Time ({unitLabel(units, 'time')})</th><th /></tr></thead>
        <tbody>
          {picks.length === 0 && <tr><td colSpan={4} className="hint">The analysis found no pick.</td></tr>}
          {picks.map((p) => {
            const key = pickKey(p.cycle, p.kind);
            return (
              <tr key={key} className="pick-row" aria-selected={selected === key} data-testid="pick-row" data-pick={key}
                style={selected === key ? { background: 'var(--accent-soft)' } : undefined} onClick={() => onSelect(key)}>
                <td>
                  <PickMarker kind={p.kind} /><b>{PICK_STYLE[p.kind].short}</b> <span className="hint">cycle {p.cycle}</span>
                  <div className="hint" title={p.pick.manual ? undefined : p.pick.method}>{p.pick.manual ? <>by hand: {p.pick.reason}</> : methodWords(p.pick.method)}</div>
                </td>
                <td className="num">{formatQuantity(units, 'pressure', p.pick.pressure, { unit: false })}</td>
                <td className="num">{formatQuantity(units, 'time', p.pick.time, { unit: false })}</td>
                <td><button type="button" className="btn small" onClick={(e) => { e.stopPropagation(); onEdit(p.cycle, p.kind); }}
                  aria-label={`Edit ${PICK_STYLE[p.kind].name} of cycle ${p.cycle}`} data-testid={`edit-pick-${key}`}>Edit</button></td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </section>
  );
}
