import type { ButtonHTMLAttributes } from 'react';

const VARIANTS = {
  primary: 'bg-accent text-white hover:bg-accent-strong disabled:bg-graphite-muted',
  quiet: 'border-[0.5px] border-rule-strong text-graphite hover:bg-paper-deep disabled:text-graphite-muted',
  danger: 'border-[0.5px] border-danger text-danger hover:bg-danger-soft',
} as const;

/** The one button: teal for the main action of a view, quiet for the rest, danger for removals. */
export function Button({
  variant = 'primary',
  size = 'md',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: keyof typeof VARIANTS; size?: 'sm' | 'md' }) {
  const sizing = size === 'sm' ? 'h-7 px-2.5 text-xs' : 'h-9 px-4 text-sm';
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center rounded-[3px] font-medium transition-colors disabled:cursor-not-allowed ${sizing} ${VARIANTS[variant]} ${className}`}
      {...props}
    />
  );
}
