/**
 * The WHATWG TextDecoder / TextEncoder, present in browsers, Web Workers and Node alike, typed
 * locally because the engine compiles without the DOM library.
 */

/** Minimal TextDecoder surface the importers use. */
export interface TextDecoderLike {
  decode(input?: Uint8Array, options?: { stream?: boolean }): string;
}

/** Minimal TextEncoder surface the importers use. */
export interface TextEncoderLike {
  encode(input: string): Uint8Array;
}

interface CodecGlobals {
  TextDecoder: new (label?: string, options?: { fatal?: boolean; ignoreBOM?: boolean }) => TextDecoderLike;
  TextEncoder: new () => TextEncoderLike;
}

const codecGlobals = globalThis as unknown as CodecGlobals;

/**
 * A decoder for an encoding label.
 *
 * @param label WHATWG encoding label ('utf-8', 'utf-16le', 'windows-1252' ...)
 * @param fatal throw on malformed input instead of inserting U+FFFD
 * @returns the decoder
 * @example createTextDecoder('utf-8').decode(new Uint8Array([0x41])) // 'A'
 */
export function createTextDecoder(label: string, fatal = false): TextDecoderLike {
  return new codecGlobals.TextDecoder(label, { fatal, ignoreBOM: true });
}

/**
 * UTF-8 bytes of a string.
 *
 * @param text the text
 * @returns UTF-8 bytes
 * @example encodeUtf8('A') // Uint8Array [0x41]
 */
export function encodeUtf8(text: string): Uint8Array {
  return new codecGlobals.TextEncoder().encode(text);
}
