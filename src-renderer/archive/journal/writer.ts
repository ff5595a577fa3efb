import type { ArchiveEvent, ArchiveEventBody } from '../events';
import { journalKeyOf } from './causality';
import { serializeEvent } from './journal-file';
import { sha256OfText } from './sha256';

/**
 * Makes this user's events on this device: fills the envelope (id, Lamport clock, hash
 * of the predecessor, position in the journal, and the vector of what this device has
 * seen of every other journal) and gives back the exact journal line to write.
 *
 * The archive keeps one writer per signed-in user and calls `observe` with every event
 * it merges from the team folder or a bundle, so the next local event records that it
 * saw them (that is what lets the merge tell "changed after seeing" from "changed at the
 * same time").
 */

export interface WriterHead {
  /** `seq` of the last event of this journal (0 for none). */
  seq: number;
  /** SHA-256 of the last line ('' for none). */
  lastHash: string;
  /** Highest Lamport clock seen anywhere. */
  clock: number;
  /** Highest `seq` seen of every other journal. */
  seen: Record<string, number>;
}

export interface WrittenEvent {
  event: ArchiveEvent;
  /** The journal line (no newline). */
  line: string;
  /** SHA-256 of `line`. */
  hash: string;
}

export class JournalWriter {
  readonly author: string;
  readonly device: string;
  readonly journal: string;
  private head: WriterHead;
  private readonly now: () => string;

  /**
   * @param author user name, as chosen at start.
   * @param device device id, stable per installation.
   * @param options.now clock for the `time` field (ISO 8601 UTC); defaults to the system clock.
   */
  constructor(author: string, device: string, options: { now?: () => string } = {}) {
    if (!author || !device) throw new TypeError('JournalWriter needs a user name and a device id');
    this.author = author;
    this.device = device;
    this.journal = `${author}@${device}`;
    this.head = { seq: 0, lastHash: '', clock: 0, seen: {} };
    this.now = options.now ?? (() => new Date().toISOString());
  }

  /**
   * Take in events already in the archive (own ones from an earlier run and everyone
   * else's): own events move the head of the chain, others move the seen vector and clock.
   * Events may come in any order and more than once.
   */
  observe(events: Iterable<ArchiveEvent>): void {
    for (const event of events) {
      if (event.clock > this.head.clock) this.head.clock = event.clock;
      const key = journalKeyOf(event);
      if (key === this.journal) {
        const seq = event.seq ?? 0;
        if (seq > this.head.seq) {
          this.head.seq = seq;
          this.head.lastHash = sha256OfText(serializeEvent(event));
        }
      } else if (event.seq !== undefined && event.seq > (this.head.seen[key] ?? 0)) {
        this.head.seen[key] = event.seq;
      }
      // What that event had seen, this device has now seen too (transitively).
      if (event.seen) {
        for (const [k, n] of Object.entries(event.seen)) {
          if (k !== this.journal && n > (this.head.seen[k] ?? 0)) this.head.seen[k] = n;
        }
      }
    }
  }

  /** The writer's position: last seq, last hash, clock and seen vector (a copy). */
  position(): WriterHead {
    return { ...this.head, seen: { ...this.head.seen } };
  }

  /**
   * Make the next event of this journal.
   * @throws TypeError when the body holds a non-finite number (it could not be journalled).
   * @example writer.append({ kind: 'comment', testId: 't1', text: 'closure looks early' })
   */
  append(body: ArchiveEventBody): WrittenEvent {
    const seq = this.head.seq + 1;
    const seen: Record<string, number> = {};
    for (const key of Object.keys(this.head.seen).sort()) seen[key] = this.head.seen[key];
    const event: ArchiveEvent = {
      id: `${this.journal}#${seq}`,
      author: this.author,
      device: this.device,
      time: this.now(),
      clock: this.head.clock + 1,
      prev: this.head.lastHash,
      seq,
      seen,
      body,
    };
    const line = serializeEvent(event);
    const hash = sha256OfText(line);
    this.head.seq = seq;
    this.head.lastHash = hash;
    this.head.clock = event.clock;
    return { event, line, hash };
  }
}
