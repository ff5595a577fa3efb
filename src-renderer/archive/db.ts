import Dexie, { type Table, type Transaction } from 'dexie';
import type { ArchiveEvent } from './events';
import type { FieldRow, SavedMapping, TestSummary, WellRow } from './api';
import type { RecordSource, TestMetadata } from '../engine/record';
import type { Pick, PickKind, QualityResult } from '../engine/result';
import type { UnitSystem } from '../engine/units/unitSystem';

/**
 * The archive's IndexedDB schema (Dexie). `version(n)` blocks are append-only: never
 * edit a published block; add a new one, with data changes in its `upgrade()`, and a
 * test that seeds the previous version and opens this one (test/archive/schema-upgrade).
 *
 * Samples are stored one row per test as typed arrays, unindexed.
 */

export const DEFAULT_DATABASE_NAME = 'stress-ledger';

/** Schema of version 1 (published; do not edit). */
export const SCHEMA_V1 = {
  fields: 'id, &nameKey',
  wells: 'id, fieldId, [fieldId+nameKey]',
  tests: 'id, fieldId, wellId, type, grade, state, depthTvd, wellName, fileHash, importedAt',
  samples: 'testId',
  rawFiles: 'hash',
  picks: '++seq, testId',
  grades: 'testId, grade',
  events: 'id, clock, testId, [testId+clock], [journal+clock]',
  users: 'name',
  mappings: 'layout',
} as const;

/**
 * Version 2 (published; do not edit): adds the settings table (unit system and project
 * limits, which version 1 kept on each user row as `unitSystem`), and a lower-case well
 * name index for case-insensitive prefix search.
 */
export const SCHEMA_V2 = {
  ...SCHEMA_V1,
  tests: 'id, fieldId, wellId, type, grade, state, depthTvd, wellName, wellNameKey, fileHash, importedAt',
  settings: 'key',
} as const;

/**
 * Version 3 (team journals): adds the journals table, one row per journal (`author@device`)
 * held locally: how far it goes and where its chain ends. New events take their `seq`,
 * `prev` and `seen` from it.
 */
export const SCHEMA_V3 = {
  ...SCHEMA_V2,
  journals: 'key',
} as const;

export const CURRENT_SCHEMA_VERSION = 3;

export interface StoredField extends FieldRow { nameKey: string }
export interface StoredWell extends WellRow { nameKey: string }

/** The record's source description without the sample arrays. */
export type StoredSource = RecordSource;

/** A test row: the list summary (indexed parts above) plus metadata and source. */
export interface StoredTest extends TestSummary {
  metadata: TestMetadata;
  source: StoredSource;
  /** Lower-case well name (version 2). */
  wellNameKey: string;
  /** Limits of this test overriding the project's (from the team log; absent when none). */
  limits?: Record<string, number>;
}

export interface StoredSamples {
  testId: string;
  time: Float64Array;
  pressure: Float64Array;
  rate: Float64Array;
  volume: Float64Array;
}

export interface StoredRawFile {
  hash: string;
  bytes: Uint8Array;
  size: number;
  fileName: string;
  storedAt: string;
}

/** One manual pick change (history kept); kind 'reset' marks "all manual picks dropped". */
export interface StoredPick {
  seq?: number;
  testId: string;
  cycle: number;
  kind: PickKind | 'reset';
  pick: Pick | null;
  reason: string;
  author: string;
  time: string;
  eventId: string;
}

export interface StoredGrade {
  testId: string;
  grade: QualityResult['grade'];
  quality: QualityResult;
  /** Canonical JSON of the limits the grade was computed with. */
  limitsKey: string;
  computedAt: string;
}

/** A review-log event as stored: the event plus derived keys for lookups and its own hash. */
export interface StoredEvent extends ArchiveEvent {
  /** body.testId, or '' for events about no test. */
  testId: string;
  /** author + '@' + device: the journal this event belongs to. */
  journal: string;
  /** SHA-256 (hex) of the canonical JSON of the event (envelope and body). */
  hash: string;
}

export interface StoredUser {
  name: string;
  createdAt: string;
  /** Version 1 only: the user's unit preference, moved to settings by version 2. */
  unitSystem?: UnitSystem;
}

export type StoredMapping = SavedMapping;

export interface StoredSetting { key: string; value: unknown }

/** One journal held locally (version 3): what `seen` and the next own event are made from. */
export interface StoredJournal {
  /** `author@device`. */
  key: string;
  author: string;
  device: string;
  /** Highest `seq` up to which every event of the journal is held (no gap before it). */
  seq: number;
  /** Highest `seq` held (equal to `seq` unless events are missing in between). */
  lastSeq: number;
  /** Stored hash of the event at `lastSeq` (the next own event's `prev`). */
  lastHash: string;
  /** Highest Lamport clock in the journal. */
  clock: number;
  /** Number of events held. */
  events: number;
}

export class StressLedgerDb extends Dexie {
  declare fields: Table<StoredField, string>;
  declare wells: Table<StoredWell, string>;
  declare tests: Table<StoredTest, string>;
  declare samples: Table<StoredSamples, string>;
  declare rawFiles: Table<StoredRawFile, string>;
  declare picks: Table<StoredPick, number>;
  declare grades: Table<StoredGrade, string>;
  declare events: Table<StoredEvent, string>;
  declare users: Table<StoredUser, string>;
  declare mappings: Table<StoredMapping, string>;
  declare settings: Table<StoredSetting, string>;
  declare journals: Table<StoredJournal, string>;

  constructor(name: string = DEFAULT_DATABASE_NAME, options?: ConstructorParameters<typeof Dexie>[1]) {
    super(name, options);
    this.version(1).stores(SCHEMA_V1);
    this.version(2).stores(SCHEMA_V2).upgrade(upgradeToVersion2);
    this.version(3).stores(SCHEMA_V3).upgrade(upgradeToVersion3);
  }
}

/** Every table name, in the order backups write them. */
export const TABLE_NAMES = [
  'fields', 'wells', 'tests', 'samples', 'rawFiles', 'picks', 'grades', 'events', 'users', 'mappings', 'settings', 'journals',
] as const;
export type TableName = (typeof TABLE_NAMES)[number];

/**
 * Version 1 -> 2: the unit system moves from the user rows to one project setting (the
 * choice most users had; ties go to the earliest user), the device id is kept as a setting
 * (taken from the existing log so the journal continues), and every test gets its
 * lower-case well name.
 */
export async function upgradeToVersion2(tx: Transaction): Promise<void> {
  const users = (await tx.table('users').toArray()) as StoredUser[];
  const votes = new Map<UnitSystem, { count: number; first: string }>();
  for (const user of users) {
    if (!user.unitSystem) continue;
    const vote = votes.get(user.unitSystem) ?? { count: 0, first: user.createdAt };
    vote.count += 1;
    if (user.createdAt < vote.first) vote.first = user.createdAt;
    votes.set(user.unitSystem, vote);
  }
  let unitSystem: UnitSystem = 'si';
  let best: { count: number; first: string } | null = null;
  for (const [system, vote] of votes) {
    if (!best || vote.count > best.count || (vote.count === best.count && vote.first < best.first)) {
      best = vote;
      unitSystem = system;
    }
  }
  const settings = tx.table('settings');
  await settings.put({ key: 'unitSystem', value: unitSystem });
  await settings.put({ key: 'limits', value: {} });
  const lastEvent = (await tx.table('events').orderBy('clock').last()) as StoredEvent | undefined;
  if (lastEvent) await settings.put({ key: 'device', value: lastEvent.device });
  await tx.table('users').toCollection().modify((user: StoredUser) => { delete user.unitSystem; });
  await tx.table('tests').toCollection().modify((test: StoredTest) => { test.wellNameKey = nameKey(test.wellName); });
}

/**
 * Version 2 -> 3: one journals row per `author@device` found in the log. Events made
 * before journals had numbers (no `seq`) count by their place in the journal's clock
 * order, as the archive numbered them.
 */
export async function upgradeToVersion3(tx: Transaction): Promise<void> {
  const byJournal = new Map<string, StoredEvent[]>();
  await tx.table('events').each((row: StoredEvent) => {
    const list = byJournal.get(row.journal);
    if (list) list.push(row); else byJournal.set(row.journal, [row]);
  });
  const table = tx.table('journals');
  for (const rows of byJournal.values()) await table.put(journalRowOf(rows));
}

/** The journals row of one journal's events (any order). */
export function journalRowOf(rows: readonly StoredEvent[]): StoredJournal {
  const ordered = [...rows].sort((a, b) => a.clock - b.clock || (a.seq ?? 0) - (b.seq ?? 0));
  const numbered = ordered.map((row, i) => ({ row, seq: row.seq ?? i + 1 }));
  const seqs = new Set(numbered.map((n) => n.seq));
  let contiguous = 0;
  while (seqs.has(contiguous + 1)) contiguous += 1;
  let last = numbered[0];
  for (const n of numbered) if (n.seq >= last.seq) last = n;
  const first = ordered[0];
  return {
    key: first.journal, author: first.author, device: first.device,
    seq: contiguous, lastSeq: last.seq, lastHash: last.row.hash,
    clock: ordered[ordered.length - 1].clock, events: rows.length,
  };
}

/** The key names are matched by: trimmed, inner spaces collapsed, lower case. */
export function nameKey(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLocaleLowerCase();
}
