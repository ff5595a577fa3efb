import { describe, expect, it } from 'vitest';
import { checkImportOptions, importOptionsNeedNoCheck } from '../../../src-renderer/engine/import/importOptionsCheck';
import { validateImportOptions } from '../../../src-renderer/engine/import/importOptions';

// The reference is the zod schema of importOptions.ts itself: the quick check may only
// skip it where the schema accepts the options anyway.
describe('importOptionsNeedNoCheck', () => {
  it('should skip the schema only for options that set nothing', () => {
    expect(importOptionsNeedNoCheck(undefined)).toBe(true);
    expect(importOptionsNeedNoCheck(null)).toBe(true);
    expect(importOptionsNeedNoCheck({})).toBe(true);
    expect(importOptionsNeedNoCheck({ testType: undefined, somethingElse: 3 })).toBe(true);
    expect(importOptionsNeedNoCheck({ testType: 'lot' })).toBe(false);
    expect(importOptionsNeedNoCheck([])).toBe(false);
    expect(importOptionsNeedNoCheck('lot')).toBe(false);
    expect(importOptionsNeedNoCheck(Object.create({ sheet: 7 }))).toBe(false);
  });

  it('should skip only options the zod schema accepts', () => {
    for (const options of [undefined, null, {}, { testType: undefined, somethingElse: 3 }]) {
      expect(importOptionsNeedNoCheck(options)).toBe(true);
      expect(() => validateImportOptions(options, 'a.csv')).not.toThrow();
    }
  });
});

describe('checkImportOptions', () => {
  it('should refuse invalid options with the same error as the schema', async () => {
    const bad = { testType: 'mini' };
    let direct: unknown;
    try { validateImportOptions(bad, 'a.csv'); } catch (e) { direct = e; }
    await expect(checkImportOptions(bad, 'a.csv')).rejects.toMatchObject({ code: 'bad-argument', message: (direct as Error).message });
    await expect(checkImportOptions({ columns: [{ index: -1, role: 'time' }] }, 'a.csv')).rejects.toMatchObject({ code: 'bad-argument' });
  });

  it('should return valid options unchanged', async () => {
    const good = { testType: 'lot' as const, allowMissingRateAndVolume: true };
    expect(await checkImportOptions(good, 'a.csv')).toBe(good);
    expect(await checkImportOptions(undefined, 'a.csv')).toEqual({});
  });
});
