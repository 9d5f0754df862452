import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROBLEM_CONTENT_TYPE } from '@/lib/errors';
import { buildPack, type BuiltPack, type PackInput } from '@/lib/pack';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { toHandler } from '@/lib/server/http';
import { readPackZip } from '@/lib/server/pack-check/read-pack-zip';
import { PACK_ZIP_LIMITS } from '@/lib/server/pack-check/pack-zip-limits';
import { PackZipError } from '@/lib/server/pack-check/pack-zip-error';
import { ROLES } from '@/lib/server/policy';
import type { PackCheckResult } from '@/lib/schemas/pack-check';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import * as hostile from '../fixtures/hostile/pack-zips';

const SEED = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0.2 }] } as const;
const SETTINGS = {
  axes: [
    { label: 'Lobe 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
    { label: 'Lobe 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
  ],
  extent: 1,
  layout: { kind: 'rings', rings: 1, spokes: 4 },
  normalization: { scale: 'equal-area-radius', centroid: true },
} as const;

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
const fakePng = async (r: { id: string }) => new TextEncoder().encode(`\x89PNG fake ${r.id}`);

type Edition = { number: number; contentHash: string; spaceName: string; state: 'draft' | 'in_review' | 'approved' | 'returned'; createdAt: string };
type Problem = { status: number; code: string; detail: string; errors?: Record<string, string[]> };

async function packFor(edition: Edition): Promise<BuiltPack> {
  const input: PackInput = {
    edition: { spaceName: edition.spaceName, number: edition.number, contentHash: edition.contentHash, state: edition.state, createdAt: edition.createdAt.replace(/\.\d+Z$/, 'Z') },
    definition: { seed: SEED, ...SETTINGS } as PackInput['definition'],
    boundaries: [{ key: 'h', angleDeg: 0 }],
    profile: { name: 'Lab screen', resolutionPx: { width: 1920, height: 1080 }, widthCm: 53, pixelsPerCm: null, viewingDistanceCm: 57 },
    render: { sizeDeg: 1.2, sizeMeasure: 'equal-area-diameter', canvasDeg: 1.8, style: 'silhouette', strokeArcmin: null, fill: 0, background: 128, antiAlias: true, transparent: false, samples: 128 },
    versions: { product: '0.1.0', engine: '0.1.0' },
  };
  return buildPack(input, { renderPng: fakePng, sha256Hex: sha });
}

async function zipOf(pack: BuiltPack): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  await pack.writeZip((c) => {
    chunks.push(c);
  });
  return Buffer.concat(chunks);
}

/** Posts raw bytes (or JSON) to the pack check as a browser would. */
async function post(slug: string, body: Buffer | object | undefined, cookie?: string, headers: Record<string, string> = {}): Promise<{ status: number; type: string | null; body: unknown }> {
  const isBytes = Buffer.isBuffer(body);
  const req = new Request(`http://127.0.0.1/api/v1/labs/${slug}/pack-checks`, {
    method: 'POST',
    headers: { ...(cookie ? { cookie } : {}), 'content-type': isBytes ? 'application/zip' : 'application/json', ...headers },
    body: body === undefined ? undefined : isBytes ? new Uint8Array(body) : JSON.stringify(body),
  });
  const res = await toHandler(api.checkPackRoute)(req, { params: Promise.resolve({ lab: slug }) });
  const text = await res.text();
  return { status: res.status, type: res.headers.get('content-type'), body: text ? JSON.parse(text) : undefined };
}

describe('the pack check (POST /api/v1/labs/{lab}/pack-checks)', () => {
  let lab: TestLab;
  let other: TestLab;
  let edition: Edition;
  let pack: BuiltPack;
  let zip: Buffer;
  const as = (role: (typeof ROLES)[number], l: TestLab = lab) => l.members[role].cookie;
  const file = (path: string) => pack.files.find((f) => f.path === path)!.data;
  const text = (path: string) => new TextDecoder().decode(file(path));

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    other = await createLabWithEveryRole(getDb());
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Seed', descriptor: SEED }, cookie: as('designer') });
    const space = await callRoute(api.createShapeSpaceRoute, {
      params: { lab: lab.slug },
      body: { name: 'Checked space', seedShapeId: (seed.body as { id: string }).id, ...SETTINGS, equalize: false },
      cookie: as('designer'),
    });
    expect(space.status, JSON.stringify(space.body)).toBe(201);
    const frozen = await callRoute(api.freezeEditionRoute, { params: { lab: lab.slug, spaceId: (space.body as { id: string }).id }, body: { changeNote: 'for packs' }, cookie: as('designer') });
    expect(frozen.status, JSON.stringify(frozen.body)).toBe(201);
    edition = frozen.body as Edition;
    pack = await packFor(edition);
    zip = await zipOf(pack);
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('a pack made from an edition of the lab is intact and matches that edition, for every role (Reviewer included)', async () => {
    for (const role of ROLES) {
      const r = await post(lab.slug, zip, as(role));
      expect(r.status, JSON.stringify(r.body)).toBe(200);
      const result = r.body as PackCheckResult;
      expect(result.verdict).toBe('intact');
      expect(result.counts.intact).toBe(pack.files.length - 1);
      expect(result.edition.status).toBe('matches');
      expect(result.edition.known).toMatchObject({ number: edition.number, contentHash: edition.contentHash, spaceName: 'Checked space' });
    }
  });

  it('a tampered copy is reported altered, naming the file and both hashes', async () => {
    const target = pack.files.find((f) => f.path.startsWith('stimuli/svg/'))!;
    const changed = Buffer.from(new TextDecoder().decode(target.data).replace('<path', '<path data-x="1"'));
    const tampered = hostile.rawZip(pack.files.map((f) => ({ name: f.path, data: f.path === target.path ? changed : Buffer.from(f.data) })));
    const r = await post(lab.slug, tampered, as('experimenter'));
    expect(r.status).toBe(200);
    const result = r.body as PackCheckResult;
    expect(result.verdict).toBe('altered');
    expect(result.altered).toEqual([{ path: target.path, expected: target.sha256, actual: sha(changed) }]);
    expect(result.summary).toMatch(/1 file differs/);
  });

  it('manifest + SHA256SUMS only: intact and matched; a changed manifest is altered', async () => {
    const ok = await post(lab.slug, { manifest: text('manifest.json'), sums: text('SHA256SUMS') }, as('reviewer'));
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect((ok.body as PackCheckResult).verdict).toBe('intact');
    expect((ok.body as PackCheckResult).mode).toBe('manifest');
    expect((ok.body as PackCheckResult).edition.status).toBe('matches');
    const bad = await post(lab.slug, { manifest: text('manifest.json').replace('"samples": 128', '"samples": 256'), sums: text('SHA256SUMS') }, as('reviewer'));
    expect((bad.body as PackCheckResult).verdict).toBe('altered');
    const missing = await post(lab.slug, { manifest: text('manifest.json') }, as('reviewer'));
    expect(missing.status).toBe(400);
    expect((missing.body as Problem).errors?.sums?.[0]).toMatch(/SHA256SUMS/);
  });

  it('a pack claiming a content hash this lab does not have → unknown edition; a wrong number for a known hash → differs', async () => {
    const forged = await packFor({ ...edition, contentHash: 'f'.repeat(64) });
    const r = await post(lab.slug, await zipOf(forged), as('owner'));
    expect(r.status).toBe(200);
    expect((r.body as PackCheckResult).verdict).toBe('intact');
    expect((r.body as PackCheckResult).edition).toMatchObject({ status: 'unknown', known: null, claimed: { contentHash: 'f'.repeat(64) } });
    expect((r.body as PackCheckResult).edition.message).toMatch(/not from this lab/);
    // The same pack checked in the other lab: intact, but not one of theirs.
    const elsewhere = await post(other.slug, zip, as('owner', other));
    expect((elsewhere.body as PackCheckResult).edition.status).toBe('unknown');

    const renumbered = await packFor({ ...edition, number: edition.number + 40 });
    const d = await post(lab.slug, await zipOf(renumbered), as('owner'));
    expect((d.body as PackCheckResult).edition.status).toBe('differs');
  });

  it('another lab’s member gets 404, and nobody signed out gets in; the body is never read first', async () => {
    const r = await post(lab.slug, zip, as('owner', other));
    expect(r.status).toBe(404);
    expect((await post(lab.slug, zip)).status).toBe(401);
    // A hostile body from an outsider is refused for who they are, not for what they sent.
    expect((await post(lab.slug, hostile.traversalZip('../evil.txt'), as('reviewer', other))).status).toBe(404);
  });

  const refusals: [string, () => Buffer, number, RegExp][] = [
    ['a zip bomb (200 MiB of zeros, honest headers)', hostile.zipBomb, 413, /zip bomb/],
    ['a zip bomb whose headers lie about its size', hostile.lyingZipBomb, 413, /more bytes than its header declares|zip bomb/],
    ['more than 20,000 entries', () => hostile.tooManyEntries(), 413, /20,001 entries; the limit is 20,000/],
    ['a symbolic link entry', hostile.symlinkZip, 400, /symbolic link/],
    ['an encrypted entry', hostile.encryptedZip, 400, /encrypted/],
    ['an unsupported compression method', hostile.unsupportedMethodZip, 400, /compression method 12/],
    ['the same name twice', hostile.duplicateNameZip, 400, /twice/],
    ['a foreign zip (valid, no manifest)', hostile.foreignZip, 400, /not a stimulus pack/],
    ['a zip nested in zips', hostile.nestedZip, 400, /not a stimulus pack/],
    ['bytes that are no zip', hostile.notAZip, 400, /cannot be read as a zip/],
    ['an entry with broken deflate data', hostile.badDeflateZip, 400, /The entry SHA256SUMS cannot be read/],
    ['an empty upload', () => Buffer.alloc(0), 400, /empty/],
  ];
  for (const [what, make, status, message] of refusals) {
    it(`refuses ${what}: ${status} problem details with a clear message`, async () => {
      const r = await post(lab.slug, make(), as('experimenter'));
      expect(r.status, JSON.stringify(r.body)).toBe(status);
      expect(r.type).toBe(PROBLEM_CONTENT_TYPE);
      expect((r.body as Problem).detail).toMatch(message);
      expect((r.body as Problem).errors?.file?.[0]).toBeDefined();
    });
  }

  it('refuses every path-traversal and unsafe name with 400', async () => {
    for (const name of hostile.UNSAFE_NAMES) {
      const r = await post(lab.slug, hostile.traversalZip(name), as('experimenter'));
      expect(r.status, String(name)).toBe(400);
      expect((r.body as Problem).code).toBe('validation:pack-zip');
      expect((r.body as Problem).detail).toMatch(/climbs out|absolute path|drive letter|backslash|control character/);
    }
  });

  it('refuses a truncated pack as damaged, and an upload declared over the cap before reading it', async () => {
    const r = await post(lab.slug, hostile.truncatedZip(zip), as('experimenter'));
    expect(r.status).toBe(400);
    expect((r.body as Problem).detail).toMatch(/damaged or not a zip/);
    const big = await post(lab.slug, Buffer.from('PK'), as('experimenter'), { 'content-length': String(PACK_ZIP_LIMITS.maxZipBytes + 1) });
    expect(big.status).toBe(413);
    expect((big.body as Problem).detail).toMatch(/over 600 MiB/);
  });

  it('readPackZip counts inflated bytes against its limits, whatever the headers say', async () => {
    const small = { ...PACK_ZIP_LIMITS, maxTotalBytes: 4000, maxEntryBytes: 3000 };
    const honest = hostile.rawZip([{ name: 'a.txt', data: Buffer.alloc(2500, 97) }, { name: 'b.txt', data: Buffer.alloc(2500, 98) }]);
    await expect(readPackZip(honest, small)).rejects.toMatchObject({ code: 'too-much-data' });
    const oneBig = hostile.rawZip([{ name: 'a.txt', data: Buffer.alloc(3500, 97) }]);
    await expect(readPackZip(oneBig, small)).rejects.toMatchObject({ code: 'too-much-data' });
    const underDeclared = hostile.rawZip([{ name: 'a.txt', data: Buffer.alloc(3500, 97), declaredSize: 10 }]);
    await expect(readPackZip(underDeclared, small)).rejects.toBeInstanceOf(PackZipError);
    const fine = await readPackZip(hostile.rawZip([{ name: 'manifest.json', data: Buffer.from('{}') }, { name: 'dir/', method: 0 }, { name: 'dir/x.txt', data: Buffer.from('x') }]), small);
    expect([...fine.keys()]).toEqual(['manifest.json', 'dir/x.txt']);
    expect(fine.get('dir/x.txt')).toEqual({ sha256: sha(Buffer.from('x')), size: 1 });
  });
});
