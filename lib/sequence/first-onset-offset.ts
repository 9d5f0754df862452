import type { RunTiming } from './types';

/**
 * The stored-data offset of the first trial, s: BIDS onsets count from the first volume stored in the data file,
 * so dummy volumes that are stored shift every onset by dummyVolumes × TR; discarded ones shift nothing.
 */
export function firstOnsetOffset(timing: RunTiming): number {
  return timing.dummyVolumesStored ? (timing.dummyVolumes ?? 0) * timing.tr : 0;
}
