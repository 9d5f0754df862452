'use client';

import { thumbnailPath } from '@/lib/shape/measure-shape';
import type { Contour } from '@/lib/shape/types';
import { stimulusMetrics } from '@/lib/space/stimulus-metrics';
import type { Stimulus } from '@/lib/space/types';
import { SIDE_COLOURS, SIDE_NAMES } from '@/lib/boundary-editor';
import type { BoundaryPlacement } from '@/lib/boundary/types';
import type { BoundaryValue } from '@/lib/schemas/boundary';
import { ShapePreview } from './shape-preview';

const DEG = 180 / Math.PI;

/** One stimulus enlarged, with its id, position, descriptor and metrics. */
export function SpaceInspector({
  stimulus,
  contour,
  placements = null,
  boundaries = [],
  extent,
}: {
  stimulus: Stimulus;
  contour: Contour | null;
  placements?: readonly BoundaryPlacement[] | null;
  boundaries?: readonly BoundaryValue[];
  extent?: number;
}) {
  let metrics: ReturnType<typeof stimulusMetrics> | null = null;
  try {
    metrics = stimulusMetrics(stimulus);
  } catch {
    metrics = null;
  }
  const terms = stimulus.descriptor.terms as unknown as readonly Record<string, number>[];
  return (
    <section className="grid gap-4 border-[0.5px] border-rule bg-paper-raised p-4 md:grid-cols-[12rem_1fr]" aria-label={`Stimulus ${stimulus.id}`} data-testid="space-inspector">
      {contour ? <ShapePreview paths={[{ d: thumbnailPath(contour), fill: '#23262B' }]} size={192} label={`Stimulus ${stimulus.id}`} /> : <p className="text-sm text-danger">This stimulus cannot be drawn.</p>}
      <div className="space-y-3 text-sm">
        <p>
          <span className="tabular font-medium" data-testid="inspector-id">
            {stimulus.id}
          </span>{' '}
          <span className="tabular text-graphite-muted">
            a = {stimulus.position.a.toFixed(3)}, b = {stimulus.position.b.toFixed(3)} · ρ = {stimulus.polar.rho.toFixed(3)}, θ = {(stimulus.polar.angle * DEG).toFixed(1)}°
          </span>
        </p>
        {metrics ? (
          <p className="tabular text-xs">
            area {metrics.area.toFixed(4)} · perimeter {metrics.perimeter.toFixed(4)} · compactness {metrics.compactness.toFixed(4)}
          </p>
        ) : null}
        {placements && placements.length ? (
          <ul className="tabular space-y-0.5 text-xs" data-testid="inspector-placements">
            {placements.map((p, i) => (
              <li key={p.boundaryKey}>
                <span style={{ color: SIDE_COLOURS[p.side] }}>■</span> {boundaries[i]?.label || p.boundaryKey}: {SIDE_NAMES[p.side]}, signed distance {p.distance.toFixed(3)}
                {extent ? ` (${p.fraction >= 0 ? '+' : ''}${p.fraction.toFixed(3)} ρmax)` : ''}
                {p.isAmbiguous ? <strong className="ml-1 text-caution">ambiguous: on the boundary</strong> : null}
              </li>
            ))}
          </ul>
        ) : null}
        <table className="tabular text-xs">
          <tbody>
            {terms.slice(0, 16).map((t, i) => (
              <tr key={i}>
                {Object.entries(t).map(([k, v]) => (
                  <td key={k} className="pr-3">
                    {k} {Number.isInteger(v) ? v : v.toFixed(4)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {terms.length > 16 ? <p className="text-xs text-graphite-muted">…and {terms.length - 16} more harmonics</p> : null}
      </div>
    </section>
  );
}
