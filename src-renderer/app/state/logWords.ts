import type { ArchiveEvent } from '../../archive/events';
import { PICK_STYLE } from '../charts/style';

/** One review-log event in plain words: what happened (who and when are shown beside it). */
export function describeEvent(e: ArchiveEvent): string {
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
