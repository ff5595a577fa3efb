/**
 * The limits typed on the Settings screen, read into SI changes and inline messages.
 * Texts are in each limit's display unit (format/limitDisplay.ts); a text left empty, or
 * equal to what the field already shows, changes nothing.
 */
import { DEFAULT_LIMITS, limitDefinition } from '../../engine/quality/limits';
import type { UnitSystem } from '../../engine/units/unitSystem';
import { formatLimitNumber, parseLimitInput } from '../format/limitDisplay';

export interface LimitDraftResult {
  /** Limit key -> new SI value, for archive.setLimits. */
  changes: Record<string, number>;
  /** Limit key -> why the typed text cannot be taken. */
  errors: Record<string, string>;
}

const MIN_RATIO = 'loading-stiffness.minRatio';
const MAX_RATIO = 'loading-stiffness.maxRatio';

/**
 * Reads the typed limit texts.
 * @param draft limit key -> typed text (display unit of `system`)
 * @param saved the project's limits now (SI), by key
 * @param system unit system the texts were typed in
 * @example limitDraftChanges({'rate-stability.maxCv': '12'}, {}, 'si').changes // {'rate-stability.maxCv': 0.12}
 */
export function limitDraftChanges(draft: Readonly<Record<string, string>>, saved: Readonly<Record<string, number>>, system: UnitSystem): LimitDraftResult {
  const changes: Record<string, number> = {};
  const errors: Record<string, string> = {};
  for (const [key, text] of Object.entries(draft)) {
    const definition = limitDefinition(key);
    if (!definition || text.trim() === '') continue;
    if (saved[key] !== undefined && text.trim() === formatLimitNumber(definition.display, system, saved[key])) continue;
    const read = parseLimitInput(definition.display, system, text);
    if (read.ok) changes[key] = read.valueSI; else errors[key] = read.message;
  }
  // The stiffness band must stay a band: the lowest ratio below the highest.
  if ((MIN_RATIO in changes || MAX_RATIO in changes) && !(MIN_RATIO in errors) && !(MAX_RATIO in errors)) {
    const current = (key: string) => changes[key] ?? saved[key] ?? DEFAULT_LIMITS.find((l) => l.key === key)!.value;
    if (current(MIN_RATIO) >= current(MAX_RATIO)) {
      const key = MAX_RATIO in changes ? MAX_RATIO : MIN_RATIO;
      errors[key] = 'The lowest stiffness ratio must stay below the highest.';
      delete changes[key];
    }
  }
  return { changes, errors };
}
