import { Notice } from './ui/notice';
import { STUDY_STATE_LABELS, type StudyState } from '@/lib/schemas/study';

/** DESIGN.md §5: studies with human participants need ethics approval and consent; local rules govern. */
export function EthicsNotice({ testId = 'ethics-notice' }: { testId?: string }) {
  return (
    <Notice tone="caution" testId={testId}>
      <strong className="font-semibold">Human participants.</strong> A norming study needs the approval of your lab’s ethics board (IRB or REC) before anyone takes part, and every
      participant must give informed consent. Your institution’s and country’s rules govern; Epicycle does not replace them.
    </Notice>
  );
}

/** The notice participants will see before the task starts (WCAG 2.3.1 context). */
export const PHOTOSENSITIVITY_TEXT =
  'This task shows shapes that appear and disappear quickly on the screen. If you have photosensitive epilepsy, or have ever had a seizure or felt unwell with flashing images, please do not take part. Stop at any time if you feel unwell.';

export function PhotosensitivityNotice({ peakPerSecond, isAboveLimit }: { peakPerSecond: number; isAboveLimit: boolean }) {
  return (
    <div className="space-y-3" data-testid="flash-check">
      {isAboveLimit ? (
        <Notice tone="error" testId="flash-warning">
          Flash check: up to <span className="tabular">{peakPerSecond}</span> onsets in one second. Keep it to 3 or fewer per second (WCAG 2.3.1): lengthen the fixation, blank or
          inter-trial interval.
        </Notice>
      ) : (
        <p className="text-sm text-graphite-soft" data-testid="flash-ok">
          Flash check: at most <span className="tabular">{peakPerSecond}</span> onsets in any one second, assuming the fastest answers (the limit is 3, WCAG 2.3.1).
        </p>
      )}
      <figure className="border-l-2 border-rule-strong pl-4 text-sm">
        <figcaption className="mb-1 text-xs font-medium uppercase tracking-wide text-graphite-muted">Participants will see</figcaption>
        <p data-testid="photosensitivity-notice">{PHOTOSENSITIVITY_TEXT}</p>
      </figure>
    </div>
  );
}

const BADGE: Record<StudyState, string> = {
  draft: 'border-rule-strong text-graphite-soft',
  open: 'border-accent bg-accent-soft text-graphite',
  closed: 'border-graphite-muted text-graphite-soft',
};

export function StudyStateBadge({ state, testId }: { state: StudyState; testId?: string }) {
  return (
    <span className={`inline-block rounded-[3px] border-[0.5px] px-1.5 py-0.5 text-xs font-medium ${BADGE[state]}`} data-testid={testId} data-state={state}>
      {STUDY_STATE_LABELS[state]}
    </span>
  );
}

/** Minutes, rounded up, for the estimated duration. */
export function formatMinutes(seconds: number): string {
  return `${Math.ceil(seconds / 60)} min`;
}
