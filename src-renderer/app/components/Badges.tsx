import type { Grade, PickKind } from '../../engine/result';
import type { ReviewState } from '../../archive/events';
import { CRITERION_STYLE, GRADE_STYLE, PICK_STYLE, STATE_STYLE } from '../charts/style';

export function GradeBadge({ grade, large = false }: { grade: Grade; large?: boolean }) {
  const s = GRADE_STYLE[grade];
  return (
    <span className={`grade${large ? ' large' : ''}`} style={{ color: s.color }} title={`Grade ${grade}: ${s.words}`} data-testid="grade-badge" data-grade={grade}>
      <span className="letter" style={{ background: s.color }}>{grade}</span>
      <span className="meter" aria-hidden="true">
        {[0, 1, 2, 3].map((i) => <i key={i} className={i < s.bars ? 'on' : ''} style={{ height: 5 + i * 3 }} />)}
      </span>
      <span className="sr-only">Grade {grade}, {s.words}</span>
    </span>
  );
}

export function StateBadge({ state }: { state: ReviewState }) {
  const s = STATE_STYLE[state];
  return (
    <span className="state" style={{ color: s.color }} data-testid="state-badge" data-state={state}>
      <span className="glyph" aria-hidden="true">{s.glyph}</span>{s.words}
    </span>
  );
}

export function CriterionVerdict({ pass }: { pass: boolean | null }) {
  const s = pass === true ? CRITERION_STYLE.pass : pass === false ? CRITERION_STYLE.fail : CRITERION_STYLE.unknown;
  return <span className="crit" style={{ color: s.color }}><span aria-hidden="true">{s.glyph}</span>{s.words}</span>;
}

/** A small SVG of a pick's chart marker, so tables and charts share the same shapes. */
export function PickMarker({ kind }: { kind: PickKind }) {
  const s = PICK_STYLE[kind];
  const c = s.color;
  let shape;
  switch (kind) {
    case 'leakOff': shape = <polygon points="6,0 12,6 6,12 0,6" fill={c} />; break;
    case 'breakdown': shape = <polygon points="6,0 12,11 0,11" fill={c} />; break;
    case 'reopening': shape = <polygon points="0,1 12,1 6,12" fill={c} />; break;
    case 'propagation': shape = <rect x="1" y="1" width="10" height="10" fill={c} />; break;
    case 'isip': shape = <circle cx="6" cy="6" r="5.5" fill={c} />; break;
    case 'closure': shape = <path d="M1.5,0 L6,4.5 L10.5,0 L12,1.5 L7.5,6 L12,10.5 L10.5,12 L6,7.5 L1.5,12 L0,10.5 L4.5,6 L0,1.5 Z" fill={c} />; break;
    case 'fitMaximum': shape = <path d="M0,0 L12,0 L6,6 L12,12 L0,12 L6,6 Z" fill={c} />; break;
    case 'extension': shape = <path d="M6,0 L7.4,4.3 L12,4.5 L8.4,7.3 L9.7,12 L6,9.4 L2.3,12 L3.6,7.3 L0,4.5 L4.6,4.3 Z" fill={c} />; break;
  }
  return <svg className="marker" viewBox="0 0 12 12" aria-hidden="true">{shape}</svg>;
}

/** The safety caution every report and export view carries. */
export function SafetyNote() {
  return (
    <p className="safety" role="note" data-testid="safety-note">
      <strong>For review by a qualified engineer.</strong> These results are not a substitute for the operator&apos;s
      well-control policy, and they defer to local regulations and licensed engineering practice.
    </p>
  );
}

/** Marks a test with unresolved team conflicts (two people changed it without seeing each other's change). */
export function ConflictBadge({ count }: { count: number }) {
  if (count <= 0) return null;
  const words = count === 1 ? 'a team conflict to decide' : `${count} team conflicts to decide`;
  return (
    <span className="conflict-badge" title={`This test has ${words} (Team screen).`} data-testid="test-conflict-badge" data-count={count}>
      <span aria-hidden="true">⚠</span> Conflict{count > 1 ? ` ×${count}` : ''}
      <span className="sr-only">: {words}</span>
    </span>
  );
}
