import { createHash } from 'node:crypto';
import Ajv2020 from 'ajv/dist/2020';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  buildPack,
  checkPack,
  checkPackManifest,
  checkPackManifestSchema,
  MANIFEST_SCHEMA,
  parsePackSums,
  SUPPORTED_SCHEMA_KEYWORDS,
  type BuiltPack,
  type PackInput,
} from '@/lib/pack';

const INPUT: PackInput = {
  edition: { spaceName: 'Check lobes', number: 2, contentHash: 'ab12'.repeat(16), state: 'approved', createdAt: '2025-02-03T04:05:06Z' },
  definition: {
    seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.08, phase: 0 }] },
    axes: [
      { label: 'Lobes 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
      { label: 'Lobes 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.04 }] },
    ],
    extent: 1,
    layout: { kind: 'rings', rings: 1, spokes: 4 },
    normalization: { scale: 'equal-area-radius', centroid: true },
  },
  boundaries: [{ key: 'horizontal', angleDeg: 0 }],
  profile: { name: 'Test display', resolutionPx: { width: 1920, height: 1080 }, widthCm: 48, pixelsPerCm: null, viewingDistanceCm: 57 },
  render: { sizeDeg: 1.2, sizeMeasure: 'equal-area-diameter', canvasDeg: 1.8, style: 'silhouette', strokeArcmin: null, fill: 0, background: 128, antiAlias: true, transparent: false, samples: 128 },
  versions: { product: '0.1.0', engine: '0.1.0' },
};

const nodeSha = (b: Uint8Array): string => createHash('sha256').update(b).digest('hex');
// The check never decodes PNGs; distinct bytes per stimulus are enough to tell files apart.
const fakePng = async (r: { id: string }) => new TextEncoder().encode(`\x89PNG fake ${r.id}`);
const text = (s: string) => new TextEncoder().encode(s);

let pack: BuiltPack;
let files: Map<string, Uint8Array>;

beforeAll(async () => {
  pack = await buildPack(INPUT, { renderPng: fakePng, sha256Hex: nodeSha });
  files = new Map(pack.files.map((f) => [f.path, f.data]));
});

const copy = () => new Map(files);
const decode = (b: Uint8Array | undefined) => new TextDecoder().decode(b);

describe('checkPack on a whole pack', () => {
  it('reports a freshly built pack intact, with the edition it claims, with either hash function', () => {
    for (const sha256Hex of [undefined, nodeSha]) {
      const r = checkPack(files, sha256Hex ? { sha256Hex } : {});
      expect(r.verdict, JSON.stringify(r.problems)).toBe('intact');
      expect(r.problems).toEqual([]);
      expect(r.counts.listed).toBe(files.size - 1);
      expect(r.counts.intact).toBe(files.size - 1);
      expect(r.manifest).toMatchObject({ present: true, parsed: true, hashMatchesSums: true, schemaIssues: [] });
      expect(r.edition).toEqual({ spaceName: 'Check lobes', number: 2, contentHash: INPUT.edition.contentHash, state: 'approved', createdAt: INPUT.edition.createdAt });
    }
  });

  it('one altered byte in any file → that file, and only it, is reported altered with both hashes', () => {
    const paths = [...files.keys()].filter((p) => p !== 'SHA256SUMS');
    fc.assert(
      fc.property(fc.constantFrom(...paths), fc.nat(), fc.integer({ min: 1, max: 255 }), (path, at, flip) => {
        const original = files.get(path)!;
        const changed = Uint8Array.from(original);
        const i = at % changed.length;
        changed[i] = changed[i]! ^ flip;
        const tampered = copy();
        tampered.set(path, changed);
        const r = checkPack(tampered, { sha256Hex: nodeSha });
        expect(r.verdict).toBe('altered');
        expect(r.altered).toEqual([{ path, expected: nodeSha(original), actual: nodeSha(changed) }]);
        expect(r.missing).toEqual([]);
        expect(r.extra).toEqual([]);
        if (path === 'manifest.json') expect(r.manifest.hashMatchesSums).toBe(false);
      }),
      { numRuns: 40, seed: 9 },
    );
  });

  it('a removed file → missing; an added file → extra', () => {
    const svg = [...files.keys()].find((p) => p.startsWith('stimuli/svg/'))!;
    const without = copy();
    without.delete(svg);
    const r = checkPack(without);
    expect(r.verdict).toBe('incomplete');
    expect(r.missing).toEqual([svg]);
    expect(r.altered).toEqual([]);
    expect(r.problems[0]).toMatchObject({ code: 'missing', path: svg });

    const added = copy();
    added.set('notes/extra.txt', text('hello'));
    const e = checkPack(added);
    expect(e.verdict).toBe('inconsistent');
    expect(e.extra).toEqual(['notes/extra.txt']);
    expect(e.problems.map((p) => p.code)).toEqual(['extra']);
  });

  it('a file altered with SHA256SUMS rewritten to match is still caught by the manifest', () => {
    const csv = 'stimuli.csv';
    const changed = text(decode(files.get(csv)) + 'x,y\r\n');
    const tampered = copy();
    tampered.set(csv, changed);
    const sums = decode(files.get('SHA256SUMS')).replace(nodeSha(files.get(csv)!), nodeSha(changed));
    tampered.set('SHA256SUMS', text(sums));
    const r = checkPack(tampered);
    expect(r.verdict).toBe('altered');
    expect(r.altered).toEqual([{ path: csv, expected: nodeSha(files.get(csv)!), actual: nodeSha(changed) }]);
    expect(r.problems.some((p) => p.code === 'lists-disagree' && p.path === csv)).toBe(true);
  });

  it('a tampered manifest that still hashes right (SHA256SUMS rewritten) is flagged by the schema and the lists', () => {
    const manifest = JSON.parse(decode(files.get('manifest.json'))) as Record<string, unknown>;
    const forged = { ...manifest, approved: 'yes', files: (manifest.files as unknown[]).slice(1), surprise: 1 };
    const forgedText = text(JSON.stringify(forged, null, 2) + '\n');
    const tampered = copy();
    tampered.set('manifest.json', forgedText);
    tampered.set('SHA256SUMS', text(decode(files.get('SHA256SUMS')).replace(nodeSha(files.get('manifest.json')!), nodeSha(forgedText))));
    const r = checkPack(tampered);
    expect(r.manifest.hashMatchesSums).toBe(true);
    expect(r.verdict).toBe('inconsistent');
    const pointers = r.manifest.schemaIssues.map((i) => i.pointer);
    expect(pointers).toContain('/approved');
    expect(pointers).toContain('/surprise');
    expect(r.problems.some((p) => p.code === 'lists-disagree')).toBe(true);
  });

  it('a manifest that is not JSON, and a pack with neither list', () => {
    const broken = copy();
    broken.set('manifest.json', text('{ not json'));
    const r = checkPack(broken);
    expect(r.manifest.parsed).toBe(false);
    expect(r.edition).toBeNull();
    expect(r.verdict).toBe('altered');
    expect(r.problems.map((p) => p.code)).toContain('manifest-json');

    const foreign = checkPack(new Map([['photo.jpg', text('x')], ['notes.txt', text('y')]]));
    expect(foreign.verdict).toBe('unreadable');
    expect(foreign.summary).toMatch(/neither a SHA256SUMS/);
  });

  it('finds a pack zipped again inside one folder', () => {
    const nested = new Map([...files].map(([p, b]) => [`my-pack/${p}`, b]));
    const r = checkPack(nested);
    expect(r.verdict).toBe('intact');
    expect(r.folder).toBe('my-pack/');
    expect(r.summary).toContain('my-pack/');
  });
});

describe('checkPackManifest (manifest and SHA256SUMS only)', () => {
  it('an untouched pair → intact, the files not checked', () => {
    const r = checkPackManifest(decode(files.get('manifest.json')), decode(files.get('SHA256SUMS')));
    expect(r.verdict).toBe('intact');
    expect(r.mode).toBe('manifest');
    expect(r.counts).toMatchObject({ checked: 1, intact: 1, altered: 0 });
    expect(r.summary).toMatch(/not checked/);
    expect(r.edition?.number).toBe(2);
  });

  it('a manifest changed by one character → altered; a SHA256SUMS with a line dropped → the lists disagree', () => {
    const m = decode(files.get('manifest.json'));
    const r = checkPackManifest(m.replace('"Check lobes"', '"Check lobez"'), decode(files.get('SHA256SUMS')));
    expect(r.verdict).toBe('altered');
    expect(r.altered[0]?.path).toBe('manifest.json');
    expect(r.edition?.spaceName).toBe('Check lobez');

    const lines = decode(files.get('SHA256SUMS')).split('\n');
    const dropped = lines.filter((l) => !l.endsWith('stimuli.csv')).join('\n');
    const d = checkPackManifest(m, dropped);
    expect(d.verdict).toBe('inconsistent');
    expect(d.problems).toEqual([expect.objectContaining({ code: 'lists-disagree', path: 'stimuli.csv' })]);
  });
});

describe('parsePackSums', () => {
  it('reads text and binary mode, CRLF and ./ prefixes; reports bad and duplicate lines', () => {
    const h = 'a'.repeat(64);
    const s = parsePackSums(`${h}  a.txt\r\n${h.toUpperCase()} *./b.txt\n\nnot a line\n${h}  a.txt\n`);
    expect(s.entries.map((e) => [e.path, e.sha256, e.line])).toEqual([['a.txt', h, 1], ['b.txt', h, 2]]);
    expect(s.badLines).toEqual([4]);
    expect(s.duplicates).toEqual(['a.txt']);
  });
});

describe('checkPackManifestSchema agrees with ajv on MANIFEST_SCHEMA', () => {
  const ajv = new Ajv2020({ strict: true, allErrors: true });
  const validate = ajv.compile(MANIFEST_SCHEMA);

  it('uses only keywords the checker supports', () => {
    const used = new Set<string>();
    const walk = (node: unknown, isProperties = false): void => {
      if (Array.isArray(node)) return node.forEach((n) => walk(n));
      if (typeof node !== 'object' || node === null) return;
      for (const [k, v] of Object.entries(node)) {
        if (!isProperties) used.add(k);
        walk(v, !isProperties && (k === 'properties' || k === '$defs'));
      }
    };
    walk(MANIFEST_SCHEMA);
    const supported = new Set<string>(SUPPORTED_SCHEMA_KEYWORDS);
    expect([...used].filter((k) => !supported.has(k))).toEqual([]);
  });

  it('on the real manifest and on random mutations of it', () => {
    const manifest = JSON.parse(decode(files.get('manifest.json'))) as unknown;
    expect(validate(manifest)).toBe(true);
    expect(checkPackManifestSchema(manifest)).toEqual([]);
    const paths: (string | number)[][] = [];
    const collect = (node: unknown, at: (string | number)[]) => {
      paths.push(at);
      if (Array.isArray(node)) node.slice(0, 2).forEach((n, i) => collect(n, [...at, i]));
      else if (typeof node === 'object' && node !== null) for (const [k, v] of Object.entries(node)) collect(v, [...at, k]);
    };
    collect(manifest, []);
    const replacements = [null, -1, 0, 1.5, 400, '', 'x', true, [], {}, 'f'.repeat(64)];
    fc.assert(
      fc.property(fc.constantFrom(...paths.slice(1)), fc.constantFrom(...replacements, 'delete'), (path, replacement) => {
        const mutated = structuredClone(manifest) as Record<string | number, unknown>;
        let parent: Record<string | number, unknown> = mutated;
        for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
        const last = path[path.length - 1]!;
        if (replacement === 'delete') {
          if (Array.isArray(parent)) parent.splice(Number(last), 1);
          else delete parent[last];
        } else parent[last] = replacement;
        const ours = checkPackManifestSchema(mutated);
        expect(ours.length === 0, `${path.join('/')} = ${JSON.stringify(replacement)}: ${JSON.stringify(ours)} vs ${JSON.stringify(validate.errors)}`).toBe(validate(mutated));
      }),
      { numRuns: 400, seed: 21 },
    );
  });
});
