import type { ShapeMeasures } from '@/lib/shape/measure-shape';

const ROWS: { key: keyof ShapeMeasures; label: string; format: (v: number) => string }[] = [
  { key: 'area', label: 'Area', format: (v) => v.toFixed(4) },
  { key: 'perimeter', label: 'Perimeter', format: (v) => v.toFixed(4) },
  { key: 'compactness', label: 'Compactness 4πA/P²', format: (v) => v.toFixed(4) },
  { key: 'convexity', label: 'Convexity (area / hull)', format: (v) => v.toFixed(4) },
  { key: 'minRadius', label: 'Minimum radius', format: (v) => v.toFixed(4) },
  { key: 'curvatureExtrema', label: 'Curvature extrema', format: (v) => String(v) },
];

/** The seed shape's geometry in numbers, in the descriptor's own units. */
export function ShapeMetricsPanel({ metrics }: { metrics: ShapeMeasures | undefined }) {
  return (
    <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 text-sm" data-testid="metrics-panel">
      {ROWS.map((r) => {
        const v = metrics?.[r.key];
        return (
          <div key={r.key} className="contents">
            <dt className="text-graphite-soft">{r.label}</dt>
            <dd className="tabular text-right" data-testid={`metric-${r.key}`}>
              {typeof v === 'number' ? r.format(v) : '—'}
            </dd>
          </div>
        );
      })}
      <dt className="text-graphite-soft">Simple contour</dt>
      <dd className="tabular text-right" data-testid="metric-isSimple">
        {metrics ? (metrics.isSimple ? 'yes' : 'no — it crosses itself') : '—'}
      </dd>
    </dl>
  );
}
