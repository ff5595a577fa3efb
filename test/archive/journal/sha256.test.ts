import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sha256Hex, sha256HexAsync, sha256OfText } from '../../../src-renderer/archive/journal/sha256';
import { base64Decode, base64Encode } from '../../../src-renderer/archive/journal/base64';

describe('sha256', () => {
  it('should match the one-block example "abc"', () => {
    // FIPS 180-2, Appendix B.1 (NIST "SHA256.pdf" example): SHA-256("abc").
    expect(sha256OfText('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('should match the two-block 448-bit example', () => {
    // FIPS 180-2, Appendix B.2: the 448-bit message "abcdbcdecdef...nopq".
    expect(sha256OfText('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq'))
      .toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });

  it('should match the one million "a" example', () => {
    // FIPS 180-2, Appendix B.3: one million repetitions of "a".
    expect(sha256Hex(new Uint8Array(1_000_000).fill(0x61))).toBe('cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0');
  });

  it('should match the empty message', () => {
    // NIST CAVS SHA256ShortMsg.rsp, Len = 0.
    expect(sha256Hex(new Uint8Array(0))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('should agree with the reference implementation on random inputs across block boundaries', () => {
    // Reference library: Node's OpenSSL-backed crypto.createHash('sha256').
    fc.assert(fc.property(fc.uint8Array({ minLength: 0, maxLength: 300 }), (bytes) => {
      expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
    }), { numRuns: 300 });
    for (const n of [55, 56, 57, 63, 64, 65, 119, 120, 127, 128, 129]) {
      const bytes = new Uint8Array(n).map((_, i) => (i * 31) & 255);
      expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
    }
  });

  it('should hash text as UTF-8', () => {
    // Reference library: Node's crypto over the UTF-8 bytes.
    const text = 'Harrow Flats – Δp 3.2 MPa – ✓';
    expect(sha256OfText(text)).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
  });

  it('should give the same result through crypto.subtle', async () => {
    const bytes = new TextEncoder().encode('abc');
    expect(await sha256HexAsync(bytes)).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
});

describe('base64', () => {
  it('should match the RFC 4648 test vectors', () => {
    // RFC 4648, section 10.
    const vectors: [string, string][] = [['', ''], ['f', 'Zg=='], ['fo', 'Zm8='], ['foo', 'Zm9v'], ['foob', 'Zm9vYg=='], ['fooba', 'Zm9vYmE='], ['foobar', 'Zm9vYmFy']];
    for (const [plain, encoded] of vectors) {
      expect(base64Encode(new TextEncoder().encode(plain))).toBe(encoded);
      expect(new TextDecoder().decode(base64Decode(encoded)!)).toBe(plain);
    }
  });

  it('should round-trip any bytes and agree with Node Buffer', () => {
    // Reference library: Node's Buffer base64.
    fc.assert(fc.property(fc.uint8Array({ maxLength: 500 }), (bytes) => {
      const text = base64Encode(bytes);
      expect(text).toBe(Buffer.from(bytes).toString('base64'));
      expect(base64Decode(text)).toEqual(bytes);
    }), { numRuns: 200 });
  });

  it('should refuse text that is not base64', () => {
    expect(base64Decode('Zm9')).toBeNull();
    expect(base64Decode('Zm9*')).toBeNull();
  });
});
