import { describe, expect, it } from 'vitest';
import { countTextLines } from '../../../src-renderer/engine/import/lineCount';
import { scanDelimitedBody } from '../../../src-renderer/engine/import/delimitedBody';
import { seededRandom } from '../../../src-renderer/engine/synthetic/random';

const encode = (text: string): Uint8Array => new TextEncoder().encode(text);

/** Line count by the plain definition: split on CRLF, CR or LF (RFC 4180 section 2 uses CRLF; LF is the POSIX line end; a lone CR is the classic Mac OS line end, common practice). */
function linesBySplitting(text: string): number {
  return text.split(/\r\n|\r|\n/).length;
}

/** Deterministic uniform numbers from the engine's seeded generator (mulberry32). */
function uniformSource(seed: number): () => number {
  const random = seededRandom(seed);
  return () => random.uniform();
}

describe('countTextLines', () => {
  it('should count LF, CRLF and lone CR line ends as the splitting definition does', () => {
    // hand-counted: "a" / "b" / "c" / "" (RFC 4180 CRLF, POSIX LF, lone CR)
    expect(countTextLines(encode('a\r\nb\rc\n'), 0)).toBe(4);
    expect(countTextLines(encode(''), 0)).toBe(1);
    expect(countTextLines(encode('\r\n\r\n'), 0)).toBe(3);
    expect(countTextLines(encode('x\r'), 0)).toBe(2);
    expect(countTextLines(encode('one line'), 0)).toBe(1);
  });

  it('should agree with splitting on random text at every start offset and buffer alignment', () => {
    const uniform = uniformSource(20261201);
    const alphabet = ['\n', '\r', '\r\n', '0', '1', ',', ' ', '.', '\u00e9'];
    for (let trial = 0; trial < 300; trial++) {
      const parts: string[] = [];
      const length = Math.floor(uniform() * 60);
      for (let i = 0; i < length; i++) parts.push(alphabet[Math.floor(uniform() * alphabet.length)]);
      const bytes = encode(parts.join(''));
      // copy at an odd offset into a larger buffer, so the word reads start unaligned
      const shift = Math.floor(uniform() * 4);
      const holder = new Uint8Array(bytes.length + 8);
      holder.set(bytes, shift);
      const view = holder.subarray(shift, shift + bytes.length);
      const start = Math.floor(uniform() * (bytes.length + 1));
      const expected = linesBySplitting(new TextDecoder().decode(bytes.subarray(start)));
      expect(countTextLines(view, start)).toBe(expected);
    }
  });

  it('should count a long LF file exactly (one line end per row, synthetic)', () => {
    const rows = 100_003;
    const text = Array.from({ length: rows }, (_, i) => `${i},${(i * 0.25).toFixed(2)}`).join('\n') + '\n';
    expect(countTextLines(encode(text), 0)).toBe(rows + 1);
    expect(countTextLines(encode(text.replace(/\n/g, '\r\n')), 0)).toBe(rows + 1);
  });
});

describe('scanDelimitedBody fast number path', () => {
  it('should read plain and unusual cells to the same values as Number() of the text', () => {
    // Number() is the ECMAScript StringToNumber reference (ECMA-262 section 7.1.4.1.1)
    const cells = ['12.5', '-0.25', '7', '0.1', '-3.', '.5', ' 42 ', '1e3', '"8.5"', '123456789012345', '1234567890123456', '-0'];
    const text = cells.map((c, i) => `${i},${c}`).join('\n') + '\n';
    const body = scanDelimitedBody(encode(text), 0, 1, 44, 46, 2, [
      { field: 0, kind: 'number', required: true, expected: 'time in s' },
      { field: 1, kind: 'number', required: true, expected: 'pressure in kPa' },
    ], 'cells.csv');
    expect(body.rows).toBe(cells.length);
    cells.forEach((c, i) => expect(Object.is(body.values[1][i], Number(c.trim().replace(/"/g, '')))).toBe(true));
  });

  it('should read decimal-comma cells with a semicolon delimiter, and stop at a delimiter', () => {
    // decimal comma: ISO 80000-1 allows comma or point as the decimal sign
    const body = scanDelimitedBody(encode('0;12,5;3\r\n1;-0,75;4\r\n'), 0, 1, 59, 44, 3, [
      { field: 0, kind: 'number', required: true, expected: 'time in s' },
      { field: 1, kind: 'number', required: true, expected: 'pressure in bar' },
    ], 'comma.csv');
    expect(Array.from(body.values[1])).toEqual([12.5, -0.75]);
  });

  it('should still reject a malformed number at its line and column', () => {
    const bytes = encode('0,1.5\n1,1.5.3\n');
    expect(() => scanDelimitedBody(bytes, 0, 1, 44, 46, 2, [
      { field: 0, kind: 'number', required: true, expected: 'time in s' },
      { field: 1, kind: 'number', required: true, expected: 'pressure in kPa' },
    ], 'bad.csv')).toThrow(expect.objectContaining({ code: 'non-numeric-cell', location: expect.objectContaining({ line: 2, column: 2 }) }));
  });
});
