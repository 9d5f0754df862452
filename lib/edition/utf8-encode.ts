import { EditionError } from './edition-error';

/**
 * The UTF-8 bytes of a string (RFC 3629), from its UTF-16 code units; surrogate pairs become one four-byte
 * sequence. A lone surrogate is refused (`EditionError` 'lone-surrogate') rather than replaced with U+FFFD as
 * `TextEncoder` would, so two different strings never encode to the same bytes.
 */
export function utf8Encode(text: string): Uint8Array {
  const bytes: number[] = [];
  for (let i = 0; i < text.length; i++) {
    let point = text.charCodeAt(i);
    if (point >= 0xd800 && point <= 0xdbff) {
      const low = i + 1 < text.length ? text.charCodeAt(i + 1) : 0;
      if (!(low >= 0xdc00 && low <= 0xdfff)) throw new EditionError('lone-surrogate', `Lone surrogate at index ${i}.`);
      point = 0x10000 + ((point - 0xd800) << 10) + (low - 0xdc00);
      i++;
    } else if (point >= 0xdc00 && point <= 0xdfff) {
      throw new EditionError('lone-surrogate', `Lone surrogate at index ${i}.`);
    }
    if (point < 0x80) bytes.push(point);
    else if (point < 0x800) bytes.push(0xc0 | (point >> 6), 0x80 | (point & 0x3f));
    else if (point < 0x10000) bytes.push(0xe0 | (point >> 12), 0x80 | ((point >> 6) & 0x3f), 0x80 | (point & 0x3f));
    else bytes.push(0xf0 | (point >> 18), 0x80 | ((point >> 12) & 0x3f), 0x80 | ((point >> 6) & 0x3f), 0x80 | (point & 0x3f));
  }
  return Uint8Array.from(bytes);
}
