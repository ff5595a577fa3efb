import type { ApplyOutcome, ConflictEventLine, TeamConflict } from '../../archive/api';
import type { ConflictKind } from '../../archive/journal/derived-types';
import { NO_EVENT } from '../../archive/journal/versions';
import { PICK_STYLE } from '../charts/style';
import { eventTime } from './logWords';

/**
 * Plain words of the team screen: bundle file names, what an imported bundle did, and the
 * two sides of a conflict. Pure functions, so they are tested without a browser.
 */

/** Name of an exported team bundle: `<field>-<YYYY-MM-DD>.slbundle`, e.g. "harrow-flats-2026-12-01.slbundle". */
export function bundleFileName(fieldNames: readonly string[], date: Date): string {
  const field = fieldNames.length === 1 ? fieldNames[0] : fieldNames.length === 0 ? 'empty-archive' : 'all-fields';
  const slug = field.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'archive';
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${slug}-${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}.slbundle`;
}

/** One line per part of an ApplyOutcome, for the bundle result panel. */
export interface OutcomeLine { key: 'added' | 'duplicates' | 'conflicts' | 'findings' | 'issues' | 'missing'; text: string; tone: 'ok' | 'warn' | 'bad' | 'plain' }

const plural = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;

/** What taking in a bundle did, in plain words (counts first, then what needs a look). */
export function outcomeLines(outcome: ApplyOutcome): OutcomeLine[] {
  const lines: OutcomeLine[] = [
    { key: 'added', tone: outcome.added > 0 ? 'ok' : 'plain', text: outcome.added > 0 ? `${plural(outcome.added, 'change')} new to this archive taken in.` : 'Nothing new: this archive already holds every change in the bundle.' },
    { key: 'duplicates', tone: 'plain', text: `${plural(outcome.duplicates, 'change')} already held here (left as they were).` },
  ];
  lines.push(outcome.conflicts.length
    ? { key: 'conflicts', tone: 'bad', text: `${plural(outcome.conflicts.length, 'conflict')} to decide: two people changed the same thing without seeing each other's change.` }
    : { key: 'conflicts', tone: 'plain', text: 'No conflicts.' });
  if (outcome.findings.length) lines.push({ key: 'findings', tone: 'warn', text: `${plural(outcome.findings.length, 'finding')}: ${outcome.findings.map((f) => f.message).join(' ')}` });
  lines.push(outcome.issues.length
    ? { key: 'issues', tone: 'warn', text: `${plural(outcome.issues.length, 'journal issue')}: ${outcome.issues.map((i) => issueText(i)).join(' ')}` }
    : { key: 'issues', tone: 'plain', text: 'No journal issues.' });
  lines.push(outcome.missingRawFiles.length
    ? { key: 'missing', tone: 'warn', text: `${plural(outcome.missingRawFiles.length, 'test')} without its raw file here (${outcome.missingRawFiles.map((m) => m.fileName).join(', ')}): shown once the file arrives.` }
    : { key: 'missing', tone: 'plain', text: 'Every raw file is here.' });
  return lines;
}

function issueText(i: ApplyOutcome['issues'][number]): string {
  const where = i.file ? ` (${i.file}${i.line !== undefined ? `, line ${i.line}` : ''}${i.column !== undefined ? `, column ${i.column}` : ''})` : '';
  return `${i.message}${where}.`.replace(/\.\.$/, '.');
}

const KIND_WORDS: Record<ConflictKind, string> = {
  'concurrent-pick-moves': 'Two people set the same pick without seeing each other\'s change.',
  'sign-off-concurrent-change': 'A sign-off and a change to the picks it signs were made without either knowing of the other.',
  'stale-sign-off': 'A sign-off was made on picks this archive cannot confirm (a journal the signer had may be missing here).',
  'concurrent-review-decisions': 'One person signed the test off while another rejected it, neither knowing of the other.',
};

/** The conflict's kind in a sentence. */
export function conflictKindWords(kind: ConflictKind): string {
  return KIND_WORDS[kind] ?? 'Two changes disagree.';
}

/** Short device id as shown ("computer 1a2b3c4d"). */
export function deviceWords(device: string): string {
  return `computer ${device.length > 12 ? device.slice(0, 8) : device}`;
}

/** One side of a conflict: who, on which computer, when, what. */
export function conflictSideWords(line: ConflictEventLine): { who: string; where: string; when: string; what: string } {
  return { who: line.author, where: deviceWords(line.device), when: eventTime(line.time), what: line.summary };
}

/** The choices a conflict decision offers: keep each side, and void where the conflict allows it. */
export function conflictChoices(conflict: TeamConflict): { keep: string; label: string }[] {
  const out = conflict.events.map((e) => ({ keep: e.id, label: `Keep ${e.author}'s change: ${e.summary}` }));
  if (conflict.kind !== 'concurrent-pick-moves') out.push({ keep: NO_EVENT, label: 'Void the sign-off: neither stands, the test stays in review' });
  return out;
}

/**
 * A change summary of the team journal in the screens' words: test ids become the test's
 * well, type and depth (`labelOf`), and pick kinds their names ("the closure pick").
 * @example plainSummary('moved the isip pick of test t1, cycle 1 (late)', () => 'HF-1 LOT') // 'moved the ISIP pick of HF-1 LOT, cycle 1 (late)'
 */
export function plainSummary(summary: string, labelOf: (testId: string) => string | null): string {
  return summary
    .replace(/\b(test) ([A-Za-z0-9_.:#@-]+?)(?=[,;)'\s]|'s|:\s|:$|$)/g, (whole, _word: string, id: string) => labelOf(id) ?? whole)
    .replace(/\bthe (\w+) pick\b/g, (whole, kind: string) => {
      if (kind === 'isip') return 'the ISIP pick';
      const name = (PICK_STYLE as Record<string, { name: string } | undefined>)[kind]?.name;
      return name ? `the ${pickWords(name.replace(/\s*\(.*\)$/, ''))} pick` : whole;
    });
}

/** A pick name inside a sentence: lower case except abbreviations (ISIP). */
function pickWords(name: string): string {
  return name.split(' ').map((w) => (w.length > 1 && w === w.toUpperCase() ? w : w.toLowerCase())).join(' ');
}
