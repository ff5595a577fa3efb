import type { ArchiveEvent } from '../events';
import { compareEventOrder, journalKeyOf } from './causality';

/** What is waiting to sync, and who changed what and when, in plain words. */

export interface ChangeLine { eventId: string; author: string; device: string; time: string; kind: string; summary: string }

export interface PersonActivity { author: string; devices: string[]; events: number; lastTime: string; lastSummary: string }

export interface SyncStatus {
  /** This user's journal: `author@device`. */
  journal: string;
  /** Own events not yet written to the team folder (or not yet in any exported bundle). */
  waiting: ChangeLine[];
  /** Highest own `seq` known to be in the folder. */
  writtenSeq: number;
  /** Highest own `seq` made on this device. */
  localSeq: number;
  /** null when no team folder is set. */
  folderReachable: boolean | null;
  people: PersonActivity[];
  /** Latest changes by anyone, newest first. */
  recent: ChangeLine[];
}

/**
 * One event in plain words, e.g. "moved the closure pick of test t1, cycle 2 (tangent too late)".
 * @example describeEvent(event) // 'signed off test t1 with grade B'
 */
export function describeEvent(event: ArchiveEvent): string {
  const b = event.body;
  switch (b.kind) {
    case 'field-created': return `created field ${b.name}`;
    case 'well-created': return `created well ${b.name}`;
    case 'survey-set': return `set the survey of well ${b.wellId} (${b.stations.length} stations)`;
    case 'test-imported': return `imported ${b.fileName} as test ${b.testId} (${b.type.toUpperCase()})`;
    case 'pick-moved': return b.pick ? `moved the ${b.pickKind} pick of test ${b.testId}, cycle ${b.cycle} (${b.reason})` : `removed the ${b.pickKind} pick of test ${b.testId}, cycle ${b.cycle} (${b.reason})`;
    case 'picks-reset': return `reset the picks of test ${b.testId} to automatic (${b.reason})`;
    case 'limits-changed': return `changed ${b.scope === 'project' ? 'the project' : `test ${b.scope.testId}'s`} limits: ${Object.keys(b.limits).join(', ')} (${b.reason})`;
    case 'review-requested': return `asked for a review of test ${b.testId}`;
    case 'signed-off': return `signed off test ${b.testId} with grade ${b.grade}`;
    case 'rejected': return `rejected test ${b.testId} (${b.reason})`;
    case 'review-reopened': return `reopened the review of test ${b.testId} (${b.reason})`;
    case 'comment': return `commented on test ${b.testId}: ${b.text.length > 80 ? b.text.slice(0, 77) + '...' : b.text}`;
    case 'test-deleted': return `deleted test ${b.testId} (${b.reason})`;
    case 'conflict-resolved': return `decided a conflict on test ${b.testId} (${b.reason})`;
  }
}

function line(e: ArchiveEvent): ChangeLine {
  return { eventId: e.id, author: e.author, device: e.device, time: e.time, kind: e.body.kind, summary: describeEvent(e) };
}

/**
 * The sync status of this user on this device.
 * @param options.journal own `author@device`.
 * @param options.events every event the archive holds (own and others').
 * @param options.writtenSeq highest own seq the team folder holds (TeamFolder reports it).
 * @param options.folderReachable whether the folder is reachable now; null with no folder.
 * @param options.recentLimit how many recent changes to list (default 50).
 * @example syncStatus({ journal: 'anna@laptop-7', events, writtenSeq: 40, folderReachable: false }).waiting.length
 */
export function syncStatus(options: { journal: string; events: readonly ArchiveEvent[]; writtenSeq: number; folderReachable: boolean | null; recentLimit?: number }): SyncStatus {
  const ordered = [...options.events].sort(compareEventOrder);
  const own = ordered.filter((e) => journalKeyOf(e) === options.journal);
  const people = new Map<string, PersonActivity>();
  for (const e of ordered) {
    const p = people.get(e.author) ?? { author: e.author, devices: [], events: 0, lastTime: e.time, lastSummary: '' };
    p.events++;
    if (!p.devices.includes(e.device)) p.devices.push(e.device);
    p.lastTime = e.time;
    p.lastSummary = describeEvent(e);
    people.set(e.author, p);
  }
  const limit = options.recentLimit ?? 50;
  return {
    journal: options.journal,
    waiting: own.filter((e) => (e.seq ?? 0) > options.writtenSeq).map(line),
    writtenSeq: options.writtenSeq,
    localSeq: own.reduce((m, e) => Math.max(m, e.seq ?? 0), 0),
    folderReachable: options.folderReachable,
    people: [...people.values()].sort((a, b) => (a.author < b.author ? -1 : 1)),
    recent: ordered.slice(-limit).reverse().map(line),
  };
}
