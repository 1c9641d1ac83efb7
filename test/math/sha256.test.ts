/**
 * src/math/sha256.ts: SHA-256 of the parts one after the other, node:crypto
 * loaded on the first call. Digests from FIPS 180-2, Appendix B (the one-block
 * message "abc" and the two-block message of 448 bits).
 */
import { describe, expect, test } from '@jest/globals';
import { sha256Hex } from '../../src/math/sha256.js';

describe('sha256Hex', () => {
  test('FIPS 180-2 Appendix B.1 and B.2', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });

  test('parts hash as their concatenation, strings as their UTF-8 bytes', () => {
    expect(sha256Hex('ab', '', 'c')).toBe(sha256Hex('abc'));
    expect(sha256Hex(new TextEncoder().encode('x = 1.5 °C'))).toBe(sha256Hex('x = 1.5 ', '°C'));
  });
});
