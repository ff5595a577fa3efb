import { useState } from 'react';
import type { TestDetail } from '../../../archive/api';
import { isArchiveError } from '../../../archive/errors';
import { sameUser } from '../../../archive/review-rules';
import { StateBadge } from '../../components/Badges';
import { ReasonDialog } from '../../components/Dialog';
import { useApp } from '../../context';
import { describeEvent, eventTime } from '../../state/logWords';

const STATE_SENTENCE = {
  imported: 'Imported: nobody has been asked to check this test yet.',
  'in-review': 'In review: waiting for a second engineer to sign it off or reject it.',
  accepted: 'Accepted: signed off by a second engineer. Its picks are frozen; changing one reopens the review.',
  rejected: 'Rejected: not used in the stress model.',
} as const;

/** Review state, the four-eyes sign-off, rejection, reopening, comments and the review log. */
export function ReviewPanel({ detail, onChanged }: { detail: TestDetail; onChanged: () => void }) {
  const { archive, user, notify } = useApp();
  const [dialog, setDialog] = useState<'reject' | 'reopen' | null>(null);
  const [message, setMessage] = useState<{ text: string; kind: 'bad' | 'ok' } | null>(null);
  const [comment, setComment] = useState('');
  const [busy, setBusy] = useState(false);
  const s = detail.summary;
  const lastAuthor = s.lastPickAuthor;
  const mine = lastAuthor !== null && sameUser(lastAuthor, user);

  const run = async (work: () => Promise<unknown>, done: string) => {
    setBusy(true); setMessage(null);
    try { await work(); notify(done); setMessage({ text: done, kind: 'ok' }); onChanged(); }
    catch (e) {
      const text = isArchiveError(e) && e.code === 'four-eyes'
        ? `Sign-off refused (four eyes): ${e.message} Ask another engineer to review and sign this test off.`
        : e instanceof Error ? e.message : String(e);
      setMessage({ text, kind: 'bad' });
    } finally { setBusy(false); }
  };

  return (
    <section className="panel stack" aria-labelledby="review-title" data-testid="review-panel">
      <div className="row"><h2 id="review-title" style={{ margin: 0 }}>Review and sign-off</h2><span className="spacer" /><StateBadge state={s.state} /></div>
      <p data-testid="review-state-text">{STATE_SENTENCE[s.state]}</p>
      <p className="hint">
        {lastAuthor ? <>Picks last set by <b>{lastAuthor}</b>{mine ? ' (you): another engineer must sign off.' : '.'}</> : null}
        {s.reviewer ? <> {s.state === 'accepted' ? 'Signed off' : 'Rejected'} by <b>{s.reviewer}</b>.</> : null}
      </p>
      <div className="row">
        {s.state === 'imported' && (
          <button type="button" className="btn" disabled={busy} data-testid="request-review"
            onClick={() => void run(() => archive.requestReview(s.id, user), 'Sent for review.')}>Send for review</button>
        )}
        {s.state === 'in-review' && (
          <button type="button" className="btn primary" disabled={busy} data-testid="sign-off"
            onClick={() => void run(() => archive.signOff(s.id, user), 'Signed off: the test is accepted.')}>Sign off</button>
        )}
        {(s.state === 'imported' || s.state === 'in-review') && (
          <button type="button" className="btn danger" disabled={busy} data-testid="reject" onClick={() => setDialog('reject')}>Reject…</button>
        )}
        {(s.state === 'accepted' || s.state === 'rejected') && (
          <button type="button" className="btn" disabled={busy} data-testid="reopen" onClick={() => setDialog('reopen')}>Reopen…</button>
        )}
      </div>
      {message && <div className={`notice ${message.kind === 'bad' ? 'bad' : ''}`} role={message.kind === 'bad' ? 'alert' : 'status'} data-testid="review-message">{message.text}</div>}

      <form className="stack" onSubmit={(e) => {
        e.preventDefault();
        const text = comment.trim();
        if (text) void run(async () => { await archive.comment(s.id, user, text); setComment(''); }, 'Comment added.');
      }}>
        <label className="field">Comment
          <textarea value={comment} onChange={(e) => setComment(e.target.value)} data-testid="comment-input" style={{ minHeight: 44 }} />
        </label>
        <div className="row"><button type="submit" className="btn small" disabled={busy || !comment.trim()} data-testid="comment-add">Add comment</button></div>
      </form>

      <h3>Review log (who, what, when)</h3>
      <ol className="log" data-testid="review-log">
        {detail.log.map((e) => (
          <li key={e.id} data-kind={e.body.kind}>
            <div><b>{e.author}</b> · <span className="when">{eventTime(e.time)}</span></div>
            <div>{describeEvent(e, detail.log)}</div>
          </li>
        ))}
      </ol>

      {dialog === 'reject' && (
        <ReasonDialog title="Reject this test" danger confirmLabel="Reject"
          explanation="A rejected test is kept in the archive but not used in the stress model. Say why, for the record."
          onConfirm={async (reason) => { await archive.reject(s.id, user, reason); notify('Test rejected.'); onChanged(); }}
          onClose={() => setDialog(null)} />
      )}
      {dialog === 'reopen' && (
        <ReasonDialog title="Reopen the review" confirmLabel="Reopen"
          explanation="The test goes back to review and needs a new sign-off. Say why."
          onConfirm={async (reason) => { await archive.reopen(s.id, user, reason); notify('Review reopened.'); onChanged(); }}
          onClose={() => setDialog(null)} />
      )}
    </section>
  );
}
