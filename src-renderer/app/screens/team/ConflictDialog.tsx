import { useState } from 'react';
import type { TeamConflict } from '../../../archive/api';
import { NO_EVENT } from '../../../archive/journal/versions';
import { MINIMUM_REASON_LENGTH } from '../../../archive/review-rules';
import { Dialog } from '../../components/Dialog';
import { conflictChoices, conflictKindWords, conflictSideWords } from '../../state/teamWords';

/**
 * The decision on one team conflict: keep one side (or void a sign-off, where the conflict
 * allows it), with a reason. The decision goes into the review log like any other change.
 */
export function ConflictDialog({ conflict, testLabel, plain, onDecide, onClose }: {
  conflict: TeamConflict;
  testLabel: string;
  /** Puts a journal summary in the screen's words (test names instead of ids). */
  plain: (summary: string) => string;
  onDecide: (keep: string, reason: string) => Promise<void>;
  onClose: () => void;
}) {
  const [keep, setKeep] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const choices = conflictChoices(conflict);
  const ok = keep !== null && reason.trim().length >= MINIMUM_REASON_LENGTH;
  return (
    <Dialog title={`Decide the conflict on ${testLabel}`} onClose={onClose} testId="conflict-dialog">
      <p>{conflictKindWords(conflict.kind)} Nothing was chosen for you: both changes are kept in the history until you decide.</p>
      <p className="hint">{plain(conflict.message)}</p>
      <div className="stack" role="radiogroup" aria-label="Which side stands">
        {conflict.events.map((e) => {
          const w = conflictSideWords(e);
          return (
            <button key={e.id} type="button" role="radio" aria-checked={keep === e.id} className={`choice${keep === e.id ? ' chosen' : ''}`}
              data-testid={`conflict-keep-${e.id}`} onClick={() => setKeep(e.id)}>
              <b>Keep {w.who}&apos;s change</b>
              <span className="hint"> · {w.where} · {w.when}</span>
              <div>{plain(w.what)}</div>
            </button>
          );
        })}
        {choices.some((c) => c.keep === NO_EVENT) && (
          <button type="button" role="radio" aria-checked={keep === NO_EVENT} className={`choice${keep === NO_EVENT ? ' chosen' : ''}`}
            data-testid="conflict-void" onClick={() => setKeep(NO_EVENT)}>
            <b>Void the sign-off</b>
            <div>Neither side stands: the sign-off no longer counts and the test stays in review for a new sign-off.</div>
          </button>
        )}
      </div>
      <label className="field">Reason (required)
        <textarea value={reason} onChange={(e) => setReason(e.target.value)} data-testid="conflict-reason" />
      </label>
      {!ok && reason.length > 0 && reason.trim().length < MINIMUM_REASON_LENGTH && <p className="hint">Please write at least {MINIMUM_REASON_LENGTH} characters.</p>}
      {error && <p className="error-text" role="alert" data-testid="conflict-error">{error}</p>}
      <div className="actions">
        <button className="btn" type="button" onClick={onClose}>Cancel</button>
        <button className="btn primary" type="button" disabled={!ok || busy} data-testid="conflict-resolve"
          onClick={async () => {
            if (keep === null) return;
            setBusy(true); setError(null);
            try { await onDecide(keep, reason.trim()); onClose(); } catch (e) { setError(e instanceof Error ? e.message : String(e)); setBusy(false); }
          }}>Record the decision</button>
      </div>
    </Dialog>
  );
}
