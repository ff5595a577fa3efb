/**
 * The import boundary's option check, loading the zod schema (importOptions.ts) only when
 * there is something to check. Most imports pass no options at all (the command line
 * never does); an empty options object is valid under the schema (every field is
 * optional and unknown fields pass through), so the schema library need not be loaded,
 * parsed and initialised for it, which is a measurable part of the command line's
 * start-up. Any option given is checked by the same zod schema as before.
 */
import type { ImportOptions } from './importOptions';

/** The fields the schema checks; when all of them read undefined the schema accepts the object. */
const CHECKED_FIELDS = ['columns', 'testType', 'metadata', 'gaugePosition', 'allowMissingRateAndVolume', 'sheet'] as const;

/**
 * Whether the schema of importOptions.ts accepts these options without looking further:
 * undefined or null (read as {}), or a non-array object none of whose checked fields is
 * set (inherited fields included, as the schema reads them).
 *
 * @param options the options as received
 * @returns true when no field needs checking
 * @throws nothing
 * @example importOptionsNeedNoCheck({}) // true
 */
export function importOptionsNeedNoCheck(options: unknown): boolean {
  if (options === undefined || options === null) return true;
  if (typeof options !== 'object' || Array.isArray(options)) return false;
  const fields = options as Record<string, unknown>;
  for (const key of CHECKED_FIELDS) if (fields[key] !== undefined) return false;
  return true;
}

/**
 * Checks import options at the import boundary: options that set nothing pass at once;
 * any other options go through the zod schema (validateImportOptions, loaded on demand).
 *
 * @param options the options as received
 * @param fileName for the error
 * @returns the same options, typed
 * @throws EngineError 'bad-argument' naming the first wrong option path (see validateImportOptions)
 * @example await checkImportOptions({ testType: 'lot' }, 'a.csv')
 */
export async function checkImportOptions(options: unknown, fileName: string): Promise<ImportOptions> {
  if (importOptionsNeedNoCheck(options)) return (options ?? {}) as ImportOptions;
  const { validateImportOptions } = await import('./importOptions');
  return validateImportOptions(options, fileName);
}
