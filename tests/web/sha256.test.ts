/**
 * The page's SHA-256 (src/web/page/shims/crypto.ts, for the HTML report's
 * policy hashes in the browser) against Node's crypto (OpenSSL), on the
 * padding edges (55, 56, 63, 64 bytes), the empty input, multi-byte text and
 * a long input; and the FIPS 180-4 example "abc" (common practice: the
 * digest every SHA-256 implementation is checked against).
 */
import { createHash as nodeHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { createHash } from '../../src/web/page/shims/crypto.js';

describe('the page\'s SHA-256', () => {
  it('gives the FIPS 180-4 digest of "abc"', () => {
    expect(createHash('sha256').update('abc').digest('hex')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
  const inputs = ['', 'a', 'a'.repeat(55), 'a'.repeat(56), 'a'.repeat(63), 'a'.repeat(64), 'a'.repeat(65), 'ηp² = .13 — “quoted” ✓ 𝔽', 'x'.repeat(100_003)];
  for (const input of inputs) {
    it(`agrees with Node's crypto on ${input.length} characters`, () => {
      expect(createHash('sha256').update(input, 'utf8').digest('base64')).toBe(nodeHash('sha256').update(input, 'utf8').digest('base64'));
    });
  }
  it('refuses other algorithms by name', () => {
    expect(() => createHash('md5')).toThrow('only sha256');
  });
});
