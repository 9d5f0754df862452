import { describe, expect, it } from 'vitest';
import { buildRunOrder, eventsFileName, toEventsJson, toEventsTsv, type RunOrder } from '@/lib/sequence';
import { expectSequenceError } from './support';

const order: RunOrder = buildRunOrder({
  conditions: [
    { id: 'ring1spoke1', stimFile: 'edition-2/r1s1.png' },
    { id: 'ring1spoke2', stimFile: 'edition-2/r1s2.png' },
    { id: 'ring2spoke1', stimFile: 'edition-2/r2s1.png' },
  ],
  nullEvents: true,
  sequence: { kind: 'de-bruijn' },
  timing: { trialDuration: 0.75, iti: { kind: 'uniform', min: 1.5, max: 4.5 }, tr: 2, dummyVolumes: 2, dummyVolumesStored: true },
  runs: 2,
  seed: 31,
});
const run = order.runs[0]!;
const tsv = toEventsTsv(run);
const lines = tsv.split('\n');

describe('toEventsTsv (BIDS events.tsv)', () => {
  it('starts with a header row: onset and duration first, then trial_type and stim_file', () => {
    // BIDS "Task events": onset and duration are required and come first; trial_type and stim_file are optional.
    expect(lines[0]).toBe('onset\tduration\ttrial_type\tstim_file');
  });

  it('uses real tabs, \\n line ends, one row per trial and a final newline', () => {
    // BIDS tabular files: tab-separated, header row, one row per event.
    expect(tsv.endsWith('\n')).toBe(true);
    expect(tsv).not.toContain('\r');
    expect(lines).toHaveLength(run.trials.length + 2); // header, rows, and the empty string after the final \n
    expect(lines.at(-1)).toBe('');
    for (const line of lines.slice(0, -1)) expect(line.split('\t')).toHaveLength(4);
  });

  it('writes seconds with fixed decimals that match the schedule', () => {
    // BIDS: onset and duration in seconds; duration ≥ 0.
    const rows = lines.slice(1, -1).map((line) => line.split('\t'));
    rows.forEach(([onset, duration], i) => {
      expect(onset).toMatch(/^\d+\.\d{3}$/);
      expect(duration).toBe('0.750');
      expect(Number(onset)).toBeCloseTo(run.trials[i]!.onset, 6);
    });
    // Stored dummy volumes shift the first onset by 2 × 2 s (BIDS: onsets count from the first stored volume).
    expect(rows[0]?.[0]).toBe('4.000');
    expect(toEventsTsv(run, { decimals: 4 }).split('\n')[1]?.split('\t')[1]).toBe('0.7500');
    expect(toEventsTsv(run, { decimals: 0 }).split('\n')[1]?.split('\t')[0]).toBe('4');
  });

  it('writes n/a for missing values and stim_file relative to stimuli/', () => {
    // BIDS: missing values are n/a; stim_file is relative to the dataset's stimuli/ folder.
    const rows = lines.slice(1, -1).map((line) => line.split('\t'));
    const nullRows = rows.filter(([, , trialType]) => trialType === 'null');
    expect(nullRows.length).toBeGreaterThan(0);
    expect(nullRows.every(([, , , stimFile]) => stimFile === 'n/a')).toBe(true);
    const stimulusRows = rows.filter(([, , trialType]) => trialType !== 'null');
    expect(stimulusRows.every(([, , , stimFile]) => /^edition-2\/r\ds\d\.png$/.test(stimFile ?? ''))).toBe(true);
    expect(tsv).not.toMatch(/\t\t|\t\n/); // no empty cells
  });

  it('is byte-identical for the same order', () => {
    expect(toEventsTsv(order.runs[0]!)).toBe(tsv);
    expect(toEventsTsv(order.runs[1]!)).not.toBe(tsv);
  });

  it('refuses bad decimals, negative times and tabs in values', () => {
    expectSequenceError(() => toEventsTsv(run, { decimals: 7 }), 'invalid-argument');
    const trial = run.trials[0]!;
    expectSequenceError(() => toEventsTsv({ trials: [{ ...trial, onset: -1 }] }), 'invalid-argument');
    expectSequenceError(() => toEventsTsv({ trials: [{ ...trial, trialType: 'a\tb' }] }), 'invalid-argument');
  });
});

describe('toEventsJson (BIDS _events.json sidecar)', () => {
  const text = toEventsJson(order);
  const sidecar = JSON.parse(text) as Record<string, { LongName?: string; Description?: string; Units?: string; Levels?: Record<string, string> }>;

  it('describes every column of the TSV, with units in seconds for onset and duration', () => {
    // BIDS "Tabular files": column descriptions with LongName, Description, Units, Levels.
    for (const column of lines[0]!.split('\t')) {
      expect(sidecar[column]?.LongName).toBeTruthy();
      expect(sidecar[column]?.Description).toBeTruthy();
    }
    expect(sidecar.onset?.Units).toBe('s');
    expect(sidecar.duration?.Units).toBe('s');
  });

  it('lists every trial_type as a level', () => {
    expect(Object.keys(sidecar.trial_type?.Levels ?? {}).sort()).toEqual(['null', 'ring1spoke1', 'ring1spoke2', 'ring2spoke1']);
    expect(sidecar.trial_type?.Levels?.ring1spoke2).toContain('stimuli/edition-2/r1s2.png');
  });

  it('is stable text ending with a newline', () => {
    expect(text.endsWith('}\n')).toBe(true);
    expect(toEventsJson(order)).toBe(text);
  });
});

describe('eventsFileName', () => {
  it('names the file sub-<label>_task-<label>_run-<n>_events.tsv', () => {
    // BIDS: <data file stem>_events.tsv, entities in the order sub, ses, task, run.
    expect(eventsFileName({ subject: '01', task: 'shapes', run: 1 })).toBe('sub-01_task-shapes_run-1_events.tsv');
    expect(eventsFileName({ subject: 'P7', session: 'mri1', task: 'rings', run: 12 })).toBe('sub-P7_ses-mri1_task-rings_run-12_events.tsv');
  });

  it.each(['', 'sub_01', 'a-b', 'café', 'a b', 'a.b'])('refuses the label %j', (label) => {
    // BIDS labels are alphanumeric.
    expectSequenceError(() => eventsFileName({ subject: label, task: 'shapes', run: 1 }), 'invalid-label');
    expectSequenceError(() => eventsFileName({ subject: '01', task: label, run: 1 }), 'invalid-label');
  });

  it.each([-1, 1.5, Number.NaN])('refuses the run index %s', (runIndex) => {
    expectSequenceError(() => eventsFileName({ subject: '01', task: 'shapes', run: runIndex }), 'invalid-label');
  });
});
