import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EditionError, contentHash, sha256, toHex, utf8Encode } from '@/lib/edition';

const PROPERTY_SEED = 20261202;

function ascii(text: string): Uint8Array {
  return Uint8Array.from(text, (character) => character.charCodeAt(0));
}

describe('sha256', () => {
  // FIPS 180-2 Appendix B.1 / NIST CSRC "Cryptographic Standards and Guidelines: Examples with Intermediate
  // Values", SHA256.pdf, one-block message "abc".
  it('NIST one-block message "abc"', () => {
    expect(toHex(sha256(ascii('abc')))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  // NIST CSRC SHA-256 example / NIST SHAVS SHA256ShortMsg.rsp, Len = 0.
  it('NIST empty message', () => {
    expect(toHex(sha256(new Uint8Array(0)))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  // FIPS 180-2 Appendix B.2 / NIST SHA256.pdf, two-block message (448 bits: padding spills into a second block).
  it('NIST two-block message "abcdbcde…nopq"', () => {
    expect(toHex(sha256(ascii('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')))).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });

  // NIST CSRC SHA2 additional examples (SHA2_Additional.pdf) / FIPS 180-4 896-bit test message.
  it('NIST 896-bit message "abcdefghbcdefghi…nopqrstu"', () => {
    const message =
      'abcdefghbcdefghicdefghijdefghijkefghijklfghijklmghijklmnhijklmnoijklmnopjklmnopqklmnopqrlmnopqrsmnopqrstnopqrstu';
    expect(toHex(sha256(ascii(message)))).toBe('cf5b16a778af8380036ce59e7b0492370b249b11e8f07a51afac45037afee9d1');
  });

  // FIPS 180-2 Appendix B.3 / NIST SHA256.pdf, long message: one million repetitions of "a".
  it('NIST long message: 1,000,000 × "a"', () => {
    expect(toHex(sha256(new Uint8Array(1_000_000).fill(0x61)))).toBe(
      'cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0',
    );
  });

  it('pads correctly around the block edge (55, 56, 63, 64 bytes differ and are 32 bytes long)', () => {
    const digests = [55, 56, 63, 64, 65].map((length) => toHex(sha256(new Uint8Array(length).fill(0x61))));
    expect(new Set(digests).size).toBe(5);
    for (const digest of digests) expect(digest).toMatch(/^[0-9a-f]{64}$/);
  });

  it('does not mutate its input', () => {
    const message = ascii('abc');
    sha256(message);
    expect(Array.from(message)).toEqual([0x61, 0x62, 0x63]);
  });
});

describe('utf8Encode', () => {
  it('encodes one- to four-byte sequences (RFC 3629 §7 examples)', () => {
    expect(toHex(utf8Encode('A'))).toBe('41');
    expect(toHex(utf8Encode('é'))).toBe('c3a9');
    expect(toHex(utf8Encode('€'))).toBe('e282ac');
    expect(toHex(utf8Encode('日本語'))).toBe('e697a5e69cace8aa9e');
    expect(toHex(utf8Encode('\u{233B4}'))).toBe('f0a38eb4');
  });

  it('agrees with TextEncoder on well-formed strings', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme' }), (text) => toHex(utf8Encode(text)) === toHex(new TextEncoder().encode(text))),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('refuses a lone surrogate', () => {
    expect(() => utf8Encode('\ud800')).toThrow(EditionError);
  });
});

/** An edition snapshot of the shape the freeze step stores. */
const SNAPSHOT = {
  engineVersion: '1.0.0',
  seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.15, phase: 0 }] },
  space: {
    axes: [
      { label: 'Amplitude of k = 3', changes: [{ harmonic: 3, field: 'amplitude', delta: 0.1 }] },
      { label: 'Amplitude of k = 5', changes: [{ harmonic: 5, field: 'amplitude', delta: 0.1 }] },
    ],
    extent: 1,
    layout: { kind: 'rings', rings: 3, spokes: 8 },
  },
  normalization: { scale: 'equal-area-radius', centroid: true },
  boundaries: [{ key: 'main', label: 'Main', angleDeg: 45 }],
};

/** The same value with every object's keys in reverse order. */
function reverseKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(reverseKeys);
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).reverse().map(([key, inner]) => [key, reverseKeys(inner)]));
  }
  return value;
}

describe('contentHash', () => {
  it('is the SHA-256 of the canonical UTF-8 bytes: {} and [] hash like the two-byte strings', () => {
    expect(contentHash({})).toBe(toHex(sha256(ascii('{}'))));
    expect(contentHash('abc')).toBe(toHex(sha256(ascii('"abc"'))));
  });

  it('the same edition snapshot gives the same hash, also from a deep copy', () => {
    const hash = contentHash(SNAPSHOT);
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    expect(contentHash(structuredClone(SNAPSHOT))).toBe(hash);
    expect(contentHash(JSON.parse(JSON.stringify(SNAPSHOT)))).toBe(hash);
  });

  it('does not depend on key order', () => {
    expect(contentHash(reverseKeys(SNAPSHOT))).toBe(contentHash(SNAPSHOT));
    expect(contentHash({ a: 1, b: 2 })).toBe(contentHash({ b: 2, a: 1 }));
  });

  it('does not depend on key order, for any JSON value (seeded)', () => {
    fc.assert(
      fc.property(fc.jsonValue({ noUnicodeString: false }), (value) => contentHash(reverseKeys(value)) === contentHash(value)),
      { seed: PROPERTY_SEED, numRuns: 100 },
    );
  });

  it('changes with any change of content: a value, array order, or -0 vs 1e-300', () => {
    const hash = contentHash(SNAPSHOT);
    expect(contentHash({ ...SNAPSHOT, boundaries: [{ key: 'main', label: 'Main', angleDeg: 46 }] })).not.toBe(hash);
    expect(contentHash([1, 2])).not.toBe(contentHash([2, 1]));
    expect(contentHash(-0)).toBe(contentHash(0));
    expect(contentHash(1e-300)).not.toBe(contentHash(0));
  });

  it('refuses NaN, Infinity and undefined with a typed error', () => {
    expect(() => contentHash({ x: Number.NaN })).toThrow(EditionError);
    expect(() => contentHash([Number.POSITIVE_INFINITY])).toThrow(EditionError);
    expect(() => contentHash({ x: undefined })).toThrow(EditionError);
  });
});
