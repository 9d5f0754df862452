// Hostile uploads: every file of tests/fixtures/hostile/ (and the ones made here: a 50 MB SVG, deep nesting, the
// zip corpus of pack-zips.ts) is sent to the route that takes its kind — the seed-shape outline fit (SVG, CSV) and
// the pack check (zip). Each must be refused with problem details that do not echo the payload, and nothing may be
// stored: the lab's seed shapes, pack checks and audit trail are unchanged afterwards.
import { readdirSync, readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { toHandler } from '@/lib/server/http';
import { createLabWithEveryRole, type TestLab } from '../support/actors';
import * as zips from '../fixtures/hostile/pack-zips';

const HOSTILE_DIR = new URL('../fixtures/hostile/', import.meta.url);
const MIB = 1024 * 1024;
/**
 * Words of the payloads that must never come back in an answer: it names what was found in its own words. (A CSV
 * cell the parser could not read is quoted back, inside JSON, which is inert; CSV exports are checked elsewhere.)
 */
const ECHOES = ['alert(1)', 'onload=', 'file:///etc/passwd', 'example.invalid', 'javascript:alert', 'lol9', 'pwned'];

const TYPES: Record<string, string> = { svg: 'image/svg+xml', csv: 'text/csv' };

/** The fit route called as a real request; `body` may be a stream (no content-length, as a chunked upload). */
async function fit(lab: TestLab, body: string | ReadableStream<Uint8Array>, type: string): Promise<{ status: number; type: string; text: string }> {
  const req = new Request(`http://127.0.0.1/api/v1/labs/${lab.slug}/seed-shapes/fit?family=elliptic&harmonics=8`, {
    method: 'POST',
    headers: { cookie: lab.members.designer.cookie, 'content-type': type },
    body,
    ...(typeof body === 'string' ? {} : { duplex: 'half' }),
  } as RequestInit);
  const res = await toHandler(api.fitSeedShapeRoute)(req, { params: Promise.resolve({ lab: lab.slug }) });
  return { status: res.status, type: res.headers.get('content-type') ?? '', text: await res.text() };
}

async function checkZip(lab: TestLab, zip: Buffer): Promise<{ status: number; type: string; text: string }> {
  const req = new Request(`http://127.0.0.1/api/v1/labs/${lab.slug}/pack-checks`, {
    method: 'POST',
    headers: { cookie: lab.members.experimenter.cookie, 'content-type': 'application/zip' },
    body: new Uint8Array(zip),
  });
  const res = await toHandler(api.checkPackRoute)(req, { params: Promise.resolve({ lab: lab.slug }) });
  return { status: res.status, type: res.headers.get('content-type') ?? '', text: await res.text() };
}

/** What the lab holds: its seed shapes and its audit trail (a stored upload would show in one of them). */
async function footprint(lab: TestLab): Promise<{ seeds: number; events: number }> {
  const db = getDb();
  const seeds = await db.selectFrom('seed_shapes').select(db.fn.countAll<string>().as('n')).where('lab_id', '=', lab.id).executeTakeFirstOrThrow();
  const events = await db.selectFrom('audit_events').select(db.fn.countAll<string>().as('n')).where('lab_id', '=', lab.id).executeTakeFirstOrThrow();
  return { seeds: Number(seeds.n), events: Number(events.n) };
}

/** A body of `total` bytes streamed in 1 MiB chunks, counting how many chunks the server pulled. */
function streamOf(prefix: string, total: number): { stream: ReadableStream<Uint8Array>; pulled: () => number } {
  let sent = 0;
  let chunks = 0;
  const filler = new TextEncoder().encode(' '.repeat(MIB));
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= total) return controller.close();
      const chunk = sent === 0 ? new TextEncoder().encode(prefix + ' '.repeat(MIB - prefix.length)) : filler;
      sent += chunk.byteLength;
      chunks += 1;
      controller.enqueue(chunk);
    },
  });
  return { stream, pulled: () => chunks };
}

describe('hostile uploads', () => {
  let lab: TestLab;
  const tried: string[] = [];

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    console.info(`hostile uploads: ${tried.length} inputs tried, none stored, every hostile one refused (${tried.join(', ')})`);
    await getDb().destroy();
  });

  const expectRefused = (name: string, r: { status: number; type: string; text: string }, statuses: number[] = [400, 413]) => {
    tried.push(name);
    expect(statuses, `${name}: ${r.status} ${r.text.slice(0, 300)}`).toContain(r.status);
    expect(r.type, name).toContain('application/problem+json');
    for (const echo of ECHOES) expect(r.text, `${name} echoes ${echo}`).not.toContain(echo);
  };

  it('every SVG and CSV of the corpus is refused with problem details, and nothing is stored', async () => {
    const before = await footprint(lab);
    const files = readdirSync(HOSTILE_DIR).filter((f) => /\.(svg|csv)$/.test(f));
    expect(files.length).toBeGreaterThanOrEqual(14);
    for (const file of files) {
      const text = readFileSync(new URL(file, HOSTILE_DIR), 'utf8');
      expectRefused(file, await fit(lab, text, TYPES[file.split('.').pop()!]!));
    }
    expect(await footprint(lab)).toEqual(before);
  });

  it('names what it found in an SVG, in its own words', async () => {
    const read = (f: string) => readFileSync(new URL(f, HOSTILE_DIR), 'utf8');
    const cases: [string, RegExp][] = [
      ['xxe.svg', /DOCTYPE/],
      ['billion-laughs.svg', /entity/],
      ['css-url.svg', /url\(\)/],
      ['javascript-href.svg', /external reference|javascript: URL/],
      ['use-external.svg', /embedded or linked element|external reference/],
      ['stylesheet-pi.svg', /stylesheet processing instruction/],
    ];
    for (const [file, message] of cases) {
      const r = await fit(lab, read(file), 'image/svg+xml');
      expect((JSON.parse(r.text) as { detail: string }).detail, file).toMatch(message);
    }
  });

  it('deep nesting, NaN and formula cells are refused without a server error', async () => {
    const before = await footprint(lab);
    const deep = `<svg xmlns="http://www.w3.org/2000/svg">${'<g>'.repeat(100_000)}<path d="M0 0 L1 0 L0 1 Z"/>${'</g>'.repeat(100_000)}</svg>`;
    expectRefused('100,000 nested groups', await fit(lab, deep, 'image/svg+xml'));
    const shallowButWide = `<svg xmlns="http://www.w3.org/2000/svg">${'<path d="M0 0 L1 0 L0 1 Z"/>'.repeat(30_000)}</svg>`;
    tried.push('30,000 sibling paths (no server error; the largest outline may be fitted)');
    expect((await fit(lab, shallowButWide, 'image/svg+xml')).status).toBeLessThan(500);
    expectRefused('a CSV of formulas', await fit(lab, '=1+2,3\n@A1,4\n+5,6\n-7+8,9\n', 'text/csv'));
    expect(await footprint(lab)).toEqual(before);
  });

  it('a 50 MB SVG is cut off at the 1 MiB cap, declared or streamed, without reading the rest', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg"><!--';
    const declared = new Request(`http://127.0.0.1/api/v1/labs/${lab.slug}/seed-shapes/fit?family=elliptic&harmonics=8`, {
      method: 'POST',
      headers: { cookie: lab.members.designer.cookie, 'content-type': 'image/svg+xml', 'content-length': String(50 * MIB) },
      body: 'x',
    });
    const r1 = await toHandler(api.fitSeedShapeRoute)(declared, { params: Promise.resolve({ lab: lab.slug }) });
    expectRefused('a 50 MB SVG (declared length)', { status: r1.status, type: r1.headers.get('content-type') ?? '', text: await r1.text() }, [413]);
    const { stream, pulled } = streamOf(svg, 50 * MIB);
    expectRefused('a 50 MB SVG (streamed, no length)', await fit(lab, stream, 'image/svg+xml'), [413]);
    expect(pulled(), 'chunks of 1 MiB read before the cut').toBeLessThanOrEqual(3);
  });

  it('zips: a bomb, a lying bomb, traversal names, a symbolic link and zips in zips are refused', async () => {
    const before = await footprint(lab);
    const cases: [string, () => Buffer][] = [
      ['a zip bomb', zips.zipBomb],
      ['a zip bomb whose header lies', zips.lyingZipBomb],
      ['a symbolic link entry', zips.symlinkZip],
      ['zips nested in zips', zips.nestedZip],
      ...zips.UNSAFE_NAMES.map((name): [string, () => Buffer] => [`the entry name ${JSON.stringify(String(name))}`, () => zips.traversalZip(name)]),
    ];
    for (const [name, make] of cases) expectRefused(name, await checkZip(lab, make()));
    expect(await footprint(lab)).toEqual(before);
  });
});
