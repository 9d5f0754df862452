'use client';

import { useId, useState } from 'react';

/** A value with a slider and a numeric input side by side; both edit the same number. */
export function NumberSlider({
  label,
  value,
  min,
  max,
  step,
  onChange,
  error,
  testId,
  decimals = 3,
  compact = false,
}: {
  label: string;
  value: number;
  min: number;
  max: number;
  step: number;
  onChange: (v: number) => void;
  error?: string | undefined;
  testId?: string;
  decimals?: number;
  /** Slider under the number, for tables with several values per row. */
  compact?: boolean;
}) {
  const id = useId();
  // While the field has focus it shows what is typed; otherwise the value, rounded.
  const [text, setText] = useState<string | null>(null);
  const shown = formatFixed(value, decimals);
  return (
    <div className={compact ? 'flex flex-col-reverse items-start gap-1' : 'flex items-center gap-2'}>
      <input
        type="range"
        aria-label={label}
        min={min}
        max={max}
        step={step}
        value={Math.min(max, Math.max(min, value))}
        onChange={(e) => onChange(Number(e.target.value))}
        className={`h-6 accent-[#0E5D63] ${compact ? 'w-20' : 'w-28'}`}
        data-testid={testId ? `${testId}-slider` : undefined}
      />
      <input
        id={id}
        type="text"
        inputMode="decimal"
        aria-label={`${label} value`}
        aria-invalid={error ? true : undefined}
        value={text ?? shown}
        onFocus={() => setText(shown)}
        onBlur={() => setText(null)}
        onChange={(e) => {
          setText(e.target.value);
          const v = Number(e.target.value);
          if (e.target.value.trim() !== '' && Number.isFinite(v)) onChange(v);
        }}
        className="tabular h-7 w-20 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-1.5 text-right text-xs aria-[invalid=true]:border-danger"
        data-testid={testId ? `${testId}-input` : undefined}
      />
    </div>
  );
}

/** Fixed decimals without a minus sign on values that round to zero. */
function formatFixed(value: number, decimals: number): string {
  const s = value.toFixed(decimals);
  return Number(s) === 0 ? (0).toFixed(decimals) : s;
}
