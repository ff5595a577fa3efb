import { EngineError } from '../../engine/errors';
import type { ArchiveEvent } from '../events';
import { base64Decode, base64Encode } from './base64';
import { journalKeyOf } from './causality';
import { journalFileName, parseJournalFileName, serializeEvent } from './journal-file';
import { readJournalSet, type JournalSetRead } from './merge';
import { sha256Hex } from './sha256';

/**
 * A team bundle: every journal and raw file one machine knows, in one file, for teams
 * without a shared folder. Layout (self-describing, readable in a text editor):
 *
 *     STRESS-LEDGER-TEAM-BUNDLE/1 sha256=<64 hex> bytes=<n>\n
 *     <n bytes of UTF-8 JSON: { format, version, createdAt, createdBy, notice, journals: [{file, text}], raw: [{hash, size, base64}] }>
 *
 * The SHA-256 covers the JSON bytes exactly; every raw file is also checked against
 * its own hash, and every journal against its hash chain on import. A bundle that fails
 * the checksum or the structure check is refused whole with an EngineError('bad-bundle').
 */

export const BUNDLE_MAGIC = 'STRESS-LEDGER-TEAM-BUNDLE/1';
export const BUNDLE_NOTICE =
  'Stress Ledger team bundle. Results are for review by a qualified engineer; they are not a substitute for the operator\'s well-control policy and defer to local regulations and licensed practice.';

export interface RawFile { hash: string; bytes: Uint8Array }
export interface JournalText { file: string; text: string }

export interface BundleContents {
  createdAt: string;
  createdBy: string;
  notice: string;
  journals: JournalText[];
  raw: RawFile[];
}

export interface ImportedBundle extends BundleContents {
  /** The journals read and merged: events in the total order, with any damage reported. */
  read: JournalSetRead;
}

/**
 * Journal texts for a set of events: one file per user and device, events in journal
 * order, exactly the lines the owner wrote (serialization is canonical).
 * @example journalTextsFromEvents(archiveEvents)[0].file // 'anna@laptop-7.jsonl'
 */
export function journalTextsFromEvents(events: readonly ArchiveEvent[]): JournalText[] {
  const groups = new Map<string, ArchiveEvent[]>();
  const seenIds = new Set<string>();
  for (const e of events) {
    if (seenIds.has(e.id)) continue;
    seenIds.add(e.id);
    const key = journalKeyOf(e);
    const list = groups.get(key);
    if (list) list.push(e); else groups.set(key, [e]);
  }
  const out: JournalText[] = [];
  for (const list of groups.values()) {
    list.sort((a, b) => (a.seq ?? 0) - (b.seq ?? 0) || a.clock - b.clock);
    out.push({ file: journalFileName(list[0].author, list[0].device), text: list.map((e) => serializeEvent(e) + '\n').join('') });
  }
  return out.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
}

/**
 * Pack journals and raw files into a bundle.
 * @param contents.journals journal files (see journalTextsFromEvents).
 * @param contents.raw raw test files by their SHA-256.
 * @throws EngineError 'bad-bundle' when a raw file does not match its hash (the local copy is damaged).
 * @example exportBundle({ journals, raw, createdBy: 'Anna', createdAt: new Date().toISOString() })
 */
export function exportBundle(contents: { journals: JournalText[]; raw: RawFile[]; createdBy: string; createdAt: string }): Uint8Array {
  const raw = [...contents.raw].sort((a, b) => (a.hash < b.hash ? -1 : a.hash > b.hash ? 1 : 0));
  for (const r of raw) {
    if (sha256Hex(r.bytes) !== r.hash) throw new EngineError('bad-bundle', `raw file ${r.hash} does not match its hash; the local copy is damaged`, { file: r.hash });
  }
  const payload = JSON.stringify({
    format: 'stress-ledger-team-bundle', version: 1,
    createdAt: contents.createdAt, createdBy: contents.createdBy, notice: BUNDLE_NOTICE,
    journals: contents.journals.map((j) => ({ file: j.file, text: j.text })),
    raw: raw.map((r) => ({ hash: r.hash, size: r.bytes.length, base64: base64Encode(r.bytes) })),
  });
  const body = new TextEncoder().encode(payload);
  const header = new TextEncoder().encode(`${BUNDLE_MAGIC} sha256=${sha256Hex(body)} bytes=${body.length}\n`);
  const out = new Uint8Array(header.length + body.length);
  out.set(header);
  out.set(body, header.length);
  return out;
}

/**
 * Unpack and check a bundle: header, length, checksum, structure, every raw file's hash;
 * then read its journals (hash chains checked; damage reported in `read.issues`).
 * @param bytes the bundle file.
 * @param fileName its name, for error messages.
 * @throws EngineError 'bad-bundle' naming what is wrong, with line 1 and the column for header faults.
 * @example importBundle(bytes, 'harrow-flats.slbundle').read.events
 */
export function importBundle(bytes: Uint8Array, fileName: string): ImportedBundle {
  const fail = (message: string, expected?: string, column?: number): never => {
    throw new EngineError('bad-bundle', `${message}; the bundle was not imported`, { file: fileName, line: 1, column }, expected);
  };
  let newline = -1;
  for (let i = 0; i < Math.min(bytes.length, 256); i++) if (bytes[i] === 10) { newline = i; break; }
  if (newline < 0) fail('not a Stress Ledger team bundle (no header line)', `a first line starting "${BUNDLE_MAGIC}"`, 1);
  const header = new TextDecoder().decode(bytes.subarray(0, newline));
  if (!header.startsWith(BUNDLE_MAGIC)) {
    if (header.startsWith('STRESS-LEDGER-TEAM-BUNDLE/')) fail(`bundle format ${header.split(' ')[0]} is newer than this version of the app reads`, BUNDLE_MAGIC, 1);
    fail('not a Stress Ledger team bundle', `a first line starting "${BUNDLE_MAGIC}"`, 1);
  }
  const match = / sha256=([0-9a-f]{64}) bytes=(\d+)$/.exec(header);
  if (!match) fail('the header line is damaged', '"sha256=<64 hex digits> bytes=<length>"', BUNDLE_MAGIC.length + 1);
  const body = bytes.subarray(newline + 1);
  const declared = Number(match![2]);
  if (body.length !== declared) fail(`the bundle is ${body.length < declared ? 'cut short' : 'longer than written'}: ${body.length} bytes of content, the header says ${declared}`, `${declared} bytes`);
  if (sha256Hex(body) !== match![1]) fail('the checksum does not match: the bundle was damaged in transfer or changed after export', `SHA-256 ${match![1]}`);
  let payload: unknown;
  try {
    payload = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(body));
  } catch {
    fail('the content is not readable JSON although its checksum matches (written by a faulty exporter)', 'UTF-8 JSON');
  }
  const p = payload as Record<string, unknown>;
  if (typeof p !== 'object' || p === null || p.format !== 'stress-ledger-team-bundle' || p.version !== 1) fail('the content is not a version 1 team bundle', 'format "stress-ledger-team-bundle", version 1');
  if (!Array.isArray(p.journals) || !Array.isArray(p.raw)) fail('the content lacks its journals or raw files', 'arrays "journals" and "raw"');
  const journals: JournalText[] = [];
  for (const [i, j] of (p.journals as unknown[]).entries()) {
    const jj = j as Record<string, unknown>;
    if (typeof jj?.file !== 'string' || typeof jj.text !== 'string' || !parseJournalFileName(jj.file)) fail(`journal ${i + 1} is malformed`, 'a journal file name "<user>@<device>.jsonl" and its text');
    journals.push({ file: jj.file as string, text: jj.text as string });
  }
  const raw: RawFile[] = [];
  for (const [i, r] of (p.raw as unknown[]).entries()) {
    const rr = r as Record<string, unknown>;
    const decoded = typeof rr?.base64 === 'string' ? base64Decode(rr.base64) : null;
    if (typeof rr?.hash !== 'string' || !decoded || decoded.length !== rr.size) fail(`raw file ${i + 1} is malformed`, 'a hash, a size and base64 content');
    if (sha256Hex(decoded!) !== rr.hash) fail(`raw file ${rr.hash as string} does not match its hash`, 'content whose SHA-256 is its name');
    raw.push({ hash: rr.hash as string, bytes: decoded! });
  }
  return {
    createdAt: String(p.createdAt ?? ''), createdBy: String(p.createdBy ?? ''), notice: String(p.notice ?? BUNDLE_NOTICE),
    journals, raw, read: readJournalSet(journals),
  };
}
