'use client';

import type { DescriptorInput } from '@/lib/schemas/descriptor';
import { NumberSlider } from './number-slider';
import { Button } from './ui/button';

type FieldSpec = { field: string; label: string; min: number; max: number; step: number };

const PHASE = { min: -Math.PI, max: Math.PI, step: 0.01 };
const FIELDS: Record<DescriptorInput['family'], FieldSpec[]> = {
  radial: [
    { field: 'amplitude', label: 'Amplitude', min: 0, max: 0.5, step: 0.005 },
    { field: 'phase', label: 'Phase (rad)', ...PHASE },
  ],
  elliptic: ['a', 'b', 'c', 'd'].map((f) => ({ field: f, label: f, min: -1.5, max: 1.5, step: 0.005 })),
  complex: [
    { field: 're', label: 'Real', min: -1.5, max: 1.5, step: 0.005 },
    { field: 'im', label: 'Imaginary', min: -1.5, max: 1.5, step: 0.005 },
  ],
};

function indexOf(term: Record<string, number>, family: DescriptorInput['family']): number {
  return family === 'elliptic' ? term.n! : term.k!;
}

/** The harmonic table: one row per harmonic, each value with a slider and a numeric input (or plain text when read-only). */
export function HarmonicTable({
  draft,
  readOnly,
  problems,
  onField,
  onRemove,
}: {
  draft: DescriptorInput;
  readOnly: boolean;
  problems: Map<string, string>;
  onField: (index: number, field: string, value: number) => void;
  onRemove: (index: number) => void;
}) {
  const fields = FIELDS[draft.family];
  const terms = draft.terms as unknown as Record<string, number>[];
  return (
    <table className="w-full border-collapse text-sm" data-testid="harmonic-table">
      <thead>
        <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
          <th scope="col" className="py-2 pr-3 font-medium">
            Harmonic
          </th>
          {fields.map((f) => (
            <th key={f.field} scope="col" className="py-2 pr-3 font-medium">
              {f.label}
            </th>
          ))}
          {readOnly ? null : (
            <th scope="col" className="py-2">
              <span className="sr-only">Remove</span>
            </th>
          )}
        </tr>
      </thead>
      <tbody>
        {terms.map((term, i) => {
          const h = indexOf(term, draft.family);
          const rowProblem = problems.get(`terms.${i}`) ?? problems.get(`terms.${i}.k`) ?? problems.get(`terms.${i}.n`);
          return (
            <tr key={`${h}-${i}`} className="border-b-[0.5px] border-rule align-top" data-testid={`harmonic-row-${h}`}>
              <th scope="row" className="tabular py-2 pr-3 font-normal">
                {h}
                {rowProblem ? (
                  <p className="mt-1 max-w-40 text-xs text-danger" role="alert">
                    {rowProblem}
                  </p>
                ) : null}
              </th>
              {fields.map((f) => {
                const problem = problems.get(`terms.${i}.${f.field}`);
                return (
                  <td key={f.field} className="py-2 pr-3">
                    {readOnly ? (
                      <span className="tabular text-xs">{(term[f.field] ?? 0).toFixed(4)}</span>
                    ) : (
                      <NumberSlider
                        label={`${f.label} of harmonic ${h}`}
                        value={term[f.field] ?? 0}
                        min={f.min}
                        max={f.max}
                        step={f.step}
                        error={problem}
                        onChange={(v) => onField(i, f.field, v)}
                        testId={`h${h}-${f.field}`}
                        compact={fields.length > 2}
                      />
                    )}
                    {problem ? (
                      <p className="mt-1 max-w-56 text-xs text-danger" role="alert" data-testid={`problem-h${h}-${f.field}`}>
                        {problem}
                      </p>
                    ) : null}
                  </td>
                );
              })}
              {readOnly ? null : (
                <td className="py-2">
                  <Button variant="quiet" size="sm" onClick={() => onRemove(i)} aria-label={`Remove harmonic ${h}`}>
                    ✕
                  </Button>
                </td>
              )}
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
