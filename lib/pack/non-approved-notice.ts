import type { PackEdition } from './types';

const STATE_WORDS: Record<PackEdition['state'], string> = { draft: 'Draft', in_review: 'In review', approved: 'Approved', returned: 'Returned' };

/** The notice at the top of a pack from an edition that is not Approved; null for an approved edition. */
export function nonApprovedNotice(edition: PackEdition): string | null {
  if (edition.state === 'approved') return null;
  return `This pack was made from edition ${edition.number} while it was ${STATE_WORDS[edition.state]}, not Approved. It has not been signed off by a reviewer; do not use it for data collection without that approval.`;
}
