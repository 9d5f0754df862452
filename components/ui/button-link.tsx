import Link from 'next/link';
import type { ComponentProps } from 'react';

const VARIANTS = {
  primary: 'bg-accent text-white hover:bg-accent-strong',
  quiet: 'border-[0.5px] border-rule-strong text-graphite hover:bg-paper-deep',
} as const;

/** A link styled as a button: teal for the one main action on a view, quiet for the rest. */
export function ButtonLink({
  variant = 'primary',
  className = '',
  ...props
}: ComponentProps<typeof Link> & { variant?: keyof typeof VARIANTS }) {
  return (
    <Link
      {...props}
      className={`inline-flex h-9 items-center rounded-[3px] px-4 text-sm font-medium transition-colors ${VARIANTS[variant]} ${className}`}
    />
  );
}
