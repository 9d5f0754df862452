import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { buildPack, PackError, runPackJob, type BuiltPack, type PackInput, type PackJobRunner, type PackManifest } from '@/lib/pack';
import { renderPng } from '@/lib/render/render-png';
import { PackPool } from '@/lib/server/jobs/pack-pool';

const INPUT: PackInput = {
  edition: { spaceName: 'Test lobes', number: 3, contentHash: 'c0ffee'.padEnd(64, '0'), state: 'approved', createdAt: '2024-05-06T07:08:10Z' },
  definition: {
    seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.08, phase: 0 }] },
    axes: [
      { label: 'Lobes 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
      { label: 'Lobes 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.04 }] },
    ],
    extent: 1,
    layout: { kind: 'rings', rings: 2, spokes: 6 },
    normalization: { scale: 'equal-area-radius', centroid: true },
  },
  boundaries: [{ key: 'horizontal', label: 'Horizontal, "quoted"', angleDeg: 0 }, { key: 'oblique', angleDeg: 60 }],
  profile: { name: 'Test display', resolutionPx: { width: 1920, height: 1080 }, widthCm: 48, pixelsPerCm: null, viewingDistanceCm: 57 },
  render: { sizeDeg: 1.2, sizeMeasure: 'equal-area-diameter', canvasDeg: 1.8, style: 'silhouette', strokeArcmin: null, fill: 0, background: 128, antiAlias: true, transparent: false, samples: 256 },
  versions: { product: '0.1.0', engine: '0.1.0' },
};

const backends = { renderPng, sha256Hex: (b: Uint8Array) => createHash('sha256').update(b).digest('hex') };
const sha = (b: Uint8Array): string => createHash('sha256').update(b).digest('hex');

async function zipBytes(pack: BuiltPack): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  await pack.writeZip((c) => {
    chunks.push(c);
  });
  return Buffer.concat(chunks);
}

interface Entry {
  readonly name: string;
  readonly data: Buffer;
  readonly date: Date;
}

/** Every entry of a zip, read with yauzl (a second zip implementation). */
function readZip(bytes: Buffer): Promise<Entry[]> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: true }, (error, zip) => {
      if (error || !zip) return reject(error);
      const entries: Entry[] = [];
      zip.on('entry', (entry: yauzl.Entry) => {
        zip.openReadStream(entry, (err, stream) => {
          if (err || !stream) return reject(err);
          const parts: Buffer[] = [];
          stream.on('data', (p: Buffer) => parts.push(p));
          stream.on('end', () => {
            entries.push({ name: entry.fileName, data: Buffer.concat(parts), date: entry.getLastModDate({ timezone: 'UTC' }) });
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(entries));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}

let pack: BuiltPack;
let zip: Buffer;
let entries: Entry[];
let work: string;

beforeAll(async () => {
  pack = await buildPack(INPUT, backends);
  zip = await zipBytes(pack);
  entries = await readZip(zip);
  work = mkdtempSync(join(tmpdir(), 'pack-test-'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

const entry = (name: string): Buffer => {
  const found = entries.find((e) => e.name === name);
  if (!found) throw new Error(`no ${name} in the zip`);
  return found.data;
};

describe('stimulus pack zip', () => {
  it('holds every expected file, sorted, without folder entries, dated from the edition', () => {
    const names = entries.map((e) => e.name);
    // 2 rings × 6 spokes + centre, and two prototypes per boundary.
    expect(pack.manifest.stimuli).toHaveLength(13 + 4);
    for (const fixed of ['manifest.json', 'manifest.schema.json', 'stimuli.csv', 'trial-list.csv', 'README.txt', 'SHA256SUMS', 'rdm/design.tsv', 'rdm/contour.tsv', 'rdm/silhouette.tsv']) {
      expect(names).toContain(fixed);
    }
    for (const s of pack.manifest.stimuli) {
      expect(names).toContain(`stimuli/svg/${s.id}.svg`);
      expect(names).toContain(`stimuli/png/${s.id}.png`);
    }
    expect(names).toHaveLength(9 + 2 * 17);
    expect(names.some((n) => n.endsWith('/'))).toBe(false);
    expect([...names].sort()).toEqual(names);
    for (const e of entries) expect(e.date.toISOString()).toBe('2024-05-06T07:08:10.000Z');
  });

  it('every SHA-256 in the manifest and in SHA256SUMS matches the bytes', () => {
    const manifest = JSON.parse(entry('manifest.json').toString('utf8')) as PackManifest;
    for (const s of manifest.stimuli) {
      for (const f of [s.files.svg, s.files.png]) {
        expect(sha(entry(f.path))).toBe(f.sha256);
        expect(entry(f.path).length).toBe(f.bytes);
      }
    }
    for (const f of manifest.files) expect(sha(entry(f.path))).toBe(f.sha256);
    const lines = entry('SHA256SUMS').toString('utf8').trimEnd().split('\n');
    expect(lines).toHaveLength(entries.length - 1);
    for (const line of lines) {
      const [hash, path] = line.split('  ');
      expect(sha(entry(path as string))).toBe(hash);
    }
  });

  it('SHA256SUMS verifies with coreutils sha256sum -c', () => {
    const dir = join(work, 'extracted');
    for (const e of entries) {
      mkdirSync(dirname(join(dir, e.name)), { recursive: true });
      writeFileSync(join(dir, e.name), e.data);
    }
    const out = execFileSync('sha256sum', ['-c', '--strict', 'SHA256SUMS'], { cwd: dir, encoding: 'utf8' });
    expect(out.trim().split('\n')).toHaveLength(entries.length - 1);
    expect(out).not.toMatch(/FAILED/);
    // A changed byte is caught.
    const victim = join(dir, pack.manifest.stimuli[0]!.files.png.path);
    const bytes = entry(pack.manifest.stimuli[0]!.files.png.path);
    writeFileSync(victim, Buffer.concat([bytes.subarray(0, bytes.length - 1), Buffer.from([bytes[bytes.length - 1]! ^ 1])]));
    expect(() => execFileSync('sha256sum', ['-c', '--quiet', 'SHA256SUMS'], { cwd: dir, stdio: 'pipe' })).toThrow();
  });

  it('the manifest validates against manifest.schema.json (ajv, draft 2020-12), and a broken one does not', () => {
    const schema = JSON.parse(entry('manifest.schema.json').toString('utf8')) as object;
    const ajv = new Ajv2020({ strict: true, allErrors: true });
    const validate = ajv.compile(schema);
    const manifest = JSON.parse(entry('manifest.json').toString('utf8')) as PackManifest;
    expect(validate(manifest), JSON.stringify(validate.errors)).toBe(true);
    expect(validate({ ...manifest, edition: { ...manifest.edition, state: 'final' } })).toBe(false);
    expect(validate({ ...manifest, stimuli: [{ ...manifest.stimuli[0], files: {} }] })).toBe(false);
    expect(validate({ ...manifest, extra: 1 })).toBe(false);
  });

  it('PNGs decode to the canvas size of the profile; SVGs carry their physical size', () => {
    const canvasPx = Math.round(2 * 57 * Math.tan((1.8 * Math.PI) / 360) * 40);
    for (const s of pack.manifest.stimuli) {
      const png = PNG.sync.read(entry(s.files.png.path));
      expect([png.width, png.height]).toEqual([canvasPx, canvasPx]);
      expect(entry(s.files.svg.path).toString('utf8')).toContain(`width="${((canvasPx / 40) * 10).toFixed(3)}mm"`);
    }
    expect(pack.manifest.render.png).toEqual({ channels: 'grey', widthPx: canvasPx, heightPx: canvasPx });
  });

  it('tables: stimuli.csv and trial-list.csv in RFC 4180, RDMs square over the layout stimuli', () => {
    const csv = entry('stimuli.csv').toString('utf8');
    expect(csv.endsWith('\r\n')).toBe(true);
    const rows = csv.trimEnd().split('\r\n');
    expect(rows).toHaveLength(1 + 17);
    expect(rows[0]).toMatch(/^id,kind,prototype_boundary,prototype_side,a,b,rho,angle_deg,/);
    expect(rows[0]).toContain('category_horizontal,distance_horizontal,fraction_horizontal,category_oblique');
    // The descriptor JSON holds commas and quotes, so RFC 4180 quotes it and doubles its quotes.
    expect(rows[1]).toMatch(/,"\{""family"":""radial""/);
    const trial = entry('trial-list.csv').toString('utf8').trimEnd().split('\r\n');
    expect(trial[0]).toBe('stimulus_id,kind,png_file,svg_file,category_horizontal,category_oblique');
    // Prototype p-horizontal-a lies on side A of its boundary by construction (lib/boundary).
    expect(trial.find((r) => r.startsWith('p-horizontal-a,'))).toMatch(/,A,[AB]$/);
    for (const name of ['design', 'contour', 'silhouette']) {
      const lines = entry(`rdm/${name}.tsv`).toString('utf8').trimEnd().split('\n');
      expect(lines).toHaveLength(14);
      expect(lines.every((l) => l.split('\t').length === 14)).toBe(true);
      expect(lines[1]!.split('\t')[1]).toBe('0');
    }
    // Design RDM: the centre to a ring-2 stimulus at ρ = 1 is 1 axis unit.
    const design = entry('rdm/design.tsv').toString('utf8').split('\n');
    const header = design[0]!.split('\t');
    expect(Number(design[1]!.split('\t')[header.indexOf('r02-s00')])).toBeCloseTo(1, 7);
  });

  it('manifest: categories and signed distances per boundary, nominal contrast, README caution', () => {
    const m = pack.manifest;
    expect(m.approved).toBe(true);
    expect('notice' in m).toBe(false);
    const s = m.stimuli.find((x) => x.id === 'r02-s01')!;
    // Spoke 1 of 6 at 60°, ρ = 1: signed distance to the θ = 0 boundary is sin 60° (lib/boundary: position · normal).
    expect(s.boundaries[0]).toMatchObject({ boundaryKey: 'horizontal', category: 'A', onBoundary: false });
    expect(s.boundaries[0]!.signedDistance).toBeCloseTo(Math.sin(Math.PI / 3), 12);
    // It lies on the 60° boundary.
    expect(s.boundaries[1]).toMatchObject({ boundaryKey: 'oblique', category: null, onBoundary: true });
    expect(m.render.contrast.basis).toMatch(/not measured/);
    // Equal-area normalisation: every stimulus is drawn 1.2° across by its equal-area diameter.
    for (const x of m.stimuli) expect(x.metrics.equalAreaDiameterDeg).toBeCloseTo(1.2, 2);
    const readme = entry('README.txt').toString('utf8');
    expect(readme).toMatch(/NOMINAL sRGB VALUES, NOT MEASURED LUMINANCE/);
    for (const column of ['equal_area_diameter_deg', 'angle_deg', 'png_sha256', 'category_<key>', 'stimulus_id']) expect(readme).toContain(column);
  });

  it('two builds are byte-identical', async () => {
    const again = await zipBytes(await buildPack(INPUT, backends));
    expect(again.equals(zip)).toBe(true);
    // The pure default hash gives the same pack.
    const pure = await zipBytes(await buildPack(INPUT, { renderPng }));
    expect(sha(pure)).toBe(sha(zip));
  });

  it('is byte-identical when its jobs run elsewhere and finish in any order', async () => {
    // A runJob back end that copies each job as postMessage would, and resolves them in reverse order of hand-out.
    const queued: (() => void)[] = [];
    let handedOut = 0;
    const runJob: PackJobRunner = (job) => {
      handedOut++;
      return new Promise((resolve, reject) => {
        queued.push(() => void runPackJob(structuredClone(job)).then(resolve, reject));
        queueMicrotask(() => setTimeout(() => queued.splice(0).reverse().forEach((f) => f()), 0));
      });
    };
    const elsewhere = await zipBytes(await buildPack(INPUT, { ...backends, runJob }));
    expect(handedOut).toBeGreaterThan(5);
    expect(sha(elsewhere)).toBe(sha(zip));
  });

  it("is byte-identical on the job worker's threads (PackPool: PNGs and jobs in worker threads)", async () => {
    const pool = new PackPool(2);
    try {
      const threaded = await zipBytes(await buildPack(INPUT, { ...backends, renderPng: pool.render, runJob: pool.run }));
      expect(sha(threaded)).toBe(sha(zip));
    } finally {
      await pool.close();
    }
  }, 60_000);

  it('a pack from an edition that is not approved says so at the top of its manifest', async () => {
    const draft = await buildPack({ ...INPUT, edition: { ...INPUT.edition, state: 'in_review' } }, backends);
    const text = new TextDecoder().decode(draft.files.find((f) => f.path === 'manifest.json')!.data);
    expect(Object.keys(JSON.parse(text) as object)[0]).toBe('notice');
    expect(draft.manifest.notice).toMatch(/In review, not Approved/);
    expect(draft.manifest.approved).toBe(false);
    expect(new TextDecoder().decode(draft.files.find((f) => f.path === 'README.txt')!.data)).toMatch(/^NOTICE: /);
  });
});

describe('bad pack input', () => {
  const fails = async (input: PackInput, code: string, field: RegExp): Promise<void> => {
    const error = await buildPack(input, backends).then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(PackError);
    expect((error as PackError).code).toBe(code);
    expect((error as PackError).issues.some((i) => field.test(i.field)), JSON.stringify((error as PackError).issues)).toBe(true);
  };

  it('refuses a viewing distance ≤ 0, sizes under 8 px or over 4096 px, and a bad date', async () => {
    await fails({ ...INPUT, profile: { ...INPUT.profile, viewingDistanceCm: 0 } }, 'invalid-input', /^render\.profile\.viewingDistanceCm$/);
    await fails({ ...INPUT, render: { ...INPUT.render, sizeDeg: 0.05, canvasDeg: 0.1 } }, 'invalid-input', /^render\.sizeDeg$/);
    await fails({ ...INPUT, render: { ...INPUT.render, sizeDeg: 80, canvasDeg: 120 } }, 'invalid-input', /^render\.canvasDeg$/);
    await fails({ ...INPUT, edition: { ...INPUT.edition, createdAt: '2024-05-06' } }, 'invalid-input', /^edition\.createdAt$/);
    await fails({ ...INPUT, boundaries: [{ key: 'a', angleDeg: 0 }, { key: 'a', angleDeg: 90 }] }, 'invalid-input', /^boundaries$/);
  });

  it('refuses stimuli that do not fit the canvas or that the engine cannot draw', async () => {
    await fails({ ...INPUT, render: { ...INPUT.render, canvasDeg: 1.2 } }, 'invalid-space', /^render\.canvasDeg$/);
    const tooFar = { ...INPUT, definition: { ...INPUT.definition, extent: 20 } };
    await fails(tooFar, 'invalid-space', /^stimuli\./);
  });

  it('warns, and still builds, when fill and background have the same luminance', async () => {
    const grey = await buildPack({ ...INPUT, render: { ...INPUT.render, fill: 128 } }, backends);
    expect(grey.manifest.render.warnings.map((w) => w.code)).toEqual(['zero-contrast']);
  });
});
