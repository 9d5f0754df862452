import { STATE_BADGE } from '@/lib/edition-view';
import { EDITION_STATE_LABELS, type EditionState } from '@/lib/schemas/edition';

export function EditionStateBadge({ state, testId }: { state: EditionState; testId?: string }) {
  return (
    <span className={`inline-block rounded-[3px] border-[0.5px] px-1.5 py-0.5 text-xs font-medium ${STATE_BADGE[state]}`} data-testid={testId} data-state={state}>
      {EDITION_STATE_LABELS[state]}
    </span>
  );
}
