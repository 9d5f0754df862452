import type { InputHTMLAttributes, ReactNode } from 'react';
import { forwardRef, useId } from 'react';

type FieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: ReactNode };

/** A labelled input with its hint and its inline error, wired for screen readers. */
export const Field = forwardRef<HTMLInputElement, FieldProps>(function Field({ label, error, hint, id, className = '', ...props }, ref) {
  const auto = useId();
  const inputId = id ?? auto;
  const describedBy = [hint ? `${inputId}-hint` : null, error ? `${inputId}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={inputId} className="block text-sm font-medium text-graphite">
        {label}
      </label>
      <input
        ref={ref}
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className="mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-3 text-sm text-graphite placeholder:text-graphite-muted focus:border-accent aria-[invalid=true]:border-danger"
        {...props}
      />
      {hint ? (
        <p id={`${inputId}-hint`} className="mt-1 text-xs text-graphite-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${inputId}-error`} className="mt-1 text-xs text-danger" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
});
