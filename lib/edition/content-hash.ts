import { canonicalJson } from './canonical-json';
import { sha256 } from './sha256';
import { toHex } from './to-hex';
import { utf8Encode } from './utf8-encode';

/**
 * The content hash of a JSON value: lowercase hex SHA-256 (FIPS 180-4, 64 characters) of the UTF-8 bytes of
 * its RFC 8785 canonical JSON (`canonicalJson`). Independent of object key order; refuses what
 * `canonicalJson` refuses (NaN, ±Infinity, undefined, non-plain objects) with an `EditionError`.
 */
export function contentHash(value: unknown): string {
  return toHex(sha256(utf8Encode(canonicalJson(value))));
}
