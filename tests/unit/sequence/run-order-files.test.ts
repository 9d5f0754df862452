import { describe, expect, it } from 'vitest';
import { buildRunOrderOf, checkRunOrderDefinition, conditionIdsOf, definitionFieldOf, needsBackgroundSearch } from '@/lib/run-order-build';
import { DEFAULT_RUN_ORDER_DEFINITION, RunOrderDefinitionSchema, type RunOrderDefinition } from '@/lib/schemas/run-order';
import { checkType1Index1Sequence, runOrderFiles, SequenceError } from '@/lib/sequence';
import { generateSpace, selectLayoutStimuli, stimulusId } from '@/lib/space';

// Rings layout ids: r{ring}-s{spoke}, centre c (lib/space stimulusId).
const RING_IDS = ['c', ...[1, 2].flatMap((ring) => [0, 1, 2, 3, 4, 5].map((spoke) => stimulusId({ kind: 'ring', ring, spoke })))];
const def = (over: Partial<RunOrderDefinition>): RunOrderDefinition => ({ ...DEFAULT_RUN_ORDER_DEFINITION, ...over });

describe('selecting the stimuli of a run order', () => {
  it('keeps chosen rings, spokes or diameters, with the centre on request; prototypes only with "all"', () => {
    const ids = [...RING_IDS, 'p-split-a'];
    expect(selectLayoutStimuli(ids, { kind: 'all' })).toEqual(ids);
    expect(selectLayoutStimuli(ids, { kind: 'rings', indices: [2], includeCentre: false })).toEqual(['r02-s00', 'r02-s01', 'r02-s02', 'r02-s03', 'r02-s04', 'r02-s05']);
    expect(selectLayoutStimuli(ids, { kind: 'spokes', indices: [3], includeCentre: true })).toEqual(['c', 'r01-s03', 'r02-s03']);
    const diam = ['c', 'd00-p01', 'd00-m01', 'd01-p01', 'd01-m01'];
    expect(selectLayoutStimuli(diam, { kind: 'diameters', indices: [1], includeCentre: false })).toEqual(['d01-p01', 'd01-m01']);
    // A ring selection on a diameters layout finds nothing rather than guessing.
    expect(selectLayoutStimuli(diam, { kind: 'rings', indices: [1], includeCentre: false })).toEqual([]);
  });

  it('matches the ids generateSpace makes', () => {
    const space = generateSpace({
      seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }] },
      axes: [
        { label: 'A', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.05 }] },
        { label: 'B', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.05 }] },
      ],
      extent: 1,
      layout: { kind: 'rings', rings: 3, spokes: 8 },
      normalization: { scale: 'none', centroid: false },
      equalization: null,
    } as never);
    expect(selectLayoutStimuli(space.stimuli.map((s) => s.id), { kind: 'rings', indices: [3], includeCentre: false })).toHaveLength(8);
  });
});

describe('run order files', () => {
  it('names each run by BIDS entities and pairs it with a JSON sidecar; same definition → same bytes', () => {
    const d = def({ conditions: { selection: 'rings', indices: [1], includeCentre: false, nullEvents: false }, sequence: { kind: 'type1-index1' }, runs: 3, bids: { subject: '07', session: 'eeg2', task: 'shapes' } });
    const files = runOrderFiles(buildRunOrderOf(d, RING_IDS), { subject: '07', session: 'eeg2', task: 'shapes' });
    expect(files.map((f) => f.name)).toEqual([
      'sub-07_ses-eeg2_task-shapes_run-1_events.tsv',
      'sub-07_ses-eeg2_task-shapes_run-1_events.json',
      'sub-07_ses-eeg2_task-shapes_run-2_events.tsv',
      'sub-07_ses-eeg2_task-shapes_run-2_events.json',
      'sub-07_ses-eeg2_task-shapes_run-3_events.tsv',
      'sub-07_ses-eeg2_task-shapes_run-3_events.json',
    ]);
    const again = runOrderFiles(buildRunOrderOf(d, RING_IDS), { subject: '07', session: 'eeg2', task: 'shapes' });
    expect(again).toEqual(files);
    // Each run is its own type-1 index-1 sequence (Nonyane & Theobald 2007): 37 trials for 6 conditions.
    const ids = conditionIdsOf(d, RING_IDS);
    for (const f of files.filter((x) => x.name.endsWith('.tsv'))) {
      const order = f.text.trimEnd().split('\n').slice(1).map((l) => ids.indexOf(l.split('\t')[2]!));
      expect(checkType1Index1Sequence(order, 6).isValid).toBe(true);
    }
  });
});

describe('checking a definition', () => {
  it('sends type-1 index-1 above 12 conditions to the background, and checks the rest at once', () => {
    const all = def({ conditions: { selection: 'all', indices: [], includeCentre: true, nullEvents: false }, sequence: { kind: 'type1-index1' } });
    expect(needsBackgroundSearch(all, RING_IDS)).toBe(true);
    expect(() => checkRunOrderDefinition(all, RING_IDS)).not.toThrow();
    // 13 conditions: 170 trials; cutting them into more runs than trials is refused before any search starts.
    const cut = { ...all, runs: 200, runMode: 'cut' as const };
    expect(() => checkRunOrderDefinition(cut, RING_IDS)).toThrow(/170 trials cannot be cut into 200 runs/);
  });

  it('maps core errors onto definition fields', () => {
    const cases: [Partial<RunOrderDefinition>, string][] = [
      [{ conditions: { selection: 'spokes', indices: [0], includeCentre: true, nullEvents: false }, sequence: { kind: 'type1-index1' } }, 'conditions'],
      [{ runs: 171, runMode: 'cut' }, 'runs'],
    ];
    for (const [over, field] of cases) {
      try {
        buildRunOrderOf(def(over), RING_IDS);
        expect.unreachable(field);
      } catch (error) {
        expect(error).toBeInstanceOf(SequenceError);
        expect(definitionFieldOf(error as SequenceError)).toBe(field);
      }
    }
  });

  it('the schema refuses durations and TR ≤ 0 and an ITI whose mean is out of range, naming the field', () => {
    const r = RunOrderDefinitionSchema.safeParse(def({ timing: { trialDuration: 0, iti: { kind: 'truncated-exponential', mean: 5, min: 1, max: 6 }, tr: -1, dummyVolumes: 0, dummyVolumesStored: false } }));
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    expect(paths).toContain('timing.trialDuration: The trial duration must be more than 0 s');
    expect(paths).toContain('timing.tr: The TR must be more than 0 s');
    expect(paths.some((p) => p.startsWith('timing.iti.mean: The mean must lie between'))).toBe(true);
    // A TR of a denormal number of seconds would count more volumes than a safe integer holds.
    const tiny = RunOrderDefinitionSchema.safeParse(def({ timing: { trialDuration: 1, iti: { kind: 'fixed', duration: 2 }, tr: 5e-324, dummyVolumes: 0, dummyVolumesStored: false } }));
    expect(tiny.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`)).toEqual(['timing.tr: The TR must be at least 0.05 s']);
  });
});
