import type { Pick, PickKind } from '../../../src-renderer/engine/result';
import type { ArchiveEvent, ArchiveEventBody } from '../../../src-renderer/archive/events';
import { JournalWriter } from '../../../src-renderer/archive/journal/writer';
import { deriveArchiveState } from '../../../src-renderer/archive/journal/derive';

/**
 * A synthetic team for journal tests: people on devices making events and exchanging
 * everything they hold (as a bundle or a shared folder would). Each event remembers the
 * exact set of events its author held when making it, an oracle for causality that does
 * not use the code under test. Records are invented (Harrow Flats field, Cobalt Ridge
 * Test Services); their truth is set here.
 */

export class Person {
  readonly writer: JournalWriter;
  readonly holds = new Map<string, ArchiveEvent>();
  readonly own: ArchiveEvent[] = [];
  private tick = 0;

  constructor(readonly author: string, readonly device: string, private readonly team: Team) {
    this.writer = new JournalWriter(author, device, {
      now: () => new Date(Date.UTC(2026, 10, 2, 8, 0, 0) + team.nextTime() * 1000 + this.tick++).toISOString(),
    });
  }

  /** Make an event; the oracle records what this person held. */
  make(body: ArchiveEventBody): ArchiveEvent {
    const past = new Set(this.holds.keys());
    const { event } = this.writer.append(body);
    this.team.past.set(event.id, past);
    this.holds.set(event.id, event);
    this.own.push(event);
    this.team.all.push(event);
    return event;
  }

  /** Take in everything `other` holds. */
  receiveFrom(other: Person): void {
    const incoming = [...other.holds.values()].filter((e) => !this.holds.has(e.id));
    for (const e of incoming) this.holds.set(e.id, e);
    this.writer.observe(incoming);
  }

  /** This person's view of the archive. */
  view() {
    return deriveArchiveState([...this.holds.values()]);
  }

  /** Sign off a test with the picks version of this person's own view. */
  signOff(testId: string, grade: 'A' | 'B' | 'C' | 'D' | 'E' = 'B'): ArchiveEvent {
    const version = this.view().tests[testId].picksVersion;
    return this.make({ kind: 'signed-off', testId, grade, picksVersion: version, note: 'picks checked against the record' });
  }
}

export class Team {
  readonly all: ArchiveEvent[] = [];
  /** Oracle: event id -> ids its author held when making it. */
  readonly past = new Map<string, Set<string>>();
  private time = 0;

  nextTime(): number { return this.time++; }

  person(author: string, device: string): Person { return new Person(author, device, this); }

  /** Oracle happened-before. */
  before(a: ArchiveEvent, b: ArchiveEvent): boolean { return this.past.get(b.id)?.has(a.id) ?? false; }
}

export function pickAt(kind: PickKind, pressure: number, time: number, reason = 'set by hand on the chart'): Pick {
  return { kind, pressure, time, method: 'manual', sampleIndex: Math.round(time), manual: true, reason };
}

/** Field, well and tests of the invented Harrow Flats field. */
export function setUpField(p: Person, testIds: string[] = ['t1']): void {
  p.make({ kind: 'field-created', fieldId: 'harrow-flats', name: 'Harrow Flats' });
  p.make({ kind: 'well-created', wellId: 'hf-3', fieldId: 'harrow-flats', name: 'Harrow Flats 3', rigFloorElevation: 25 });
  for (const testId of testIds) {
    p.make({
      kind: 'test-imported', testId, wellId: 'hf-3', type: 'lot', typeInferred: false,
      metadata: { well: 'Harrow Flats 3', field: 'Harrow Flats', contractor: 'Cobalt Ridge Test Services', depthTvd: 1850 as never },
      fileHash: `hash-of-${testId}`, fileName: `hf3-${testId}.csv`, layout: 'cobalt-ridge-v1',
    });
  }
}

export function movePick(p: Person, testId: string, cycle: number, kind: PickKind, pressure: number, reason = 'tangent too late'): ArchiveEvent {
  return p.make({ kind: 'pick-moved', testId, cycle, pickKind: kind, pick: pickAt(kind, pressure, 100 + cycle), reason });
}
