import { PICK_KINDS } from '../../engine/result';
import { GRADES } from '../../engine/result';
import { TEST_TYPES } from '../../engine/record';

/**
 * The shape check every event passes when read from a journal or a bundle. Hand-written
 * rather than a schema library because it runs on every line of every journal (hundreds
 * of thousands of lines per merge) and must stay cheap.
 */

type FieldCheck = 'string' | 'number' | 'boolean' | 'object' | 'string?' | 'number?' | 'object?' | 'pick?' | 'scope' | 'pickKind' | 'grade' | 'testType' | 'stations';

const BODY_FIELDS: Record<string, Record<string, FieldCheck>> = {
  'field-created': { fieldId: 'string', name: 'string' },
  'well-created': { wellId: 'string', fieldId: 'string', name: 'string', location: 'string?', rigFloorElevation: 'number?', waterDepth: 'number?' },
  'survey-set': { wellId: 'string', stations: 'stations', sourceFile: 'string?' },
  'test-imported': {
    testId: 'string', wellId: 'string', type: 'testType', typeInferred: 'boolean', metadata: 'object',
    fileHash: 'string', fileName: 'string', layout: 'string', parseOptions: 'object?',
  },
  'pick-moved': { testId: 'string', cycle: 'number', pickKind: 'pickKind', pick: 'pick?', reason: 'string' },
  'picks-reset': { testId: 'string', reason: 'string' },
  'limits-changed': { scope: 'scope', limits: 'object', reason: 'string' },
  'review-requested': { testId: 'string', note: 'string?' },
  'signed-off': { testId: 'string', note: 'string?', grade: 'grade', picksVersion: 'string' },
  'rejected': { testId: 'string', reason: 'string' },
  'review-reopened': { testId: 'string', reason: 'string' },
  'comment': { testId: 'string', text: 'string' },
  'test-deleted': { testId: 'string', reason: 'string' },
  'conflict-resolved': { conflictId: 'string', testId: 'string', keep: 'string', reason: 'string' },
};

/** The event body kinds a journal may hold. */
export const EVENT_KINDS: readonly string[] = Object.keys(BODY_FIELDS);

const FIELD_LISTS = new Map<string, [string, FieldCheck][]>(Object.entries(BODY_FIELDS).map(([k, v]) => [k, Object.entries(v)]));

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function checkField(check: FieldCheck, v: unknown): boolean {
  switch (check) {
    case 'string': return typeof v === 'string';
    case 'number': return typeof v === 'number' && Number.isFinite(v);
    case 'boolean': return typeof v === 'boolean';
    case 'object': return isObject(v);
    case 'string?': return v === undefined || typeof v === 'string';
    case 'number?': return v === undefined || (typeof v === 'number' && Number.isFinite(v));
    case 'object?': return v === undefined || isObject(v);
    case 'pick?': return v === null || (isObject(v) && typeof v.kind === 'string' && typeof v.pressure === 'number' && typeof v.time === 'number');
    case 'scope': return v === 'project' || (isObject(v) && typeof v.testId === 'string');
    case 'pickKind': return typeof v === 'string' && (PICK_KINDS as readonly string[]).includes(v);
    case 'grade': return typeof v === 'string' && (GRADES as readonly string[]).includes(v);
    case 'testType': return typeof v === 'string' && (TEST_TYPES as readonly string[]).includes(v);
    case 'stations': return Array.isArray(v) && v.every((s) => isObject(s) && typeof s.md === 'number' && typeof s.inc === 'number' && typeof s.azi === 'number');
  }
}

/**
 * Why `value` is not an archive event, or null when it is one.
 * @example validateEventShape(JSON.parse(line)) // null, or 'body.testId: expected string'
 */
export function validateEventShape(value: unknown): string | null {
  if (!isObject(value)) return 'expected an object';
  for (const key of ['id', 'author', 'device', 'time', 'prev'] as const) {
    if (typeof value[key] !== 'string') return `${key}: expected a string`;
  }
  if (typeof value.clock !== 'number' || !Number.isInteger(value.clock) || value.clock < 0) return 'clock: expected a whole number';
  if (value.seq !== undefined && (typeof value.seq !== 'number' || !Number.isInteger(value.seq) || value.seq < 1)) return 'seq: expected a whole number from 1';
  if (value.seen !== undefined) {
    if (!isObject(value.seen)) return 'seen: expected an object';
    for (const [k, n] of Object.entries(value.seen)) {
      if (typeof n !== 'number' || !Number.isInteger(n) || n < 0) return `seen.${k}: expected a whole number`;
    }
  }
  const body = value.body;
  if (!isObject(body)) return 'body: expected an object';
  const fields = typeof body.kind === 'string' ? FIELD_LISTS.get(body.kind) : undefined;
  if (!fields) return `body.kind: expected one of ${EVENT_KINDS.join(', ')}`;
  for (const [name, check] of fields) {
    if (!checkField(check, body[name])) return `body.${name}: expected ${check.replace('?', ' or nothing')}`;
  }
  if (body.kind === 'limits-changed') {
    for (const [k, n] of Object.entries(body.limits as Record<string, unknown>)) {
      if (typeof n !== 'number' || !Number.isFinite(n)) return `body.limits.${k}: expected a number`;
    }
  }
  return null;
}
