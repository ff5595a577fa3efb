import type { ArchiveEvent } from '../events';
import { canonicalJson } from './canonical';
import { journalKeyOf } from './causality';
import { sha256OfText } from './sha256';
import { validateEventShape } from './validate';

/**
 * One journal file: the events of one user on one device, one canonical JSON event per
 * line, each line ending in "\n". Every event's `prev` is the SHA-256 of the previous
 * line's text (without its newline), so a reader can tell a torn tail (the last write
 * was cut short: skipped, everything before it kept) from a file edited behind the
 * app's back (a line in the middle no longer hashes to what its successor says: flagged,
 * with the line number). Nothing that parses is thrown away: damaged files are reported,
 * and the events that can be read stay in the merge.
 */

export type JournalIssueKind =
  | 'torn-tail'        // the last line is incomplete (a write cut short); skipped
  | 'corrupt-tail'     // the last lines are not events; skipped, everything before kept
  | 'corrupt-line'     // a line in the middle is not an event; skipped, the rest kept
  | 'chain-broken'     // a line does not follow its predecessor: edited, inserted or removed lines
  | 'sequence-gap'     // the journal's numbering skips or repeats
  | 'wrong-journal'    // an event of another user or device inside this file
  | 'missing-newline'; // the last event is whole but the file does not end with a newline

export interface JournalIssue {
  kind: JournalIssueKind;
  /** Journal file name, e.g. "anna@laptop-7.jsonl". */
  file: string;
  /** Line number, from 1. */
  line: number;
  /** Column (from 1) where reading failed, when known. */
  column?: number;
  message: string;
}

/** Where reading of a journal stopped, to carry on when more lines are appended. */
export interface JournalCursor {
  file: string;
  /** Lines consumed so far. */
  line: number;
  /** SHA-256 of the last consumed line ('' at the start). */
  lastHash: string;
  /** `seq` of the last event read (0 at the start). */
  lastSeq: number;
}

export interface JournalReadResult {
  file: string;
  /** Events that could be read, in file order. */
  events: ArchiveEvent[];
  /** SHA-256 of each event's line, parallel to `events`. */
  hashes: string[];
  /** Line number of each event, parallel to `events`. */
  lines: number[];
  issues: JournalIssue[];
  cursor: JournalCursor;
  /** Length (UTF-16 code units) of the text up to and including the last good line's newline. */
  goodLength: number;
}

/**
 * The journal line for an event: canonical JSON, no newline.
 * @throws TypeError when the event holds a non-finite number.
 */
export function serializeEvent(event: ArchiveEvent): string {
  return canonicalJson(event);
}

/** SHA-256 (hex) of an event's journal line: what the next event's `prev` holds. */
export function eventHash(event: ArchiveEvent): string {
  return sha256OfText(serializeEvent(event));
}

/** Percent-encode everything outside [A-Za-z0-9._-] (UTF-8), so names are safe on every file system. */
function encodeNamePart(part: string): string {
  let out = '';
  for (const byte of new TextEncoder().encode(part)) {
    const c = String.fromCharCode(byte);
    out += /[A-Za-z0-9._-]/.test(c) ? c : '%' + byte.toString(16).toUpperCase().padStart(2, '0');
  }
  return out;
}

/**
 * The journal file name of a user on a device: `<user>@<device>.jsonl`, each part
 * percent-encoded so any user name is a valid file name.
 * @example journalFileName('Anna Berg', 'laptop-7') // 'Anna%20Berg@laptop-7.jsonl'
 */
export function journalFileName(author: string, device: string): string {
  return `${encodeNamePart(author)}@${encodeNamePart(device)}.jsonl`;
}

/** The user and device a journal file name stands for, or null when it is not a journal name. */
export function parseJournalFileName(file: string): { author: string; device: string } | null {
  const match = /^([A-Za-z0-9._%-]+)@([A-Za-z0-9._%-]+)\.jsonl$/.exec(file);
  if (!match) return null;
  try {
    return { author: decodeURIComponent(match[1]), device: decodeURIComponent(match[2]) };
  } catch {
    return null;
  }
}

/** A fresh cursor for a journal file. */
export function startCursor(file: string): JournalCursor {
  return { file, line: 0, lastHash: '', lastSeq: 0 };
}

/**
 * Read journal text: parse each line, check the hash chain and the numbering, and
 * report damage as issues (never thrown).
 * @param file the journal's file name (names the issues, and says whose journal it is).
 * @param text the file's text, or the text appended after `cursor`.
 * @param cursor where an earlier read stopped; omit to read from the start.
 * @example readJournal('anna@laptop-7.jsonl', text).events
 */
export function readJournal(file: string, text: string, cursor: JournalCursor = startCursor(file)): JournalReadResult {
  const owner = parseJournalFileName(file);
  const ownerKey = owner ? `${owner.author}@${owner.device}` : null;
  const events: ArchiveEvent[] = [];
  const hashes: string[] = [];
  const lines: number[] = [];
  const issues: JournalIssue[] = [];
  let { line, lastHash, lastSeq } = cursor;
  let goodLength = 0;
  let lastGoodIssueCount = 0;
  let start = 0;
  while (start < text.length) {
    const newline = text.indexOf('\n', start);
    const terminated = newline >= 0;
    const end = terminated ? newline : text.length;
    const raw = text.charCodeAt(end - 1) === 13 ? text.slice(start, end - 1) : text.slice(start, end);
    line++;
    start = end + 1;
    if (raw.trim() === '') { if (terminated) goodLength = start; continue; }
    const parsed = parseLine(raw);
    if ('error' in parsed) {
      issues.push({
        kind: terminated ? 'corrupt-line' : 'torn-tail', file, line, column: parsed.column,
        message: terminated
          ? `${file}, line ${line}: not a readable event (${parsed.error}); skipped`
          : `${file}, line ${line}: the last write was cut short (${parsed.error}); skipped, the ${events.length} event(s) before it are kept`,
      });
      lastHash = sha256OfText(raw);
      continue;
    }
    const event = parsed.event;
    const hash = sha256OfText(raw);
    if (event.prev !== lastHash) {
      issues.push({
        kind: 'chain-broken', file, line,
        message: line === 1 || lastHash === ''
          ? `${file}, line ${line}: the first event names a predecessor that is not in this file; lines were removed or the file was replaced`
          : `${file}, line ${line}: does not follow line ${line - 1}; line ${line - 1} was changed, or lines were inserted or removed, after they were written`,
      });
    }
    if (event.seq !== undefined && event.seq !== lastSeq + 1) {
      issues.push({ kind: 'sequence-gap', file, line, message: `${file}, line ${line}: event number ${event.seq} follows ${lastSeq}; expected ${lastSeq + 1}` });
    }
    if (ownerKey !== null && journalKeyOf(event) !== ownerKey) {
      issues.push({ kind: 'wrong-journal', file, line, message: `${file}, line ${line}: event of ${journalKeyOf(event)} in the journal of ${ownerKey}` });
    }
    if (!terminated) {
      issues.push({ kind: 'missing-newline', file, line, message: `${file}, line ${line}: complete event without a final newline; kept` });
    }
    events.push(event);
    hashes.push(hash);
    lines.push(line);
    lastHash = hash;
    lastSeq = event.seq ?? lastSeq + 1;
    goodLength = terminated ? start : text.length;
    lastGoodIssueCount = issues.length;
  }
  // Unreadable lines after the last good event are a damaged tail, not a damaged middle.
  for (let i = lastGoodIssueCount; i < issues.length; i++) {
    const issue = issues[i];
    if (issue.kind === 'corrupt-line') {
      issue.kind = 'corrupt-tail';
      issue.message = `${file}, line ${issue.line}: unreadable line at the end of the journal; skipped, the ${events.length} event(s) before it are kept`;
    }
  }
  const lastGoodLine = lines.length ? lines[lines.length - 1] : cursor.line;
  const resumeLine = issues.length > lastGoodIssueCount ? lastGoodLine : line;
  return {
    file, events, hashes, lines, issues, goodLength,
    cursor: { file, line: resumeLine, lastHash: events.length ? hashes[hashes.length - 1] : cursor.lastHash, lastSeq },
  };
}

function parseLine(raw: string): { event: ArchiveEvent } | { error: string; column?: number } {
  let value: unknown;
  try {
    value = JSON.parse(raw);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const position = /position (\d+)/.exec(message);
    return { error: 'not valid JSON', column: position ? Number(position[1]) + 1 : undefined };
  }
  const problem = validateEventShape(value);
  if (problem) return { error: problem };
  return { event: value as ArchiveEvent };
}
