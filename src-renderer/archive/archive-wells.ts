import type { FieldRow, WellRow } from './api';
import { writeTransaction, type ArchiveContext } from './archive-context';
import { appendEvent } from './archive-events';
import { nameKey } from './db';
import { ArchiveError } from './errors';
import { sha256OfText } from './journal/sha256';
import { normaliseUserName } from './review-rules';

/**
 * Fields and wells: ids made from names (alike on every machine), found or created on
 * import, listed, and a well's directional survey.
 */

/** Field id from the name: every machine that creates a field of this name gives it the same id. */
export function fieldIdOf(name: string): string {
  return `field-${sha256OfText(nameKey(name)).slice(0, 24)}`;
}

/** Well id from its field and name, alike on every machine. */
export function wellIdOf(fieldId: string, name: string): string {
  return `well-${sha256OfText(`${fieldId}\n${nameKey(name)}`).slice(0, 24)}`;
}

/** The well as the service shows it (its lookup key left out). */
export function stripWell(row: WellRow & { nameKey?: string }): WellRow {
  const { nameKey: _key, ...well } = row;
  return well;
}

/** The id of the field of this name (any case and spacing), created and logged when new. Inside a write transaction. */
export async function findOrCreateField(context: ArchiveContext, name: string, user: string): Promise<string> {
  const { db } = context;
  const key = nameKey(name);
  const found = await db.fields.where('nameKey').equals(key).first();
  if (found) return found.id;
  const id = fieldIdOf(name);
  await db.fields.add({ id, name, nameKey: key });
  await appendEvent(context, user, { kind: 'field-created', fieldId: id, name });
  return id;
}

/** The well of this name in the field, created and logged when new. Inside a write transaction. */
export async function findOrCreateWell(context: ArchiveContext, fieldId: string, name: string, user: string): Promise<WellRow> {
  const { db } = context;
  const key = nameKey(name);
  const found = await db.wells.where('[fieldId+nameKey]').equals([fieldId, key]).first();
  if (found) return stripWell(found);
  const well = { id: wellIdOf(fieldId, name), fieldId, name, nameKey: key };
  await db.wells.add(well);
  await appendEvent(context, user, { kind: 'well-created', wellId: well.id, fieldId, name });
  return stripWell(well);
}

/** Every field, by name. */
export async function listFields(context: ArchiveContext): Promise<FieldRow[]> {
  const rows = await context.db.fields.toArray();
  return rows.map(({ id, name }) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));
}

/** The wells of a field (or all), by name. */
export async function listWells(context: ArchiveContext, fieldId?: string): Promise<WellRow[]> {
  const { db } = context;
  const rows = fieldId ? await db.wells.where('fieldId').equals(fieldId).toArray() : await db.wells.toArray();
  return rows.map(stripWell).sort((a, b) => a.name.localeCompare(b.name));
}

/** Replace a well's directional survey (MD m, inclination 0-180 and azimuth 0-360 degrees), logged. */
export async function setWellSurvey(
  context: ArchiveContext, wellId: string, stations: { md: number; inc: number; azi: number }[], user: string, sourceFile?: string,
): Promise<WellRow> {
  const author = normaliseUserName(user);
  if (!Array.isArray(stations) || stations.some((s) => ![s.md, s.inc, s.azi].every(Number.isFinite) || s.inc < 0 || s.inc > 180 || s.azi < 0 || s.azi >= 360)) {
    throw new ArchiveError('bad-argument', 'Survey stations need finite MD (m), inclination 0-180 and azimuth 0-360 degrees.');
  }
  for (let i = 1; i < stations.length; i++) {
    if (!(stations[i].md > stations[i - 1].md)) throw new ArchiveError('bad-argument', `Survey station ${i + 1}: measured depth must increase.`);
  }
  return writeTransaction(context, async () => {
    const well = await context.db.wells.get(wellId);
    if (!well) throw new ArchiveError('not-found', `No well with id ${wellId}.`);
    const copy = stations.map(({ md, inc, azi }) => ({ md, inc, azi }));
    await context.db.wells.update(wellId, { survey: copy });
    await appendEvent(context, author, { kind: 'survey-set', wellId, stations: copy, sourceFile });
    return stripWell({ ...well, survey: copy });
  });
}
