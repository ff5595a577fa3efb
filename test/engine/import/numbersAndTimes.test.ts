import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseDecimalBytes } from '../../../src-renderer/engine/import/byteNumbers';
import { parseClockTime, parseIsoTimestamp, parseNumberText, unwindMidnight } from '../../../src-renderer/engine/import/cellValues';
import { detectDecimalMark, detectDelimiter, splitLine } from '../../../src-renderer/engine/import/tableLayout';
import { detectEncoding } from '../../../src-renderer/engine/import/textEncoding';

const enc = (s: string) => new TextEncoder().encode(s);
const parseBytes = (s: string, mark = '.') => parseDecimalBytes(enc(s), 0, enc(s).length, mark.charCodeAt(0));

describe('byte number parsing', () => {
  it('should equal Number() (correctly rounded, ECMA-262 StringToNumber) for any decimal text', () => {
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 12 }), (x, digits) => {
      const text = x.toFixed(digits);
      if (/e/.test(text)) return;
      expect(parseBytes(text)).toBe(Number(text));
    }), { numRuns: 2000 });
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
      const text = String(x);
      expect(parseBytes(text)).toBe(Number(text));
    }), { numRuns: 2000 });
  });

  it('should read decimal commas, quotes and spaces, and refuse text', () => {
    expect(parseBytes('2033,5', ',')).toBe(2033.5);
    expect(parseBytes(' "12.25" ')).toBe(12.25);
    expect(parseBytes('-0.5')).toBe(-0.5);
    expect(parseBytes('3.4e-6')).toBe(3.4e-6);
    expect(parseBytes('12abc')).toBeNaN();
    expect(parseBytes('1,5')).toBeNaN(); // comma with a point decimal mark
    expect(parseBytes('1.5', ',')).toBeNaN();
    expect(parseBytes('')).toBeNaN();
    expect(parseBytes('-')).toBeNaN();
  });

  it('should read cell texts with either decimal mark', () => {
    expect(parseNumberText('1,25', ',')).toBe(1.25);
    expect(parseNumberText('abc')).toBeNaN();
  });
});

describe('time texts', () => {
  it('should read ISO 8601 timestamps with and without zone (ISO 8601-1:2019 extended format)', () => {
    expect(parseIsoTimestamp('1970-01-01T00:01:00Z')).toBe(60);
    expect(parseIsoTimestamp('1970-01-01 01:00:00+01:00')).toBe(0);
    expect(parseIsoTimestamp('2026-11-03T14:22:05.25') - parseIsoTimestamp('2026-11-03T14:22:05')).toBeCloseTo(0.25, 9);
    expect(parseIsoTimestamp('2026-13-03T14:22:05')).toBeNaN();
    expect(parseIsoTimestamp('14:22:05')).toBeNaN();
  });

  it('should read clock times and unwind them across midnight', () => {
    expect(parseClockTime('01:00:30')).toBe(3630);
    expect(parseClockTime('23:59:59.5')).toBe(86399.5);
    expect(parseClockTime('25:00:00')).toBeNaN();
    expect(Array.from(unwindMidnight(new Float64Array([86390, 86399, 5, 20])))).toEqual([86390, 86399, 86405, 86420]);
  });
});

describe('table layout detection', () => {
  it('should detect comma, semicolon and tab delimiters from the table body', () => {
    expect(detectDelimiter(['Well: HF-3', 'Time,Pressure', '0,1', '1,2'])).toBe(',');
    expect(detectDelimiter(['Well;HF-3', 'Time;Pressure;Rate', '0,5;1,2;0', '1,0;1,3;0,5'])).toBe(';');
    expect(detectDelimiter(['Time\tPressure', '0,5\t1', '1\t2,5'])).toBe('\t');
  });

  it('should detect the decimal mark and split quoted fields', () => {
    expect(detectDecimalMark([['0,5', '12,3'], ['1', '13']], ';')).toBe(',');
    expect(detectDecimalMark([['0.5', '12.3']], ';')).toBe('.');
    expect(splitLine('a;"b;c";d', ';')).toEqual(['a', 'b;c', 'd']);
  });

  it('should detect encodings from byte-order marks and zero-byte patterns (Unicode 15, 23.8)', () => {
    expect(detectEncoding(new Uint8Array([0xef, 0xbb, 0xbf, 0x41]))).toMatchObject({ encoding: 'utf-8', offset: 3 });
    expect(detectEncoding(new Uint8Array([0xff, 0xfe, 0x41, 0]))).toMatchObject({ encoding: 'utf-16le', offset: 2 });
    expect(detectEncoding(new Uint8Array([0xfe, 0xff, 0, 0x41]))).toMatchObject({ encoding: 'utf-16be', offset: 2 });
    expect(detectEncoding(new Uint8Array([0x41, 0, 0x42, 0, 0x43, 0, 0x44, 0]))).toMatchObject({ encoding: 'utf-16le', offset: 0 });
    expect(detectEncoding(new Uint8Array([0x41, 0xb0, 0x43]))).toMatchObject({ encoding: 'windows-1252' });
  });
});

describe('delimited body fast path', () => {
  it('should read every plain decimal exactly as Number() does (ECMA-262 StringToNumber)', async () => {
    const { parseDelimitedTest } = await import('../../../src-renderer/engine/import/delimitedImport');
    fc.assert(fc.property(fc.array(fc.tuple(fc.double({ min: -1e12, max: 1e12, noNaN: true }), fc.integer({ min: 0, max: 9 })), { minLength: 1, maxLength: 60 }), (cells) => {
      const texts = cells.map(([x, d]) => x.toFixed(d)).filter((t) => !/e/.test(t));
      if (texts.length === 0) return;
      const body = texts.map((t, i) => `${i},1000,${t}`).join('\n');
      const r = parseDelimitedTest(enc(`Time (s),Pressure (Pa),Rate (m3/s)\n${body}\n`), 'p.csv');
      expect(Array.from(r.rate)).toEqual(texts.map(Number));
    }), { numRuns: 300 });
  });
});

describe('delimited body with spaces around values', () => {
  it('should read ", "-separated values and refuse a space inside a number', async () => {
    const { parseDelimitedTest } = await import('../../../src-renderer/engine/import/delimitedImport');
    const r = parseDelimitedTest(enc('Time (s), Pressure (Pa), Rate (m3/s)\n 0, -12.5 , 0\n 1,  7.25,1e-3\n'), 's.csv');
    expect(Array.from(r.pressure)).toEqual([-12.5, 7.25]);
    expect(r.rate[1]).toBe(1e-3);
    expect(() => parseDelimitedTest(enc('Time (s),Pressure (Pa),Rate (m3/s)\n0,1 2,0\n1,2,0\n'), 's.csv')).toThrow(expect.objectContaining({ code: 'non-numeric-cell', location: expect.objectContaining({ line: 2, column: 2 }) }));
    expect(() => parseDelimitedTest(enc('Time (s),Pressure (Pa),Rate (m3/s)\n0,- 2,0\n1,2,0\n'), 's.csv')).toThrow(expect.objectContaining({ code: 'non-numeric-cell' }));
  });
});
