import { EditionError } from './edition-error';
import { jsonPointer as pointer } from './json-pointer';

/** True when `text` holds a UTF-16 surrogate that is not part of a pair (not valid I-JSON, RFC 7493 §2.1). */
function hasLoneSurrogate(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    if (unit >= 0xd800 && unit <= 0xdbff) {
      const next = i + 1 < text.length ? text.charCodeAt(i + 1) : 0;
      if (next >= 0xdc00 && next <= 0xdfff) i++;
      else return true;
    } else if (unit >= 0xdc00 && unit <= 0xdfff) return true;
  }
  return false;
}

function serializeString(text: string, path: string): string {
  if (hasLoneSurrogate(text)) throw new EditionError('lone-surrogate', `A string at "${path}" holds a lone surrogate.`, path);
  // RFC 8785 §3.2.2.2 adopts ECMAScript's JSON.stringify string serialisation: \b \t \n \f \r \" \\ as
  // two-character escapes, other controls below U+0020 as \u00xx (lowercase hex), everything else literal.
  return JSON.stringify(text);
}

function serializeNumber(value: number, path: string): string {
  if (!Number.isFinite(value)) {
    throw new EditionError('non-finite-number', `The number at "${path}" is ${String(value)}; JSON has no such number.`, path);
  }
  // RFC 8785 §3.2.2.3 is ECMAScript Number::toString (shortest round-trip digits; -0 → "0").
  return String(value);
}

function isPlainObject(value: object): value is Record<string, unknown> {
  const prototype: unknown = Object.getPrototypeOf(value);
  return prototype === Object.prototype || prototype === null;
}

function serialize(value: unknown, path: string, ancestors: Set<object>): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'boolean':
      return value ? 'true' : 'false';
    case 'number':
      return serializeNumber(value, path);
    case 'string':
      return serializeString(value, path);
    case 'undefined':
      throw new EditionError('undefined-value', `The value at "${path}" is undefined; leave the key out or use null.`, path);
    case 'object':
      break;
    default:
      throw new EditionError('unsupported-type', `The value at "${path}" is a ${typeof value}, not JSON.`, path);
  }
  if (ancestors.has(value)) throw new EditionError('cycle', `The value at "${path}" contains itself.`, path);
  ancestors.add(value);
  let text: string;
  if (Array.isArray(value)) {
    // Index loop, not map: map skips holes, and a hole is undefined (refused), not null.
    const items: string[] = [];
    for (let i = 0; i < value.length; i++) items.push(serialize(value[i], pointer(path, i), ancestors));
    text = `[${items.join(',')}]`;
  } else if (isPlainObject(value)) {
    // RFC 8785 §3.2.3: members sorted by key as arrays of UTF-16 code units — the default string order of
    // Array.prototype.sort, which compares code units, not code points.
    const keys = Object.keys(value).sort();
    const members = keys.map((key) => `${serializeString(key, path)}:${serialize(value[key], pointer(path, key), ancestors)}`);
    text = `{${members.join(',')}}`;
  } else {
    throw new EditionError('unsupported-type', `The value at "${path}" is a ${value.constructor?.name ?? 'non-plain object'}, not plain JSON.`, path);
  }
  ancestors.delete(value);
  return text;
}

/**
 * The canonical JSON text of a value, by the JSON Canonicalization Scheme (RFC 8785): no whitespace, object
 * members sorted by UTF-16 code units of their keys, numbers as ECMAScript `Number.prototype.toString`
 * (1e21 → "1e+21", 1e-7 → "1e-7", -0 → "0"), strings as ECMAScript `JSON.stringify`. Accepts plain objects
 * (own enumerable string keys), arrays, strings, finite numbers, booleans and null; refuses NaN and ±Infinity,
 * undefined (also as a member or an array hole), lone surrogates, cycles and anything else (functions, bigint,
 * symbols, Date, Map, typed arrays) with an `EditionError` whose `path` points at the value. Never mutates.
 */
export function canonicalJson(value: unknown): string {
  return serialize(value, '', new Set());
}
