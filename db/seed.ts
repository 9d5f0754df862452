import bcrypt from 'bcryptjs';
import type { Role } from '@/lib/schemas/roles';
import type { Db } from './client';
import demo from './demo-users.json' with { type: 'json' };
import { findLabBySlug, insertLab } from './repositories/labs';
import { findMembership, insertMembership } from './repositories/memberships';
import { findUserByEmail, insertUser } from './repositories/users';
import { insertSeedShape, listSeedShapes } from './repositories/seed-shapes';
import { validateDescriptor, type ShapeDescriptor } from '@/lib/shape';
import { anisotropyIndex, checkSpace } from '@/lib/space';
import { insertShapeSpace, listShapeSpaces, updateSpaceBoundaries } from './repositories/shape-spaces';
import { insertEdition, listEditions, transitionEdition } from './repositories/editions';
import { insertDisplayProfile, listDisplayProfiles } from './repositories/display-profiles';
import { buildSnapshot, contentHash } from '@/lib/edition';
import { ENGINE_VERSION } from '@/lib/shape/engine-version';
import { DEFAULT_CATEGORISATION, DEFAULT_SIMILARITY } from '@/lib/schemas/study';
import { checkStudyDesign, type StudyDesign } from '@/lib/study';
import { insertStudy, listStudies } from './repositories/studies';
import { buildRunOrderOf } from '@/lib/run-order-build';
import { DEFAULT_RUN_ORDER_DEFINITION, RunOrderDefinitionSchema } from '@/lib/schemas/run-order';
import { getEditionSnapshot as getSnapshotRow } from './repositories/editions';
import { insertRunOrder, listRunOrders } from './repositories/run-orders';

/**
 * The demo lab, an invented scenario: the Halden Form Perception Group is preparing a study on how people
 * learn arbitrary categories of smooth, blob-like shapes. One member per role. Seeding is idempotent.
 */
export const DEMO_LAB = { slug: 'halden-form', name: 'Halden Form Perception Group' } as const;
export const DEMO_PASSWORD: string = demo.password;
export const DEMO_USERS = demo.users as readonly { role: Role; name: string; email: string }[];

/** The demo lab's two seed shapes: invented outlines for its category-learning study. */
export const DEMO_SEED_SHAPES: readonly { name: string; descriptor: ShapeDescriptor }[] = [
  {
    name: 'Harbour pebble',
    descriptor: {
      family: 'radial',
      baseRadius: 1,
      terms: [
        { k: 2, amplitude: 0.1, phase: 0.35 },
        { k: 3, amplitude: 0.14, phase: 1.2 },
        { k: 5, amplitude: 0.05, phase: -0.8 },
      ],
    },
  },
  {
    name: 'Fjord bean',
    descriptor: {
      family: 'elliptic',
      center: [0, 0],
      terms: [
        { n: 1, a: 1.15, b: 0, c: 0, d: 0.85 },
        { n: 2, a: 0, b: 0.06, c: 0.2, d: 0 },
        { n: 3, a: 0.05, b: 0.01, c: -0.01, d: 0.04 },
      ],
    },
  },
];

/** The demo lab's space: Rings 5 × 16 + centre around the pebble, sweeping its 2nd and a new 4th harmonic. */
export const DEMO_RUN_ORDER = {
  name: 'Pilot scan, ring 3',
  definition: {
    ...DEFAULT_RUN_ORDER_DEFINITION,
    conditions: { selection: 'rings' as const, indices: [3], includeCentre: false, nullEvents: true },
    timing: { trialDuration: 1, iti: { kind: 'uniform' as const, min: 2, max: 4 }, tr: 2, dummyVolumes: 4, dummyVolumesStored: false },
    runs: 2,
    seed: 20260914,
    bids: { subject: 'pilot01', session: '', task: 'shapes' },
  },
};

export const DEMO_SPACE = {
  name: 'Pebble rings (demo)',
  seed: 'Harbour pebble',
  settings: {
    axes: [
      { label: 'Second lobe', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
      { label: 'Fourth lobe', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
    ],
    extent: 1,
    layout: { kind: 'rings', rings: 5, spokes: 16 },
    normalization: { scale: 'equal-area-radius', centroid: true },
    equalize: false,
  },
} as const;

/** The demo space's one boundary, frozen with it into an Approved edition 1. */
export const DEMO_BOUNDARY = { key: 'smooth-vs-knobbly', label: 'Smooth vs knobbly', angleDeg: 45, prototypeDistance: null } as const;

/** The demo lab's testing-room screen. */
export const DEMO_DISPLAY_PROFILE = { name: 'Testing room B monitor', widthPx: 1920, heightPx: 1080, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57, notes: 'Chin rest at 57 cm, so 1 cm on the screen is about 1°.' };

/** bcrypt cost for demo accounts (the same as real ones). */
const DEMO_BCRYPT_COST = 12;

/** The demo lab's pilot norming study (a Draft): two-choice categorisation along eight diameters of edition 1. */
export const DEMO_STUDY = {
  name: 'Pilot diameter norming',
  texts: {
    consentText:
      'You are invited to a 20-minute study on how people see simple shapes. You will decide which of two shapes a third one resembles. Taking part is voluntary and you may stop at any time without giving a reason. No names or e-mail addresses are recorded. By continuing you agree to take part.',
    instructionsText: 'A shape appears in the middle with one shape on each side. Press the key for the side shape it looks more like. Answer quickly; there are no trick questions.',
    debriefText: 'Thank you. This pilot checks that the shapes change evenly in every direction before the main category-learning study.',
    finishCodePrefix: 'HALDEN',
    targetParticipants: 16,
  },
  design: { seed: 4711, stimulusSizeDeg: 4, categorisation: { ...DEFAULT_CATEGORISATION, extent: 0.9, repetitions: 3 }, similarity: null } satisfies StudyDesign,
} as const;

/** A small space for the pair-similarity pilot: Rings 2 × 4 + centre around the pebble (9 stimuli, 36 pairs). */
export const DEMO_PAIR_SPACE = {
  name: 'Pebble pairs (demo)',
  seed: 'Harbour pebble',
  settings: { ...DEMO_SPACE.settings, layout: { kind: 'rings', rings: 2, spokes: 4 } },
} as const;

/** The demo lab's pair-similarity pilot (a Draft) on that space's Approved edition 1: every pair twice, short timing. */
export const DEMO_PAIR_STUDY = {
  name: 'Pilot pair similarity',
  texts: {
    consentText:
      'You are invited to a 5-minute study on how similar simple shapes look. You will rate pairs of shapes from 1 to 7. Taking part is voluntary and you may stop at any time without giving a reason. No names or e-mail addresses are recorded. By continuing you agree to take part.',
    instructionsText: 'Two shapes appear side by side. Rate how similar they look, from 1 (very different) to 7 (very similar), with the number keys or the buttons.',
    debriefText: 'Thank you. This pilot checks that the designed distances between the shapes match how different they look.',
    finishCodePrefix: 'HALDEN',
    targetParticipants: 12,
  },
  design: {
    seed: 8123,
    stimulusSizeDeg: 4,
    categorisation: null,
    similarity: { ...DEFAULT_SIMILARITY, presentation: 'simultaneous', repetitions: 2, timing: { fixationMs: 150, stimulusMs: 300, gapMs: 100, responseMs: 6000, itiMs: 200 } },
  } satisfies StudyDesign,
} as const;

export async function seedDemo(db: Db): Promise<string> {
  const created: string[] = [];
  await db.transaction().execute(async (trx) => {
    let lab = await findLabBySlug(trx, DEMO_LAB.slug);
    if (!lab) {
      lab = await insertLab(trx, { slug: DEMO_LAB.slug, name: DEMO_LAB.name });
      created.push('lab');
    }
    const hash = await bcrypt.hash(DEMO_PASSWORD, DEMO_BCRYPT_COST);
    for (const u of DEMO_USERS) {
      let user = await findUserByEmail(trx, u.email);
      if (!user) {
        user = await insertUser(trx, { email: u.email, name: u.name, passwordHash: hash, emailVerifiedAt: new Date() });
        created.push(u.email);
      }
      if (!(await findMembership(trx, lab.id, user.id))) await insertMembership(trx, lab.id, user.id, u.role);
    }
    const designer = await findUserByEmail(trx, DEMO_USERS.find((u) => u.role === 'designer')!.email);
    const existing = new Set((await listSeedShapes(trx, lab.id, { limit: 100 })).map((s) => s.name));
    for (const shape of DEMO_SEED_SHAPES) {
      if (existing.has(shape.name)) continue;
      validateDescriptor(shape.descriptor);
      await insertSeedShape(trx, lab.id, designer!.id, {
        name: shape.name,
        family: shape.descriptor.family,
        harmonicCount: shape.descriptor.terms.length,
        descriptor: shape.descriptor,
        origin: { kind: 'editor' },
      });
      created.push(`seed shape ${shape.name}`);
    }
    const spaces = await listShapeSpaces(trx, lab.id, { limit: 100 });
    if (!spaces.some((sp) => sp.name === DEMO_SPACE.name)) {
      const seedRow = (await listSeedShapes(trx, lab.id, { limit: 100 })).find((r) => r.name === DEMO_SPACE.seed)!;
      const seed = DEMO_SEED_SHAPES.find((x) => x.name === DEMO_SPACE.seed)!.descriptor;
      const definition = { seed, ...DEMO_SPACE.settings, equalization: null };
      const report = checkSpace(definition);
      if (!report.ok) throw new Error(`demo space is invalid: ${report.failures.map((f) => f.reason).join('; ')}`);
      await insertShapeSpace(trx, lab.id, designer!.id, {
        name: DEMO_SPACE.name,
        seedShapeId: seedRow.id,
        settings: DEMO_SPACE.settings,
        equalization: null,
        anisotropy: { designed: anisotropyIndex(definition), equalized: null },
        stimulusCount: report.count,
      });
      created.push(`space ${DEMO_SPACE.name}`);
    }

    // One boundary and an Approved edition 1: frozen by the designer, approved by the reviewer.
    const space = (await listShapeSpaces(trx, lab.id, { limit: 100 })).find((sp) => sp.name === DEMO_SPACE.name)!;
    if ((await listEditions(trx, lab.id, space.id, { limit: 1 })).length === 0) {
      const reviewer = await findUserByEmail(trx, DEMO_USERS.find((u) => u.role === 'reviewer')!.email);
      if ((space.boundaries as unknown[]).length === 0) await updateSpaceBoundaries(trx, lab.id, space.id, space.boundaries_version, designer!.id, [DEMO_BOUNDARY]);
      const seed = DEMO_SEED_SHAPES.find((x) => x.name === DEMO_SPACE.seed)!.descriptor;
      const snapshot = buildSnapshot({
        engineVersion: ENGINE_VERSION,
        space: { id: space.id, name: space.name },
        seed: { id: space.seed_shape_id, name: DEMO_SPACE.seed },
        definition: { seed, ...DEMO_SPACE.settings, equalization: null },
        boundaries: [{ key: DEMO_BOUNDARY.key, label: DEMO_BOUNDARY.label, angleDeg: DEMO_BOUNDARY.angleDeg }],
      });
      const { id } = await insertEdition(trx, {
        labId: lab.id,
        spaceId: space.id,
        number: 1,
        snapshot,
        contentHash: contentHash(snapshot),
        engineVersion: ENGINE_VERSION,
        stimulusCount: snapshot.stimuli.length,
        changeNote: 'First edition for the pilot norming study.',
        authorId: designer!.id,
      });
      await transitionEdition(trx, id, 'draft', 'in_review', { submitted_by: designer!.id, submitted_at: new Date() });
      await transitionEdition(trx, id, 'in_review', 'approved', { decided_by: reviewer!.id, decided_at: new Date(), decision_note: 'Spacing and the boundary look even; approved for norming.' });
      created.push(`approved edition 1 of ${DEMO_SPACE.name}`);
    }

    if ((await listStudies(trx, lab.id, { limit: 100 })).length === 0) {
      const edition = (await listEditions(trx, lab.id, space.id, { limit: 1 }))[0]!;
      const issues = checkStudyDesign(DEMO_STUDY.design, edition.stimulus_count);
      if (issues.length) throw new Error(`demo study is invalid: ${issues.map((i) => i.message).join('; ')}`);
      const experimenter = await findUserByEmail(trx, DEMO_USERS.find((u) => u.role === 'experimenter')!.email);
      await insertStudy(trx, lab.id, experimenter!.id, { name: DEMO_STUDY.name, ...DEMO_STUDY.texts }, { editionId: edition.id, design: DEMO_STUDY.design, editionWarning: null });
      created.push(`study ${DEMO_STUDY.name}`);
    }

    // One invented run order: ring 3 (16 stimuli) plus null events, a de Bruijn cycle per run, jittered ITIs.
    const edition1 = (await listEditions(trx, lab.id, space.id, { limit: 100 })).find((e) => e.number === 1)!;
    if ((await listRunOrders(trx, lab.id, edition1.id, { limit: 1 })).length === 0) {
      const experimenter = await findUserByEmail(trx, DEMO_USERS.find((u) => u.role === 'experimenter')!.email);
      const definition = RunOrderDefinitionSchema.parse({ ...DEMO_RUN_ORDER.definition });
      const ids = ((await getSnapshotRow(trx, edition1.id)) as { stimuli: { id: string }[] }).stimuli.map((x) => x.id);
      const result = buildRunOrderOf(definition, ids);
      await insertRunOrder(trx, { labId: lab.id, editionId: edition1.id, name: DEMO_RUN_ORDER.name, definition, state: 'ready', result, createdBy: experimenter!.id });
      created.push(`run order ${DEMO_RUN_ORDER.name}`);
    }

    // The pair-similarity pilot: its own small space, an Approved edition 1 (no boundaries) and the Draft study.
    if (!(await listShapeSpaces(trx, lab.id, { limit: 100 })).some((sp) => sp.name === DEMO_PAIR_SPACE.name)) {
      const seedRow = (await listSeedShapes(trx, lab.id, { limit: 100 })).find((r) => r.name === DEMO_PAIR_SPACE.seed)!;
      const seed = DEMO_SEED_SHAPES.find((x) => x.name === DEMO_PAIR_SPACE.seed)!.descriptor;
      const definition = { seed, ...DEMO_PAIR_SPACE.settings, equalization: null };
      const report = checkSpace(definition);
      if (!report.ok) throw new Error(`demo pair space is invalid: ${report.failures.map((f) => f.reason).join('; ')}`);
      await insertShapeSpace(trx, lab.id, designer!.id, {
        name: DEMO_PAIR_SPACE.name,
        seedShapeId: seedRow.id,
        settings: DEMO_PAIR_SPACE.settings,
        equalization: null,
        anisotropy: { designed: anisotropyIndex(definition), equalized: null },
        stimulusCount: report.count,
      });
      created.push(`space ${DEMO_PAIR_SPACE.name}`);
    }
    const pairSpace = (await listShapeSpaces(trx, lab.id, { limit: 100 })).find((sp) => sp.name === DEMO_PAIR_SPACE.name)!;
    if ((await listEditions(trx, lab.id, pairSpace.id, { limit: 1 })).length === 0) {
      const reviewer = await findUserByEmail(trx, DEMO_USERS.find((u) => u.role === 'reviewer')!.email);
      const seed = DEMO_SEED_SHAPES.find((x) => x.name === DEMO_PAIR_SPACE.seed)!.descriptor;
      const snapshot = buildSnapshot({
        engineVersion: ENGINE_VERSION,
        space: { id: pairSpace.id, name: pairSpace.name },
        seed: { id: pairSpace.seed_shape_id, name: DEMO_PAIR_SPACE.seed },
        definition: { seed, ...DEMO_PAIR_SPACE.settings, equalization: null },
        boundaries: [],
      });
      const { id } = await insertEdition(trx, {
        labId: lab.id,
        spaceId: pairSpace.id,
        number: 1,
        snapshot,
        contentHash: contentHash(snapshot),
        engineVersion: ENGINE_VERSION,
        stimulusCount: snapshot.stimuli.length,
        changeNote: 'A small set for the pair-similarity pilot.',
        authorId: designer!.id,
      });
      await transitionEdition(trx, id, 'draft', 'in_review', { submitted_by: designer!.id, submitted_at: new Date() });
      await transitionEdition(trx, id, 'in_review', 'approved', { decided_by: reviewer!.id, decided_at: new Date(), decision_note: 'Approved for the similarity pilot.' });
      created.push(`approved edition 1 of ${DEMO_PAIR_SPACE.name}`);
    }
    if (!(await listStudies(trx, lab.id, { limit: 100 })).some((st) => st.name === DEMO_PAIR_STUDY.name)) {
      const edition = (await listEditions(trx, lab.id, pairSpace.id, { limit: 1 }))[0]!;
      const issues = checkStudyDesign(DEMO_PAIR_STUDY.design, edition.stimulus_count);
      if (issues.length) throw new Error(`demo pair study is invalid: ${issues.map((i) => i.message).join('; ')}`);
      const experimenter = await findUserByEmail(trx, DEMO_USERS.find((u) => u.role === 'experimenter')!.email);
      await insertStudy(trx, lab.id, experimenter!.id, { name: DEMO_PAIR_STUDY.name, ...DEMO_PAIR_STUDY.texts }, { editionId: edition.id, design: DEMO_PAIR_STUDY.design, editionWarning: null });
      created.push(`study ${DEMO_PAIR_STUDY.name}`);
    }

    if ((await listDisplayProfiles(trx, lab.id, { limit: 100 })).length === 0) {
      await insertDisplayProfile(trx, lab.id, designer!.id, DEMO_DISPLAY_PROFILE);
      created.push(`display profile ${DEMO_DISPLAY_PROFILE.name}`);
    }
  });
  return created.length ? `demo lab "${DEMO_LAB.name}": created ${created.join(', ')}` : `demo lab "${DEMO_LAB.name}" already present`;
}
