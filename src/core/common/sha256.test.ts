import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sha256Hex } from './sha256';

describe('sha256Hex', () => {
  it('matches the FIPS 180-4 example for "abc"', () => {
    // NIST FIPS 180-4 examples (SHA256.pdf, one-block message "abc").
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('matches the known digest of the empty string', () => {
    // NIST CAVP SHAVS byte-oriented test vector, Len = 0.
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('matches the FIPS 180-4 two-block example', () => {
    // NIST FIPS 180-4 examples, 448-bit message "abcdbcdecdefdefg...nopq".
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });

  it('agrees with Node’s OpenSSL digest on arbitrary bytes', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 300 }), (bytes) => {
        expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
      }),
      { numRuns: 60 },
    );
  });
});

describe('sha256Hex on text', () => {
  it('encodes text as UTF-8 before hashing, as Node does', () => {
    for (const t of ['Ngā otaota', '草地', 'Солончак', '🌿 plot']) {
      expect(sha256Hex(t)).toBe(createHash('sha256').update(t, 'utf8').digest('hex'));
    }
  });
});
