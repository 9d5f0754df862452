// fast-check arbitraries from JSON Schema (draft 2020-12, as zod 4's z.toJSONSchema writes it): `validOf` draws
// values the schema describes, `invalidOf` draws values that break it in one place (wrong type, a required field
// left out, a number or length past its bound, a string off its pattern) or are hostile whatever the schema says.
// zod-fast-check does not support zod 4, hence this small generator; it knows the keywords zod emits and treats
// anything else as "any JSON value".
import fc from 'fast-check';
import { z } from 'zod';

export type JsonSchema = {
  type?: string | string[];
  enum?: unknown[];
  const?: unknown;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  $ref?: string;
  $defs?: Record<string, JsonSchema>;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: boolean | JsonSchema;
  items?: JsonSchema;
  prefixItems?: JsonSchema[];
  minItems?: number;
  maxItems?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  multipleOf?: number;
  minLength?: number;
  maxLength?: number;
  pattern?: string;
  format?: string;
  default?: unknown;
};

/** Keeps generated collections small: the point is shape, not volume. */
const MAX_ITEMS = 6;
const MAX_STRING = 40;

/** JSON Schema of a zod schema as a request has it (the same conversion the OpenAPI document uses). */
export function requestJsonSchema(schema: z.ZodType): JsonSchema {
  return z.toJSONSchema(schema, { target: 'draft-2020-12', io: 'input', unrepresentable: 'any' }) as JsonSchema;
}

const anyJson: fc.Arbitrary<unknown> = fc.jsonValue({ maxDepth: 2 });

/** Strings that have broken parsers before: markup, formulas, traversal, control and odd Unicode, number look-alikes. */
export const HOSTILE_STRINGS: readonly string[] = [
  '',
  ' ',
  '<script>alert(1)</script>',
  '"><img src=x onerror=alert(1)>',
  '=HYPERLINK("http://example.invalid","x")',
  '../../../../etc/passwd',
  '%2e%2e%2f',
  '\u0000',
  '\uFFFF\uD800',
  'NaN',
  'Infinity',
  '-0',
  '1e309',
  "'; DROP TABLE users; --",
  '__proto__',
  'constructor',
  '{"$ne":null}',
  'a'.repeat(5000),
];

function resolve(schema: JsonSchema, root: JsonSchema): JsonSchema {
  if (!schema.$ref) return schema;
  const name = schema.$ref.replace(/^#\/\$defs\//, '');
  if (schema.$ref === '#') return root;
  const target = root.$defs?.[name];
  if (!target) throw new Error(`unresolved $ref ${schema.$ref}`);
  return target;
}

function typesOf(schema: JsonSchema): string[] {
  if (Array.isArray(schema.type)) return schema.type;
  return schema.type ? [schema.type] : [];
}

function stringArbitrary(schema: JsonSchema): fc.Arbitrary<string> {
  if (schema.format === 'uuid') return fc.uuid();
  if (schema.format === 'email') return fc.emailAddress();
  if (schema.format === 'date-time') return fc.date({ min: new Date('2000-01-01'), max: new Date('2099-12-31'), noInvalidDate: true }).map((d) => d.toISOString());
  const minLength = schema.minLength ?? 0;
  const maxLength = Math.max(minLength, Math.min(schema.maxLength ?? MAX_STRING, minLength + MAX_STRING));
  if (schema.pattern) {
    return fc.stringMatching(new RegExp(schema.pattern)).filter((s) => s.length >= minLength && s.length <= (schema.maxLength ?? Infinity));
  }
  return fc.string({ minLength, maxLength, unit: 'grapheme' });
}

function numberArbitrary(schema: JsonSchema, isInteger: boolean): fc.Arbitrary<number> {
  const low = schema.minimum ?? (schema.exclusiveMinimum !== undefined ? schema.exclusiveMinimum + (isInteger ? 1 : 1e-9) : -1e6);
  const high = schema.maximum ?? (schema.exclusiveMaximum !== undefined ? schema.exclusiveMaximum - (isInteger ? 1 : 1e-9) : 1e6);
  if (isInteger) return fc.integer({ min: Math.ceil(Math.max(low, Number.MIN_SAFE_INTEGER)), max: Math.floor(Math.min(high, Number.MAX_SAFE_INTEGER)) });
  return fc.double({ min: low, max: high, noNaN: true, noDefaultInfinity: true });
}

/** Values the schema describes (zod may still refuse some: refinements are not in JSON Schema). */
export function validOf(schema: JsonSchema, root: JsonSchema = schema, depth = 0): fc.Arbitrary<unknown> {
  const s = resolve(schema, root);
  if (depth > 8) return fc.constant(null);
  if (s.const !== undefined) return fc.constant(s.const);
  if (s.enum) return fc.constantFrom(...s.enum);
  const union = s.anyOf ?? s.oneOf;
  if (union) return fc.oneof(...union.map((u) => validOf(u, root, depth + 1)));
  if (s.allOf?.length) return validOf(Object.assign({}, ...s.allOf.map((part) => resolve(part, root))) as JsonSchema, root, depth + 1);
  const types = typesOf(s);
  if (types.length > 1) return fc.oneof(...types.map((type) => validOf({ ...s, type }, root, depth + 1)));
  switch (types[0]) {
    case 'string':
      return stringArbitrary(s);
    case 'integer':
      return numberArbitrary(s, true);
    case 'number':
      return numberArbitrary(s, false);
    case 'boolean':
      return fc.boolean();
    case 'null':
      return fc.constant(null);
    case 'array': {
      if (s.prefixItems) return fc.tuple(...s.prefixItems.map((p) => validOf(p, root, depth + 1)));
      const minLength = s.minItems ?? 0;
      const maxLength = Math.max(minLength, Math.min(s.maxItems ?? MAX_ITEMS, minLength + MAX_ITEMS));
      return fc.array(s.items ? validOf(s.items, root, depth + 1) : anyJson, { minLength, maxLength });
    }
    case 'object': {
      const properties = s.properties ?? {};
      const required = new Set(s.required ?? []);
      const model = Object.fromEntries(Object.entries(properties).map(([k, v]) => [k, validOf(v, root, depth + 1)]));
      return fc.record(model, { requiredKeys: [...required].filter((k) => k in properties) });
    }
    default:
      return anyJson;
  }
}

/** One value that breaks the schema at its top level, or a hostile value of any kind. */
export function invalidOf(schema: JsonSchema, root: JsonSchema = schema): fc.Arbitrary<unknown> {
  const s = resolve(schema, root);
  const hostile = fc.oneof(
    fc.constantFrom(...HOSTILE_STRINGS),
    fc.constantFrom<unknown>(null, true, 0, -1, 1e308, [], {}, [[[[[[[[[[[]]]]]]]]]]], { __proto__: { isAdmin: true } }),
    anyJson,
  );
  const options: fc.Arbitrary<unknown>[] = [hostile];
  const types = typesOf(s);
  if (types.includes('object') && s.properties) {
    const valid = validOf(s, root) as fc.Arbitrary<Record<string, unknown>>;
    const keys = Object.keys(s.properties);
    const required = s.required ?? [];
    if (required.length > 0) {
      options.push(fc.tuple(valid, fc.constantFrom(...required)).map(([v, k]) => Object.fromEntries(Object.entries(v).filter(([key]) => key !== k))));
    }
    if (keys.length > 0) {
      // One field replaced by something that breaks it (or by a hostile value).
      const breakOne = fc.constantFrom(...keys).chain((k) => fc.tuple(valid, fc.constant(k), invalidOf(s.properties![k]!, root)));
      options.push(breakOne.map(([v, k, bad]) => ({ ...v, [k]: bad })));
    }
    options.push(valid.map((v) => ({ ...v, unexpectedField: '<b>extra</b>' })));
  }
  if (types.includes('string')) {
    if (s.maxLength !== undefined) options.push(fc.constant('x'.repeat(s.maxLength + 1)));
    if (s.minLength) options.push(fc.constant('x'.repeat(s.minLength - 1)));
    if (s.pattern || s.format) options.push(fc.constantFrom(...HOSTILE_STRINGS));
  }
  if (types.includes('number') || types.includes('integer')) {
    if (s.maximum !== undefined) options.push(fc.constant(s.maximum + 1));
    if (s.minimum !== undefined) options.push(fc.constant(s.minimum - 1));
    if (types.includes('integer')) options.push(fc.constant(0.5));
  }
  if (types.includes('array') && s.maxItems !== undefined && s.maxItems < 200) {
    const item = s.items ? validOf(s.items, root) : anyJson;
    options.push(fc.array(item, { minLength: s.maxItems + 1, maxLength: s.maxItems + 1 }));
  }
  return fc.oneof(...options);
}
