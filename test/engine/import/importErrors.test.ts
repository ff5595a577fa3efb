import { describe, expect, it } from 'vitest';
import { EngineError, type EngineErrorCode } from '../../../src-renderer/engine/errors';
import { parseDelimitedTest } from '../../../src-renderer/engine/import/delimitedImport';
import { importTestFile } from '../../../src-renderer/engine/import/import-test-file';

const bytesOf = (text: string) => new TextEncoder().encode(text);

/** The EngineError thrown by reading `text`, or a failure when none is thrown. */
function errorOf(text: string, options = {}): EngineError {
  try {
    parseDelimitedTest(bytesOf(text), 'hf3.csv', options);
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error('expected an EngineError');
}

const HEADER = 'Time (s),Pressure (psi),Rate (bpm)\n';

// Each case: input, expected code, line, column (1-based; column = field number). The
// limits are the importer's documented plausibility ranges (physicalRanges.ts, common practice).
const CASES: [string, string, EngineErrorCode, number | undefined, number | undefined][] = [
  ['unknown unit in a header', 'Time (s),Pressure (furlongs),Rate (bpm)\n0,1,0\n1,2,1\n', 'unknown-unit', 1, 2],
  ['pressure column without a unit', 'Time (s),Pressure,Rate (bpm)\n0,1,0\n1,2,1\n', 'unknown-unit', 1, 2],
  ['non-numeric cell', `${HEADER}0,100,0\n1,abc,0.5\n2,120,0.5\n`, 'non-numeric-cell', 3, 2],
  ['blank pressure cell', `${HEADER}0,100,0\n1,,0.5\n2,120,0.5\n`, 'non-numeric-cell', 3, 2],
  ['text in an optional column', `${HEADER}0,100,0\n1,110,n/a\n2,120,0.5\n`, 'non-numeric-cell', 3, 3],
  ['time going backwards', `${HEADER}0,100,0\n1,110,0.5\n0.5,120,0.5\n`, 'time-not-increasing', 4, 1],
  ['time going backwards after blank lines', `${HEADER}0,100,0\n\n1,110,0.5\n,,\n\n0.5,120,0.5\n`, 'time-not-increasing', 7, 1],
  ['pressure below -1 bar after a blank line', `Time (s),Pressure (bar),Rate (bpm)\n0,1,0\n\n1,-1.5,1\n`, 'out-of-range', 4, 2],
  ['time repeating', `${HEADER}0,100,0\n1,110,0.5\n1,120,0.5\n`, 'time-not-increasing', 4, 1],
  ['ragged row (too few fields)', `${HEADER}0,100,0\n1,110\n2,120,0.5\n`, 'ragged-row', 3, 3],
  ['ragged row (extra value)', `${HEADER}0,100,0\n1,110,0.5,7\n2,120,0.5\n`, 'ragged-row', 3, 4],
  ['header without data', HEADER, 'empty-table', 1, 1],
  ['empty file', '', 'empty-table', 1, 1],
  ['no pressure column', 'Time (s),Rate (bpm)\n0,0\n1,1\n2,1\n', 'no-pressure-column', 1, undefined],
  ['no time column', 'Pressure (psi),Rate (bpm)\n100,0\n110,1\n120,1\n', 'no-time-column', 1, undefined],
  ['mud density above 3.0 sg', `Mud weight: 3.4 sg\n${HEADER}0,1,0\n1,2,1\n`, 'out-of-range', 1, 1],
  ['mud density below 0.5 sg', `Well: HF-3\nMud density: 300 kg/m3\n${HEADER}0,1,0\n1,2,1\n`, 'out-of-range', 2, 1],
  ['TVD above 15,000 m', `TVD: 52000 ft\n${HEADER}0,1,0\n1,2,1\n`, 'out-of-range', 1, 1],
  ['TVD without a unit', `TVD: 2033\n${HEADER}0,1,0\n1,2,1\n`, 'unknown-unit', 1, 1],
  ['pressure below -1 bar', 'Time (s),Pressure (bar),Rate (bpm)\n0,1,0\n1,-1.5,1\n', 'out-of-range', 3, 2],
  ['unknown gauge position', `Gauge position: halfway\n${HEADER}0,1,0\n1,2,1\n`, 'bad-metadata', 1, 1],
  ['metadata value that is not a number', `System volume: lots of m3\n${HEADER}0,1,0\n1,2,1\n`, 'bad-metadata', 1, 1],
  ['neither rate nor volume', 'Time (s),Pressure (psi)\n0,1\n1,2\n', 'no-rate-or-volume', undefined, undefined],
];

describe('import errors', () => {
  for (const [what, text, code, line, column] of CASES) {
    it(`should refuse ${what} with ${code} at line ${line}, column ${column}`, () => {
      const e = errorOf(text);
      expect(e.code).toBe(code);
      expect(e.location.file).toBe('hf3.csv');
      expect(e.location.line).toBe(line);
      expect(e.location.column).toBe(column);
      expect(e.message.length).toBeGreaterThan(10);
      expect(e.expected, 'says what was expected').toBeTruthy();
    });
  }

  it('should accept a record with neither rate nor volume when the caller allows it', () => {
    const r = parseDelimitedTest(bytesOf('Time (s),Pressure (psi)\n0,1\n1,2\n'), 'dfit.csv', { allowMissingRateAndVolume: true });
    expect(Number.isNaN(r.rate[0]) && Number.isNaN(r.volume[1])).toBe(true);
    expect(r.source.derived).toEqual({ rate: true, volume: true });
  });

  it('should keep negative rates (flowback) with their sign', () => {
    const r = parseDelimitedTest(bytesOf(`${HEADER}0,100,0\n60,110,-1\n120,100,-1\n`), 'fb.csv');
    expect(r.rate[2]).toBeLessThan(0);
    expect(r.volume[2]).toBeLessThan(0);
  });

  it('should refuse legacy workbooks and depth logs through importTestFile', async () => {
    await expect(importTestFile(new Uint8Array([0xd0, 0xcf, 0x11, 0xe0, 0, 0]), 'old.xls')).rejects.toMatchObject({ code: 'unsupported-format' });
    const log = '~V\nVERS. 2.0 :\nWRAP. NO :\n~W\nNULL. -999.25 :\n~C\nDEPT.M : depth\nRHOB.G/C3 : density\n~A\n100 2.1\n101 2.2\n';
    await expect(importTestFile(bytesOf(log), 'hf3-density.las')).rejects.toMatchObject({ code: 'unsupported-format' });
  });
});
