/**
 * Character encodings of contractor files: UTF-8 with or without BOM, UTF-16 LE/BE with or
 * without BOM, and single-byte Windows-1252 / ISO-8859-1 for older exports. Uses only the
 * WHATWG TextDecoder (browsers, workers and Node alike).
 */
import { EngineError } from '../errors';
import { createTextDecoder, encodeUtf8 } from './textCodec';

export type TextEncodingName = 'utf-8' | 'utf-16le' | 'utf-16be' | 'windows-1252';

/** Encoding found and where the text starts (after a byte-order mark). */
export interface DetectedEncoding {
  encoding: TextEncodingName;
  /** Byte offset after the BOM. */
  offset: number;
  hadBom: boolean;
}

/**
 * Detects the encoding from a byte-order mark, else from the pattern of zero bytes
 * (UTF-16 without BOM puts a zero in every other byte of ASCII text), else tries strict
 * UTF-8 on the first 64 KiB and falls back to Windows-1252 (a superset of ISO-8859-1's
 * printable range, as the WHATWG Encoding Standard maps "iso-8859-1").
 *
 * @param bytes file content
 * @returns encoding and start offset
 * @example detectEncoding(new Uint8Array([0xef, 0xbb, 0xbf, 0x41])) // {encoding:'utf-8', offset:3, hadBom:true}
 */
export function detectEncoding(bytes: Uint8Array): DetectedEncoding {
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) return { encoding: 'utf-8', offset: 3, hadBom: true };
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return { encoding: 'utf-16le', offset: 2, hadBom: true };
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return { encoding: 'utf-16be', offset: 2, hadBom: true };
  const zeros = zeroBytePattern(bytes);
  if (zeros === 'odd') return { encoding: 'utf-16le', offset: 0, hadBom: false };
  if (zeros === 'even') return { encoding: 'utf-16be', offset: 0, hadBom: false };
  return { encoding: isValidUtf8(bytes.subarray(0, 65536)) ? 'utf-8' : 'windows-1252', offset: 0, hadBom: false };
}

/** Where zero bytes sit in the first 4 KiB: mostly at odd offsets (UTF-16 LE), even (BE) or neither. */
function zeroBytePattern(bytes: Uint8Array): 'odd' | 'even' | 'none' {
  const n = Math.min(bytes.length, 4096);
  let odd = 0;
  let even = 0;
  for (let i = 0; i < n; i++) {
    if (bytes[i] !== 0) continue;
    if (i & 1) odd++;
    else even++;
  }
  if (n < 4) return 'none';
  if (odd > n / 4 && even < odd / 10) return 'odd';
  if (even > n / 4 && odd < even / 10) return 'even';
  return 'none';
}

/** Strict UTF-8 check; a multi-byte sequence cut at the end of the sample is allowed. */
function isValidUtf8(sample: Uint8Array): boolean {
  try {
    createTextDecoder('utf-8', true).decode(sample, { stream: true });
    return true;
  } catch {
    return false;
  }
}

/**
 * Decodes bytes to a string with the detected (or given) encoding, without the BOM.
 *
 * @param bytes file content
 * @param fileName for the error
 * @param detected encoding from detectEncoding (detected here when absent)
 * @returns the text
 * @throws EngineError 'bad-encoding' when the bytes are not valid in that encoding
 * @example decodeText(encodeUtf8('a,b'), 'x.csv') // 'a,b'
 */
export function decodeText(bytes: Uint8Array, fileName: string, detected: DetectedEncoding = detectEncoding(bytes)): string {
  try {
    return createTextDecoder(detected.encoding, detected.encoding !== 'windows-1252').decode(bytes.subarray(detected.offset));
  } catch {
    throw new EngineError('bad-encoding', `the file is not valid ${detected.encoding} text`, { file: fileName }, 'UTF-8, UTF-16 or Windows-1252 text');
  }
}

/**
 * Bytes that a byte-level parser can scan: UTF-8 or single-byte text as is (past the
 * BOM), UTF-16 re-encoded to UTF-8. Delimiters and digits are ASCII in all of them.
 *
 * @param bytes file content
 * @param fileName for the error
 * @returns ASCII-compatible bytes and the encoding found
 * @throws EngineError 'bad-encoding' for malformed UTF-16
 * @example asciiCompatibleBytes(bytes, 'a.csv').bytes
 */
export function asciiCompatibleBytes(input: Uint8Array, fileName: string): { bytes: Uint8Array; encoding: DetectedEncoding } {
  const bytes = plainByteView(input);
  const encoding = detectEncoding(bytes);
  if (encoding.encoding === 'utf-16le' || encoding.encoding === 'utf-16be') {
    return { bytes: encodeUtf8(decodeText(bytes, fileName, encoding)), encoding };
  }
  return { bytes: bytes.subarray(encoding.offset), encoding };
}

/**
 * A plain Uint8Array view of the same memory (no copy). Node's Buffer is a Uint8Array
 * subclass; scanning one type only keeps the byte loops monomorphic and fast.
 *
 * @param bytes any Uint8Array (or subclass)
 * @returns a Uint8Array over the same bytes
 * @example plainByteView(buffer).constructor === Uint8Array // true
 */
export function plainByteView(bytes: Uint8Array): Uint8Array {
  return bytes.constructor === Uint8Array ? bytes : new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

/**
 * Decodes a slice of ASCII-compatible bytes (from asciiCompatibleBytes) to text.
 *
 * @param bytes ASCII-compatible bytes
 * @param encoding the encoding they are in (utf-8 or windows-1252; UTF-16 was re-encoded to utf-8)
 * @returns the text
 * @example decodeAsciiCompatible(new Uint8Array([0x41]), 'utf-8') // 'A'
 */
export function decodeAsciiCompatible(bytes: Uint8Array, encoding: TextEncodingName): string {
  const label = encoding === 'windows-1252' ? 'windows-1252' : 'utf-8';
  return createTextDecoder(label).decode(bytes);
}
