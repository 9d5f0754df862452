import { describe, expect, it } from 'vitest';
import { EditionError, canonicalJson, type EditionErrorCode } from '@/lib/edition';

function expectEditionError(run: () => unknown, code: EditionErrorCode, path?: string): void {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(EditionError);
    expect((error as EditionError).code).toBe(code);
    if (path !== undefined) expect((error as EditionError).path).toBe(path);
    return;
  }
  throw new Error(`expected an EditionError '${code}'`);
}

/** A double from its IEEE 754 bit pattern, as RFC 8785 Appendix B lists them. */
function fromBits(hex: string): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setUint32(0, Number.parseInt(hex.slice(0, 8), 16));
  view.setUint32(4, Number.parseInt(hex.slice(8), 16));
  return view.getFloat64(0);
}

describe('canonicalJson numbers', () => {
  // RFC 8785 Appendix B, "Number Serialization Samples" (IEEE 754 bits → canonical text).
  it.each([
    ['0000000000000000', '0'],
    ['8000000000000000', '0'],
    ['0000000000000001', '5e-324'],
    ['8000000000000001', '-5e-324'],
    ['7fefffffffffffff', '1.7976931348623157e+308'],
    ['4340000000000000', '9007199254740992'],
    ['c340000000000000', '-9007199254740992'],
    ['4430000000000000', '295147905179352830000'],
    ['44b52d02c7e14af5', '9.999999999999997e+22'],
    ['44b52d02c7e14af6', '1e+23'],
    ['44b52d02c7e14af7', '1.0000000000000001e+23'],
    ['444b1ae4d6e2ef4e', '999999999999999700000'],
    ['444b1ae4d6e2ef4f', '999999999999999900000'],
    ['444b1ae4d6e2ef50', '1e+21'],
    ['3eb0c6f7a0b5ed8c', '9.999999999999997e-7'],
    ['3eb0c6f7a0b5ed8d', '0.000001'],
    ['41b3de4355555553', '333333333.3333332'],
    ['41b3de4355555554', '333333333.33333325'],
    ['41b3de4355555555', '333333333.3333333'],
    ['41b3de4355555556', '333333333.3333334'],
    ['41b3de4355555557', '333333333.33333343'],
    ['becbf647612f3696', '-0.0000033333333333333333'],
    ['43143ff3c1cb0959', '1424953923781206.2'],
  ])('RFC 8785 Appendix B: %s → %s', (bits, text) => {
    expect(canonicalJson(fromBits(bits))).toBe(text);
  });

  it.each([
    [1e21, '1e+21'],
    [1e20, '100000000000000000000'],
    [0.000001, '0.000001'],
    [1e-7, '1e-7'],
    [-0, '0'],
    [4.5, '4.5'],
    [2e-3, '0.002'],
  ])('%s → %s (RFC 8785 §3.2.2.3, ECMAScript Number::toString)', (value, text) => {
    expect(canonicalJson(value)).toBe(text);
  });

  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY])('refuses %s', (value) => {
    expectEditionError(() => canonicalJson(value), 'non-finite-number', '');
    expectEditionError(() => canonicalJson({ a: [1, { b: value }] }), 'non-finite-number', '/a/1/b');
  });
});

describe('canonicalJson strings and structure', () => {
  it('RFC 8785 §3.2.2 example: whitespace, number and string serialisation together', () => {
    const input = {
      numbers: [333333333.33333329, 1e30, 4.5, 2e-3, 0.000000000000000000000000001],
      string: '\u20ac$\u000F\u000aA\'\u0042\u0022\u005c\\"/',
      literals: [null, true, false],
    };
    expect(canonicalJson(input)).toBe(
      '{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}',
    );
  });

  it('escapes the two-character controls and the rest as lowercase \\u00xx (RFC 8785 §3.2.2.2)', () => {
    expect(canonicalJson('\b\t\n\f\r\u0000\u001f\u007f')).toBe('"\\b\\t\\n\\f\\r\\u0000\\u001f\u007f"');
    expect(canonicalJson('é😀')).toBe('"é😀"');
  });

  it('RFC 8785 §3.2.3 example: sorts keys by UTF-16 code units, so 😀 (U+D83D…) comes before U+FB33', () => {
    const input = {
      '\u20ac': 'Euro Sign',
      '\r': 'Carriage Return',
      '\ufb33': 'Hebrew Letter Dalet With Dagesh',
      '1': 'One',
      '\ud83d\ude00': 'Emoji: Grinning Face',
      '\u0080': 'Control',
      '\u00f6': 'Latin Small Letter O With Diaeresis',
    };
    expect(canonicalJson(input)).toBe(
      '{"\\r":"Carriage Return","1":"One","\u0080":"Control","\u00f6":"Latin Small Letter O With Diaeresis",' +
        '"\u20ac":"Euro Sign","\ud83d\ude00":"Emoji: Grinning Face","\ufb33":"Hebrew Letter Dalet With Dagesh"}',
    );
  });

  it('writes no whitespace and nests sorted objects inside arrays', () => {
    expect(canonicalJson({ b: [{ d: 1, c: 2 }], a: {} })).toBe('{"a":{},"b":[{"c":2,"d":1}]}');
    expect(canonicalJson([])).toBe('[]');
  });

  it('does not mutate its input', () => {
    const input = { z: [3, 2, 1], a: { y: 1, x: 2 } };
    const copy = structuredClone(input);
    canonicalJson(input);
    expect(input).toEqual(copy);
    expect(Object.keys(input)).toEqual(['z', 'a']);
  });

  it('refuses undefined anywhere, including an array hole', () => {
    expectEditionError(() => canonicalJson(undefined), 'undefined-value', '');
    expectEditionError(() => canonicalJson({ a: undefined }), 'undefined-value', '/a');
    expectEditionError(() => canonicalJson([1, , 3]), 'undefined-value', '/1');
  });

  it('escapes JSON Pointer tokens in error paths (RFC 6901)', () => {
    expectEditionError(() => canonicalJson({ 'a/b': { '~c': Number.NaN } }), 'non-finite-number', '/a~1b/~0c');
  });

  it('refuses lone surrogates, in values and in keys', () => {
    expectEditionError(() => canonicalJson('\ud800'), 'lone-surrogate');
    expectEditionError(() => canonicalJson('a\udc00b'), 'lone-surrogate');
    expectEditionError(() => canonicalJson({ '\ud83d': 1 }), 'lone-surrogate');
  });

  it('refuses what is not plain JSON', () => {
    expectEditionError(() => canonicalJson(new Date(0)), 'unsupported-type');
    expectEditionError(() => canonicalJson(new Map()), 'unsupported-type');
    expectEditionError(() => canonicalJson(new Float64Array(2)), 'unsupported-type');
    expectEditionError(() => canonicalJson(1n), 'unsupported-type');
    expectEditionError(() => canonicalJson({ f: () => 1 }), 'unsupported-type', '/f');
  });

  it('refuses cycles but accepts a shared, non-cyclic object twice', () => {
    const cyclic: Record<string, unknown> = {};
    cyclic.self = cyclic;
    expectEditionError(() => canonicalJson(cyclic), 'cycle', '/self');
    const shared = { x: 1 };
    expect(canonicalJson([shared, shared])).toBe('[{"x":1},{"x":1}]');
  });
});
