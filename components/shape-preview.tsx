import type { ReactNode } from 'react';

/**
 * Draws path data in shape units (equal-area radius 1, y already flipped for screen) in a square view, so the
 * shape keeps its true geometry at any size.
 */
export function ShapePreview({
  paths,
  extent = 1.8,
  size = 320,
  label,
  testId,
  children,
}: {
  paths: { d: string; fill?: string; stroke?: string; strokeWidth?: number; dashed?: boolean; testId?: string }[];
  extent?: number;
  size?: number | string;
  label: string;
  testId?: string;
  children?: ReactNode;
}) {
  const e = extent;
  return (
    <svg
      viewBox={`${-e} ${-e} ${2 * e} ${2 * e}`}
      width={size}
      height={size}
      role="img"
      aria-label={label}
      data-testid={testId}
      preserveAspectRatio="xMidYMid meet"
      className="block max-w-full"
    >
      <line x1={-e} y1={0} x2={e} y2={0} stroke="#DDD6C8" strokeWidth={0.006} />
      <line x1={0} y1={-e} x2={0} y2={e} stroke="#DDD6C8" strokeWidth={0.006} />
      <circle cx={0} cy={0} r={1} fill="none" stroke="#DDD6C8" strokeWidth={0.006} strokeDasharray="0.03 0.03" />
      {paths.map((p, i) => (
        <path
          key={i}
          d={p.d}
          fill={p.fill ?? 'none'}
          stroke={p.stroke ?? 'none'}
          strokeWidth={p.stroke ? (p.strokeWidth ?? 0.012) : 0}
          strokeDasharray={p.dashed ? `${(p.strokeWidth ?? 0.012) * 3.3} ${(p.strokeWidth ?? 0.012) * 2.5}` : undefined}
          strokeLinejoin="round"
          data-testid={p.testId}
        />
      ))}
      {children}
    </svg>
  );
}
