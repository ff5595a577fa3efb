/**
 * Line counting of a text body as the delimited-table scanner splits it (an LF, a CRLF
 * or a lone CR ends a line), used to size the column arrays exactly before the scan.
 *
 * Speed: the bytes are read four at a time as 32-bit words. XOR with a repeated LF byte
 * turns each LF into a zero byte; ~(((x & 0x7f7f7f7f) + 0x7f7f7f7f) | x) & 0x80808080 sets
 * the high bit of exactly the zero bytes (no carry crosses a byte), and one multiply adds
 * up those bits. Whether any CR is present is found with the "word has a zero byte" test
 * (x - 0x01010101) & ~x & 0x80808080, which never misses one; only then are the CRs
 * searched and checked one by one, so the count is exact. (Both tricks: Anderson, "Bit Twiddling
 * Hacks", Stanford, "Determine if a word has a zero byte"; Warren, Hacker's Delight,
 * 2nd ed., section 6-1.) On a 30 MB file this is several times faster than one search
 * call per line.
 */

const LF = 10;
const CR = 13;

/**
 * Number of lines from `start` to the end of the bytes: 1 + the line ends found, where a
 * line end is an LF, or a CR not followed by an LF (so CRLF counts once). An empty
 * remainder counts as one line. This is an upper bound on the table rows the scanner can
 * store from `start`.
 *
 * @param bytes ASCII-compatible text (any byte offset into its buffer)
 * @param start first byte to look at (0 <= start <= bytes.length)
 * @returns the number of lines, at least 1
 * @throws nothing
 * @example countTextLines(new TextEncoder().encode('a\r\nb\rc\n'), 0) // 4
 */
export function countTextLines(bytes: Uint8Array, start: number): number {
  const n = bytes.length;
  let lines = 1;
  let i = start;
  // bytes before the first 4-byte-aligned offset, one at a time
  while (i < n && ((bytes.byteOffset + i) & 3) !== 0) {
    lines += lineEndAt(bytes, i, n);
    i++;
  }
  const words = (n - i) >> 2;
  if (words > 0) {
    const view = new Uint32Array(bytes.buffer, bytes.byteOffset + i, words);
    let lfs = 0;
    let crs = 0;
    // literal masks (not module constants) keep the loop free of context loads
    for (let k = 0; k < words; k++) {
      const w = view[k];
      // high bit of each byte set exactly where the byte is an LF; counted by one multiply
      const lf = w ^ 0x0a0a0a0a;
      const lfBytes = ~(((lf & 0x7f7f7f7f) + 0x7f7f7f7f) | lf) & 0x80808080;
      lfs += Math.imul(lfBytes >>> 7, 0x01010101) >>> 24;
      // nonzero when some byte is a CR (never misses one)
      const cr = w ^ 0x0d0d0d0d;
      crs |= (cr - 0x01010101) & ~cr & 0x80808080;
    }
    if (crs !== 0) {
      // CRs in the body: count each not followed by an LF (CRLF counts once, at its LF)
      for (let j = bytes.indexOf(CR, i); j >= 0 && j < i + (words << 2); j = bytes.indexOf(CR, j + 1)) {
        if (!(j + 1 < n && bytes[j + 1] === LF)) lines++;
      }
    }
    lines += lfs;
    i += words << 2;
  }
  for (; i < n; i++) lines += lineEndAt(bytes, i, n);
  return lines;
}

/** 1 when a line ends at byte i (an LF, or a CR not followed by an LF), else 0. */
function lineEndAt(bytes: Uint8Array, i: number, n: number): number {
  const b = bytes[i];
  if (b === LF) return 1;
  if (b === CR) return i + 1 < n && bytes[i + 1] === LF ? 0 : 1;
  return 0;
}
