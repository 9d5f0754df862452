import { PACK_LIMITS } from './pack-limits';

const number = { type: 'number' } as const;
const nonNegative = { type: 'number', minimum: 0 } as const;
const positive = { type: 'number', exclusiveMinimum: 0 } as const;
const text = { type: 'string', minLength: 1 } as const;
const sha256 = { type: 'string', pattern: '^[0-9a-f]{64}$' } as const;
const nullable = (schema: object): object => ({ oneOf: [{ type: 'null' }, schema] });
const closed = (properties: Record<string, object>, optional: readonly string[] = []): object => ({
  type: 'object',
  additionalProperties: false,
  required: Object.keys(properties).filter((k) => !optional.includes(k)),
  properties,
});

/**
 * The JSON Schema (draft 2020-12) of `manifest.json`, shipped in every pack as `manifest.schema.json`. Closed
 * objects (no unknown members) except the space definition's parts, which `lib/space` owns and checks itself.
 */
export const MANIFEST_SCHEMA = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  $id: `urn:epicycle:stimulus-pack:manifest:${PACK_LIMITS.schemaVersion}`,
  title: 'Epicycle stimulus pack manifest',
  description: 'What a stimulus pack holds and how it was made. Lengths in shape units unless named; angles in degrees; luminance figures are nominal sRGB values.',
  $defs: {
    file: closed({ path: { type: 'string', pattern: '^[A-Za-z0-9._-]+(/[A-Za-z0-9._-]+)*$' }, sha256, bytes: { type: 'integer', minimum: 0 } }),
    issue: closed({ field: text, code: text, message: text }),
    point: { type: 'array', prefixItems: [number, number], items: false, minItems: 2 },
    descriptor: {
      oneOf: [
        closed({ family: { const: 'radial' }, baseRadius: positive, terms: { type: 'array', items: closed({ k: { type: 'integer', minimum: 1 }, amplitude: number, phase: number }) } }),
        closed({ family: { const: 'elliptic' }, center: { $ref: '#/$defs/point' }, terms: { type: 'array', items: closed({ n: { type: 'integer', minimum: 1 }, a: number, b: number, c: number, d: number }) } }),
        closed({ family: { const: 'complex' }, terms: { type: 'array', items: closed({ k: { type: 'integer' }, re: number, im: number }) } }),
      ],
    },
    placement: closed({
      boundaryKey: text,
      category: { enum: ['A', 'B', null] },
      onBoundary: { type: 'boolean' },
      signedDistance: number,
      fraction: number,
    }),
    stimulus: closed({
      id: text,
      kind: { enum: ['layout', 'prototype'] },
      prototypeOf: nullable(closed({ boundaryKey: text, side: { enum: ['A', 'B'] } })),
      files: closed({ svg: { $ref: '#/$defs/file' }, png: { $ref: '#/$defs/file' } }),
      position: closed({ a: number, b: number }),
      polar: closed({ rho: nonNegative, angleDeg: { type: 'number', minimum: 0, exclusiveMaximum: 360 } }),
      descriptor: { $ref: '#/$defs/descriptor' },
      contourOffset: { $ref: '#/$defs/point' },
      metrics: closed({ area: nonNegative, perimeter: nonNegative, compactness: nonNegative, equalAreaDiameterDeg: nonNegative, maxExtentDeg: nonNegative }),
      boundaries: { type: 'array', items: { $ref: '#/$defs/placement' } },
    }),
  },
  ...closed(
    {
      notice: { type: 'string', description: 'Present only when the edition is not approved.' },
      schemaVersion: { const: PACK_LIMITS.schemaVersion },
      approved: { type: 'boolean' },
      product: closed({ name: text, version: text }),
      engine: closed({ version: text }),
      edition: closed({
        spaceName: text,
        number: { type: 'integer', minimum: 1 },
        contentHash: sha256,
        state: { enum: ['draft', 'in_review', 'approved', 'returned'] },
        createdAt: { type: 'string', pattern: '^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d+)?(Z|[+-]\\d{2}:\\d{2})$' },
      }),
      displayProfile: closed({
        name: text,
        resolutionPx: closed({ width: { type: 'integer', minimum: 1 }, height: { type: 'integer', minimum: 1 } }),
        widthCm: nullable(positive),
        pixelsPerCm: nullable(positive),
        viewingDistanceCm: positive,
        derived: closed({ pixelsPerCm: positive, pixelsPerDegree: positive }),
      }),
      render: closed({
        options: closed({
          sizeDeg: positive,
          sizeMeasure: { enum: ['equal-area-diameter', 'max-extent'] },
          canvasDeg: positive,
          style: { enum: ['silhouette', 'outline'] },
          strokeArcmin: nullable(positive),
          fill: { type: 'string', pattern: '^#[0-9a-f]{6}$' },
          background: { type: 'string', pattern: '^#[0-9a-f]{6}$' },
          antiAlias: { type: 'boolean' },
          transparent: { type: 'boolean' },
          samples: { type: 'integer', minimum: 64 },
        }),
        sizes: closed({ pixelsPerCm: positive, pixelsPerDegree: positive, stimulusPx: positive, canvasPx: { type: 'integer', minimum: 1 }, canvasMm: positive, strokePx: nonNegative }),
        pxPerUnit: positive,
        png: closed({ channels: { enum: ['grey', 'grey-alpha', 'rgb', 'rgba'] }, widthPx: { type: 'integer', minimum: 1 }, heightPx: { type: 'integer', minimum: 1 } }),
        contrast: closed({
          fillLuminance: { type: 'number', minimum: 0, maximum: 1 },
          backgroundLuminance: { type: 'number', minimum: 0, maximum: 1 },
          luminanceRatio: { type: 'number', minimum: 1 },
          weber: nullable(number),
          michelson: nullable({ type: 'number', minimum: 0, maximum: 1 }),
          basis: text,
        }),
        warnings: { type: 'array', items: { $ref: '#/$defs/issue' } },
      }),
      space: closed({
        definition: {
          type: 'object',
          required: ['seed', 'axes', 'extent', 'layout', 'normalization'],
          properties: {
            seed: { $ref: '#/$defs/descriptor' },
            axes: {
              type: 'array',
              minItems: 2,
              maxItems: 2,
              items: { type: 'object', required: ['label', 'changes'], properties: { label: { type: 'string' }, changes: { type: 'array', items: { type: 'object' } } } },
            },
            extent: positive,
            layout: { type: 'object', required: ['kind'], properties: { kind: { enum: ['rings', 'lattice', 'diameters'] } } },
            normalization: {
              type: 'object',
              required: ['scale', 'centroid'],
              properties: { scale: { enum: ['equal-area-radius', 'area', 'max-radius', 'perimeter', 'none'] }, centroid: { type: 'boolean' } },
            },
          },
        },
        layoutStimuli: { type: 'integer', minimum: 1 },
        prototypes: { type: 'integer', minimum: 0 },
      }),
      boundaries: { type: 'array', items: closed({ key: text, label: nullable({ type: 'string' }), angleDeg: { type: 'number', minimum: 0, exclusiveMaximum: 180 }, prototypeDistance: positive }) },
      rdms: { type: 'array', items: closed({ name: { enum: ['design', 'contour', 'silhouette'] }, path: text, unit: text, description: text }) },
      files: { type: 'array', items: { $ref: '#/$defs/file' } },
      stimuli: { type: 'array', minItems: 1, items: { $ref: '#/$defs/stimulus' } },
    },
    ['notice'],
  ),
} as const;
