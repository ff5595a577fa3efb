/**
 * SHA-256 (FIPS 180-4, section 6.2), synchronous, in plain TypeScript.
 *
 * Why not `crypto.subtle.digest`: it is asynchronous and costs a round trip per call.
 * Reading a team journal hashes every line to check the chain (hundreds of thousands of
 * short inputs), and a synchronous hash keeps the journal reader, the merge and the
 * picks-version computation plain functions that return values, so they run the same in
 * the renderer, a Web Worker and Node. `sha256HexAsync` uses `crypto.subtle` for large
 * inputs (raw files) when it exists, and falls back to this implementation.
 *
 * Checked against the FIPS 180-2 / NIST example vectors in test/archive/journal/sha256.test.ts.
 */

const ROUND_CONSTANTS = new Int32Array([
  0x428a2f98, 0x71374491, 0xb5c0fbcf, 0xe9b5dba5, 0x3956c25b, 0x59f111f1, 0x923f82a4, 0xab1c5ed5,
  0xd807aa98, 0x12835b01, 0x243185be, 0x550c7dc3, 0x72be5d74, 0x80deb1fe, 0x9bdc06a7, 0xc19bf174,
  0xe49b69c1, 0xefbe4786, 0x0fc19dc6, 0x240ca1cc, 0x2de92c6f, 0x4a7484aa, 0x5cb0a9dc, 0x76f988da,
  0x983e5152, 0xa831c66d, 0xb00327c8, 0xbf597fc7, 0xc6e00bf3, 0xd5a79147, 0x06ca6351, 0x14292967,
  0x27b70a85, 0x2e1b2138, 0x4d2c6dfc, 0x53380d13, 0x650a7354, 0x766a0abb, 0x81c2c92e, 0x92722c85,
  0xa2bfe8a1, 0xa81a664b, 0xc24b8b70, 0xc76c51a3, 0xd192e819, 0xd6990624, 0xf40e3585, 0x106aa070,
  0x19a4c116, 0x1e376c08, 0x2748774c, 0x34b0bcb5, 0x391c0cb3, 0x4ed8aa4a, 0x5b9cca4f, 0x682e6ff3,
  0x748f82ee, 0x78a5636f, 0x84c87814, 0x8cc70208, 0x90befffa, 0xa4506ceb, 0xbef9a3f7, 0xc67178f2,
]);

const INITIAL_HASH = [0x6a09e667, 0xbb67ae85, 0x3c6ef372, 0xa54ff53a, 0x510e527f, 0x9b05688c, 0x1f83d9ab, 0x5be0cd19];

const schedule = new Int32Array(64);
const state = new Int32Array(8);
// Int32Array rather than Uint32Array: words above 2^31 then stay small integers in the
// JavaScript engine instead of becoming doubles (about 20 % faster here).
const HEX = Array.from({ length: 256 }, (_, i) => i.toString(16).padStart(2, '0'));
const encoder = new TextEncoder();
let scratch = new Uint8Array(4096);
const tailOne = new Uint8Array(64);
const tailTwo = new Uint8Array(128);

/** Process the 64-byte blocks of `data` from `offset` to `end` into `state`. */
function compressBlocks(data: Uint8Array, offset: number, end: number): void {
  const w = schedule;
  const k = ROUND_CONSTANTS;
  let h0 = state[0], h1 = state[1], h2 = state[2], h3 = state[3];
  let h4 = state[4], h5 = state[5], h6 = state[6], h7 = state[7];
  for (let p = offset; p < end; p += 64) {
    for (let i = 0; i < 16; i++) {
      const j = p + i * 4;
      w[i] = (data[j] << 24) | (data[j + 1] << 16) | (data[j + 2] << 8) | data[j + 3];
    }
    for (let i = 16; i < 64; i++) {
      const x = w[i - 15];
      const y = w[i - 2];
      const s0 = ((x >>> 7) | (x << 25)) ^ ((x >>> 18) | (x << 14)) ^ (x >>> 3);
      const s1 = ((y >>> 17) | (y << 15)) ^ ((y >>> 19) | (y << 13)) ^ (y >>> 10);
      w[i] = (w[i - 16] + s0 + w[i - 7] + s1) | 0;
    }
    let a = h0, b = h1, c = h2, d = h3, e = h4, f = h5, g = h6, h = h7;
    for (let i = 0; i < 64; i++) {
      const S1 = ((e >>> 6) | (e << 26)) ^ ((e >>> 11) | (e << 21)) ^ ((e >>> 25) | (e << 7));
      const ch = (e & f) ^ (~e & g);
      const t1 = (h + S1 + ch + k[i] + w[i]) | 0;
      const S0 = ((a >>> 2) | (a << 30)) ^ ((a >>> 13) | (a << 19)) ^ ((a >>> 22) | (a << 10));
      const maj = (a & b) ^ (a & c) ^ (b & c);
      const t2 = (S0 + maj) | 0;
      h = g; g = f; f = e; e = (d + t1) | 0;
      d = c; c = b; b = a; a = (t1 + t2) | 0;
    }
    h0 = (h0 + a) | 0; h1 = (h1 + b) | 0; h2 = (h2 + c) | 0; h3 = (h3 + d) | 0;
    h4 = (h4 + e) | 0; h5 = (h5 + f) | 0; h6 = (h6 + g) | 0; h7 = (h7 + h) | 0;
  }
  state[0] = h0; state[1] = h1; state[2] = h2; state[3] = h3;
  state[4] = h4; state[5] = h5; state[6] = h6; state[7] = h7;
}

/**
 * SHA-256 of `bytes`, as 64 lower-case hex digits (FIPS 180-4 section 6.2).
 * @param bytes any length.
 * @example sha256Hex(new TextEncoder().encode('abc')) // 'ba7816bf...f20015ad'
 */
export function sha256Hex(bytes: Uint8Array): string {
  state.set(INITIAL_HASH);
  const length = bytes.length;
  const whole = length - (length % 64);
  compressBlocks(bytes, 0, whole);
  // Padding (section 5.1.1): 0x80, zeros, then the bit length as a 64-bit big-endian number.
  const rest = length - whole;
  const tail = rest < 56 ? tailOne : tailTwo;
  tail.fill(0);
  tail.set(bytes.subarray(whole));
  tail[rest] = 0x80;
  const bitsHigh = Math.floor(length / 0x20000000);
  const bitsLow = (length * 8) >>> 0;
  const n = tail.length;
  tail[n - 8] = bitsHigh >>> 24; tail[n - 7] = bitsHigh >>> 16; tail[n - 6] = bitsHigh >>> 8; tail[n - 5] = bitsHigh;
  tail[n - 4] = bitsLow >>> 24; tail[n - 3] = bitsLow >>> 16; tail[n - 2] = bitsLow >>> 8; tail[n - 1] = bitsLow;
  compressBlocks(tail, 0, n);
  let out = '';
  for (let i = 0; i < 8; i++) {
    const v = state[i];
    out += HEX[v >>> 24] + HEX[(v >>> 16) & 255] + HEX[(v >>> 8) & 255] + HEX[v & 255];
  }
  return out;
}

/**
 * SHA-256 of the UTF-8 bytes of `text`, as hex.
 * @example sha256OfText('abc') // 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'
 */
export function sha256OfText(text: string): string {
  // UTF-8 takes at most 3 bytes per UTF-16 code unit.
  if (scratch.length < text.length * 3) scratch = new Uint8Array(Math.max(text.length * 3, scratch.length * 2));
  const { written } = encoder.encodeInto(text, scratch);
  return sha256Hex(scratch.subarray(0, written));
}

/**
 * SHA-256 of `bytes` as hex, with `crypto.subtle` when the platform has it (faster for
 * large raw files), else the synchronous implementation. Same result either way.
 * @example await sha256HexAsync(bytes)
 */
export async function sha256HexAsync(bytes: Uint8Array): Promise<string> {
  const subtle = globalThis.crypto?.subtle;
  if (!subtle) return sha256Hex(bytes);
  const copy = new Uint8Array(bytes.length);
  copy.set(bytes);
  const digest = new Uint8Array(await subtle.digest('SHA-256', copy.buffer));
  let out = '';
  for (let i = 0; i < digest.length; i++) out += HEX[digest[i]];
  return out;
}
