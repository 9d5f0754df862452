import type { ReactNode } from 'react';

const TONES = {
  info: 'border-accent bg-accent-soft text-graphite',
  caution: 'border-caution bg-caution-soft text-graphite',
  error: 'border-danger bg-danger-soft text-graphite',
} as const;

/** A hairline-edged message block; errors are announced to screen readers. */
export function Notice({ tone = 'info', children, testId }: { tone?: keyof typeof TONES; children: ReactNode; testId?: string }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} data-testid={testId} className={`border-l-2 px-4 py-3 text-sm ${TONES[tone]}`}>
      {children}
    </div>
  );
}
