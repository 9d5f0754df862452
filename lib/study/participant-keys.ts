/**
 * The key for the left anchor and the key for the right one. Even participant indices press the first key for
 * left, odd ones the second, so the mapping is counterbalanced across consecutive participants.
 */
export function participantKeys(keys: readonly [string, string], participant: number): { left: string; right: string } {
  return participant % 2 === 0 ? { left: keys[0], right: keys[1] } : { left: keys[1], right: keys[0] };
}
