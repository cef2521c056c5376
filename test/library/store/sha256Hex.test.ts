// The library's one digest against the published SHA-256 test vectors.
import { describe, expect, it } from 'vitest';
import { sha256Hex } from '../../../src/library/store/sha256Hex.js';

describe('sha256Hex', () => {
  it('matches the FIPS 180-2 examples', () => {
    // FIPS PUB 180-2, Appendix B.1 ("abc") and B.2 (the 448-bit message).
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
    // The empty message (common practice: the well-known digest of zero bytes).
    expect(sha256Hex(new Uint8Array(0))).toBe(
      'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855',
    );
  });

  it('hashes text as UTF-8 bytes', () => {
    expect(sha256Hex('cm⁻¹')).toBe(sha256Hex(new TextEncoder().encode('cm⁻¹')));
  });
});
