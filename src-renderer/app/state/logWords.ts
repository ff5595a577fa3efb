import type { ArchiveEvent } from '../../archive/events';
import { NO_EVENT } from '../../archive/journal/versions';
import { PICK_STYLE } from '../charts/style';

/** What kind of change an event is, in a few plain words ("pick change", "sign-off"). */
export function changeWords(e: ArchiveEvent): string {
  switch (e.body.kind) {
    case 'pick-moved': return 'pick change';
    case 'picks-reset': return 'return to the automatic picks';
    case 'signed-off': return 'sign-off';
    case 'rejected': return 'rejection';
    case 'review-reopened': return 'reopening';
    case 'limits-changed': return 'limits change';
    default: return 'change';
  }
}

/**
 * One review-log event in plain words: what happened (who and when are shown beside it).
 * `log` (the test's other events) lets a conflict decision name the change it kept.
 */
export function describeEvent(e: ArchiveEvent, log: readonly ArchiveEvent[] = []): string {
  const b = e.body;
  switch (b.kind) {
    case 'test-imported': return `Imported from ${b.fileName} as ${b.type.toUpperCase()}${b.typeInferred ? ' (type inferred)' : ''}.`;
    case 'pick-moved': {
      const name = PICK_STYLE[b.pickKind]?.name ?? b.pickKind;
      return b.pick ? `Set the ${name.toLowerCase()} of cycle ${b.cycle} by hand. Reason: ${b.reason}` : `Removed the ${name.toLowerCase()} of cycle ${b.cycle}. Reason: ${b.reason}`;
    }
    case 'picks-reset': return `Returned to the automatic picks. Reason: ${b.reason}`;
    case 'limits-changed': return `Changed quality limits. Reason: ${b.reason}`;
    case 'review-requested': return `Sent for review.${b.note ? ` Note: ${b.note}` : ''}`;
    case 'signed-off': return `Signed off with grade ${b.grade}: accepted.${b.note ? ` Note: ${b.note}` : ''}`;
    case 'rejected': return `Rejected. Reason: ${b.reason}`;
    case 'review-reopened': return `Reopened the review. Reason: ${b.reason}`;
    case 'comment': return `Comment: ${b.text}`;
    case 'test-deleted': return `Deleted. Reason: ${b.reason}`;
    case 'conflict-resolved': {
      if (b.keep === NO_EVENT) return `Decided a team conflict: neither side stands, the sign-off is void and the test stays in review. Reason: ${b.reason}`;
      const kept = log.find((x) => x.id === b.keep);
      const what = kept ? `${kept.author}'s ${changeWords(kept)} of ${eventTime(kept.time)}` : 'one of the two changes';
      return `Decided a team conflict: kept ${what}. Reason: ${b.reason}`;
    }
    default: return 'Changed the archive.';
  }
}

/** Local date and time of an event, e.g. "2026-12-01 19:05". */
export function eventTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
