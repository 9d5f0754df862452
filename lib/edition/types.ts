/**
 * The JSON subset that canonical JSON (RFC 8785, the JSON Canonicalization Scheme) accepts here: objects,
 * arrays, strings without lone surrogates, finite numbers, booleans and null. `canonicalJson` takes `unknown`
 * and checks at run time; this type documents what passes.
 */
export type JsonValue = null | boolean | number | string | readonly JsonValue[] | { readonly [key: string]: JsonValue };
