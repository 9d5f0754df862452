import { MANIFEST_SCHEMA } from './manifest-schema';
import type { ManifestSchemaIssue } from './check-pack-types';

/** At most this many schema issues are reported: a wholly foreign JSON file would otherwise list thousands. */
export const MAX_SCHEMA_ISSUES = 50;

/**
 * The JSON Schema 2020-12 keywords `MANIFEST_SCHEMA` uses and this checker understands. Annotations
 * (`$schema`, `$id`, `title`, `description`) are ignored; any other keyword is an error of the schema itself.
 */
export const SUPPORTED_SCHEMA_KEYWORDS = [
  '$schema', '$id', '$defs', '$ref', 'title', 'description',
  'type', 'const', 'enum', 'oneOf',
  'properties', 'required', 'additionalProperties',
  'items', 'prefixItems', 'minItems', 'maxItems',
  'minLength', 'pattern', 'minimum', 'exclusiveMinimum', 'maximum', 'exclusiveMaximum',
] as const;

type Schema = boolean | { readonly [keyword: string]: unknown };

const SUPPORTED = new Set<string>(SUPPORTED_SCHEMA_KEYWORDS);

const escapePointer = (key: string): string => key.replace(/~/g, '~0').replace(/\//g, '~1');

function typeOf(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  if (typeof value === 'number') return Number.isInteger(value) ? 'integer' : 'number';
  return typeof value;
}

function hasType(value: unknown, type: string): boolean {
  const actual = typeOf(value);
  return actual === type || (type === 'number' && actual === 'integer');
}

function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  return JSON.stringify(a) === JSON.stringify(b);
}

const describe = (value: unknown): string => {
  const text = JSON.stringify(value);
  return text === undefined ? typeOf(value) : text.length > 40 ? `${text.slice(0, 37)}…` : text;
};

/** Resolves a local `$ref` (`#/$defs/name`) against the root schema. */
function resolveRef(root: Schema, ref: string): Schema {
  if (!ref.startsWith('#/')) throw new RangeError(`only local $ref is supported, not ${ref}`);
  let node: unknown = root;
  for (const part of ref.slice(2).split('/')) {
    node = typeof node === 'object' && node !== null ? (node as Record<string, unknown>)[part.replace(/~1/g, '/').replace(/~0/g, '~')] : undefined;
  }
  if (typeof node !== 'object' && typeof node !== 'boolean') throw new RangeError(`$ref ${ref} does not resolve`);
  return node as Schema;
}

/**
 * Checks `value` against `schema` (the subset of JSON Schema 2020-12 in `SUPPORTED_SCHEMA_KEYWORDS`), pushing
 * each violation with its JSON Pointer (RFC 6901) into `out` until `limit` are found. Returns whether it is valid.
 */
function check(root: Schema, schema: Schema, value: unknown, pointer: string, out: ManifestSchemaIssue[], limit: number): boolean {
  if (schema === true) return true;
  if (schema === false) return push(out, limit, pointer, 'is not allowed here');
  let ok = true;
  const fail = (message: string) => {
    ok = false;
    push(out, limit, pointer, message);
  };
  for (const keyword of Object.keys(schema)) {
    if (!SUPPORTED.has(keyword)) throw new RangeError(`unsupported schema keyword ${keyword} at ${pointer || '/'}`);
  }
  const s = schema as Record<string, unknown>;
  if (typeof s.$ref === 'string' && !check(root, resolveRef(root, s.$ref), value, pointer, out, limit)) ok = false;
  if (typeof s.type === 'string' && !hasType(value, s.type)) {
    fail(`should be ${s.type === 'integer' ? 'a whole number' : s.type === 'object' ? 'an object' : s.type === 'array' ? 'an array' : `a ${s.type}`}, not ${describe(value)}`);
    return false;
  }
  if ('const' in s && !sameJson(value, s.const)) fail(`should be ${describe(s.const)}, not ${describe(value)}`);
  if (Array.isArray(s.enum) && !s.enum.some((e) => sameJson(e, value))) fail(`should be one of ${s.enum.map(describe).join(', ')}, not ${describe(value)}`);
  if (Array.isArray(s.oneOf)) {
    // Each branch is tried on a scratch list; only the count of passing branches matters.
    const passing = s.oneOf.filter((branch) => check(root, branch as Schema, value, pointer, [], 0)).length;
    if (passing !== 1) fail(passing === 0 ? `matches none of the allowed forms (${describe(value)})` : 'matches more than one allowed form');
  }
  if (typeof value === 'string') {
    if (typeof s.minLength === 'number' && [...value].length < s.minLength) fail(s.minLength === 1 ? 'should not be empty' : `should be at least ${s.minLength} characters`);
    if (typeof s.pattern === 'string' && !new RegExp(s.pattern, 'u').test(value)) fail(`${describe(value)} is not in the expected form`);
  }
  if (typeof value === 'number') {
    if (typeof s.minimum === 'number' && value < s.minimum) fail(`should be at least ${s.minimum}, not ${value}`);
    if (typeof s.exclusiveMinimum === 'number' && value <= s.exclusiveMinimum) fail(`should be above ${s.exclusiveMinimum}, not ${value}`);
    if (typeof s.maximum === 'number' && value > s.maximum) fail(`should be at most ${s.maximum}, not ${value}`);
    if (typeof s.exclusiveMaximum === 'number' && value >= s.exclusiveMaximum) fail(`should be below ${s.exclusiveMaximum}, not ${value}`);
  }
  if (Array.isArray(value)) {
    if (typeof s.minItems === 'number' && value.length < s.minItems) fail(`should hold at least ${s.minItems} item${s.minItems === 1 ? '' : 's'}, not ${value.length}`);
    if (typeof s.maxItems === 'number' && value.length > s.maxItems) fail(`should hold at most ${s.maxItems} items, not ${value.length}`);
    const prefix = Array.isArray(s.prefixItems) ? (s.prefixItems as Schema[]) : [];
    value.forEach((item, i) => {
      const itemSchema = i < prefix.length ? prefix[i] : (s.items as Schema | undefined);
      if (itemSchema !== undefined && !check(root, itemSchema, item, `${pointer}/${i}`, out, limit)) ok = false;
    });
  }
  if (typeOf(value) === 'object') {
    const object = value as Record<string, unknown>;
    const properties = (s.properties ?? {}) as Record<string, Schema>;
    if (Array.isArray(s.required)) {
      for (const key of s.required as string[]) if (!(key in object)) fail(`is missing ${JSON.stringify(key)}`);
    }
    for (const [key, member] of Object.entries(object)) {
      const memberPointer = `${pointer}/${escapePointer(key)}`;
      const memberSchema = properties[key];
      if (memberSchema !== undefined) {
        if (!check(root, memberSchema, member, memberPointer, out, limit)) ok = false;
      } else if (s.additionalProperties === false) {
        ok = false;
        push(out, limit, memberPointer, 'is not a member the manifest may have');
      }
    }
  }
  return ok;
}

function push(out: ManifestSchemaIssue[], limit: number, pointer: string, message: string): false {
  if (out.length < limit) out.push({ pointer, message });
  return false;
}

/**
 * Checks a parsed `manifest.json` against `MANIFEST_SCHEMA` (JSON Schema 2020-12, the subset of keywords in
 * `SUPPORTED_SCHEMA_KEYWORDS`), without a validator library so the check runs in the browser too. Returns at most
 * `limit` issues, each a JSON Pointer (RFC 6901) into the manifest and a plain-language reason; empty when valid.
 */
export function checkPackManifestSchema(manifest: unknown, limit = MAX_SCHEMA_ISSUES): ManifestSchemaIssue[] {
  const out: ManifestSchemaIssue[] = [];
  const root = MANIFEST_SCHEMA as unknown as Schema;
  const valid = check(root, root, manifest, '', out, limit);
  if (!valid && out.length === 0 && limit > 0) out.push({ pointer: '', message: 'does not match the manifest schema' });
  return out;
}
