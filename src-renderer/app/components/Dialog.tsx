import { useEffect, useRef, useState, type ReactNode } from 'react';
import { MINIMUM_REASON_LENGTH } from '../../archive/review-rules';

/** A modal dialog: focus moves in on open, Escape closes, focus returns on close. */
export function Dialog({ title, children, onClose, testId }: { title: string; children: ReactNode; onClose: () => void; testId?: string }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const previous = document.activeElement as HTMLElement | null;
    const first = ref.current?.querySelector<HTMLElement>('textarea, input, select, button');
    first?.focus();
    return () => previous?.focus?.();
  }, []);
  return (
    <div className="dialog-backdrop" onMouseDown={(e) => { if (e.target === e.currentTarget) onClose(); }}>
      <div className="dialog" role="dialog" aria-modal="true" aria-label={title} ref={ref} data-testid={testId}
        onKeyDown={(e) => {
          if (e.key === 'Escape') { e.stopPropagation(); onClose(); }
          if (e.key === 'Tab' && ref.current) {
            const items = [...ref.current.querySelectorAll<HTMLElement>('textarea, input, select, button:not(:disabled)')];
            if (items.length === 0) return;
            const first = items[0];
            const last = items[items.length - 1];
            if (e.shiftKey && document.activeElement === first) { e.preventDefault(); last.focus(); }
            else if (!e.shiftKey && document.activeElement === last) { e.preventDefault(); first.focus(); }
          }
        }}>
        <h2>{title}</h2>
        {children}
      </div>
    </div>
  );
}

/** Asks for a reason (required, at least the archive's minimum length) before an action. */
export function ReasonDialog({ title, explanation, confirmLabel, onConfirm, onClose, danger = false }: {
  title: string; explanation: string; confirmLabel: string; danger?: boolean;
  onConfirm: (reason: string) => Promise<void> | void; onClose: () => void;
}) {
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const ok = reason.trim().length >= MINIMUM_REASON_LENGTH;
  return (
    <Dialog title={title} onClose={onClose} testId="reason-dialog">
      <p>{explanation}</p>
      <label className="field">Reason (required)
        <textarea value={reason} onChange={(e) => setReason(e.target.value)} data-testid="reason-input" />
      </label>
      {!ok && reason.length > 0 && <p className="hint">Please write at least {MINIMUM_REASON_LENGTH} characters.</p>}
      {error && <p className="error-text" role="alert" data-testid="reason-error">{error}</p>}
      <div className="actions">
        <button className="btn" type="button" onClick={onClose}>Cancel</button>
        <button className={`btn ${danger ? 'danger' : 'primary'}`} type="button" disabled={!ok || busy} data-testid="reason-confirm"
          onClick={async () => {
            setBusy(true); setError(null);
            try { await onConfirm(reason.trim()); onClose(); } catch (e) { setError(e instanceof Error ? e.message : String(e)); setBusy(false); }
          }}>{confirmLabel}</button>
      </div>
    </Dialog>
  );
}
