/** Base64 (RFC 4648 section 4, with padding) for bundle payloads, in plain TypeScript. */

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
const LOOKUP = new Int16Array(128).fill(-1);
for (let i = 0; i < ALPHABET.length; i++) LOOKUP[ALPHABET.charCodeAt(i)] = i;

/**
 * Base64 text of `bytes` (RFC 4648).
 * @example base64Encode(new TextEncoder().encode('foobar')) // 'Zm9vYmFy'
 */
export function base64Encode(bytes: Uint8Array): string {
  const parts: string[] = [];
  let chunk = '';
  const full = bytes.length - (bytes.length % 3);
  for (let i = 0; i < full; i += 3) {
    const n = (bytes[i] << 16) | (bytes[i + 1] << 8) | bytes[i + 2];
    chunk += ALPHABET[n >>> 18] + ALPHABET[(n >>> 12) & 63] + ALPHABET[(n >>> 6) & 63] + ALPHABET[n & 63];
    if (chunk.length >= 65536) { parts.push(chunk); chunk = ''; }
  }
  const rest = bytes.length - full;
  if (rest === 1) {
    const n = bytes[full] << 16;
    chunk += ALPHABET[n >>> 18] + ALPHABET[(n >>> 12) & 63] + '==';
  } else if (rest === 2) {
    const n = (bytes[full] << 16) | (bytes[full + 1] << 8);
    chunk += ALPHABET[n >>> 18] + ALPHABET[(n >>> 12) & 63] + ALPHABET[(n >>> 6) & 63] + '=';
  }
  parts.push(chunk);
  return parts.join('');
}

/**
 * Bytes of base64 `text` (RFC 4648), or null when the text is not valid padded base64.
 * @example base64Decode('Zm9vYmFy') // bytes of 'foobar'
 */
export function base64Decode(text: string): Uint8Array | null {
  if (text.length % 4 !== 0) return null;
  let padding = 0;
  if (text.endsWith('==')) padding = 2;
  else if (text.endsWith('=')) padding = 1;
  const out = new Uint8Array((text.length / 4) * 3 - padding);
  let o = 0;
  for (let i = 0; i < text.length; i += 4) {
    const last = i + 4 === text.length;
    const a = decodeChar(text, i);
    const b = decodeChar(text, i + 1);
    const c = last && padding === 2 ? 0 : decodeChar(text, i + 2);
    const d = last && padding >= 1 ? 0 : decodeChar(text, i + 3);
    if (a < 0 || b < 0 || c < 0 || d < 0) return null;
    const n = (a << 18) | (b << 12) | (c << 6) | d;
    out[o++] = n >>> 16;
    if (o < out.length) out[o++] = (n >>> 8) & 255;
    if (o < out.length) out[o++] = n & 255;
  }
  return out;
}

function decodeChar(text: string, index: number): number {
  const code = text.charCodeAt(index);
  return code < 128 ? LOOKUP[code] : -1;
}
