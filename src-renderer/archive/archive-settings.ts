import type { ArchiveSettings, SavedMapping, UserRow } from './api';
import { nowIso, notifyListeners, writeTransaction, type ArchiveContext } from './archive-context';
import { appendEvent } from './archive-events';
import { ArchiveError } from './errors';
import { normaliseUserName, requireReason } from './review-rules';
import { UNIT_SYSTEMS, type UnitSystem } from '../engine/units/unitSystem';

/**
 * Users, saved column mappings and project settings (quality limits, unit system).
 * Only a change of the project limits is a review-log event.
 */

export async function listUsers(context: ArchiveContext): Promise<UserRow[]> {
  const rows = await context.db.users.toArray();
  return rows.map(({ name, createdAt }) => ({ name, createdAt })).sort((a, b) => a.name.localeCompare(b.name));
}

/** Add a user (name normalised); an existing user of that name is returned as it is. */
export async function addUser(context: ArchiveContext, name: string): Promise<UserRow> {
  const { db } = context;
  const clean = normaliseUserName(name);
  const result = await db.transaction('rw', db.users, async () => {
    const existing = await db.users.get(clean);
    if (existing) return { name: existing.name, createdAt: existing.createdAt };
    const row = { name: clean, createdAt: nowIso(context) };
    await db.users.add(row);
    return row;
  });
  notifyListeners(context);
  return result;
}

/** Remember a confirmed column mapping under its layout signature (replacing an earlier one). */
export async function saveMapping(context: ArchiveContext, mapping: Omit<SavedMapping, 'savedAt'>): Promise<SavedMapping> {
  if (!mapping.layout || !Array.isArray(mapping.columns)) throw new ArchiveError('bad-argument', 'A mapping needs a layout signature and its columns.');
  const row: SavedMapping = { ...mapping, savedBy: normaliseUserName(mapping.savedBy), savedAt: nowIso(context) };
  await context.db.mappings.put(row);
  notifyListeners(context);
  return row;
}

export async function getMapping(context: ArchiveContext, layout: string): Promise<SavedMapping | null> {
  return (await context.db.mappings.get(layout)) ?? null;
}

/** The project settings (no limits and SI units when none were set). */
export async function getSettings(context: ArchiveContext): Promise<ArchiveSettings> {
  const { db } = context;
  const [limits, unitSystem] = await Promise.all([db.settings.get('limits'), db.settings.get('unitSystem')]);
  return {
    limits: (limits?.value as Record<string, number> | undefined) ?? {},
    unitSystem: (unitSystem?.value as UnitSystem | undefined) ?? 'si',
  };
}

/** Replace the project limits, logged with the reason. */
export async function setLimits(context: ArchiveContext, limits: Record<string, number>, user: string, reason: string): Promise<ArchiveSettings> {
  const author = normaliseUserName(user);
  const why = requireReason(reason, 'change the project limits');
  for (const [key, value] of Object.entries(limits)) {
    if (!key || !Number.isFinite(value)) throw new ArchiveError('bad-argument', `Limit "${key}" must be a finite number.`);
  }
  const copy = { ...limits };
  await writeTransaction(context, async () => {
    await context.db.settings.put({ key: 'limits', value: copy });
    await appendEvent(context, author, { kind: 'limits-changed', scope: 'project', limits: copy, reason: why });
  });
  return getSettings(context);
}

export async function setUnitSystem(context: ArchiveContext, unitSystem: UnitSystem): Promise<ArchiveSettings> {
  if (!UNIT_SYSTEMS.includes(unitSystem)) throw new ArchiveError('bad-argument', `Unknown unit system "${unitSystem}".`);
  await context.db.settings.put({ key: 'unitSystem', value: unitSystem });
  notifyListeners(context);
  return getSettings(context);
}
