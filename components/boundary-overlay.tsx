'use client';

import { useState } from 'react';
import { angleFromPointer, turn } from '@/lib/boundary-editor';
import type { BoundaryValue } from '@/lib/schemas/boundary';
import type { SpaceGeometry } from './space-canvas';

/**
 * The boundaries drawn across the space as diameters. The active one has a handle at each end: drag it round
 * the circle, or focus it and turn it with the arrow keys (1°, Shift 15°; snapped to spokes when asked).
 */
export function BoundaryOverlay({
  geometry,
  boundaries,
  activeKey,
  editable,
  snapSpokes,
  onAngle,
}: {
  geometry: SpaceGeometry;
  boundaries: readonly BoundaryValue[];
  activeKey: string | null;
  editable: boolean;
  snapSpokes: number | null;
  onAngle: (key: string, angleDeg: number) => void;
}) {
  const [dragging, setDragging] = useState<string | null>(null);
  const { size, radiusPx } = geometry;
  const c = size / 2;
  const reach = radiusPx * 1.08;

  const fromEvent = (e: React.PointerEvent<SVGElement>) => {
    const svg = (e.currentTarget as SVGElement).ownerSVGElement ?? (e.currentTarget as SVGSVGElement);
    const rect = svg.getBoundingClientRect();
    const x = ((e.clientX - rect.left) / rect.width) * size - c;
    const y = ((e.clientY - rect.top) / rect.height) * size - c;
    return angleFromPointer(x, y, snapSpokes);
  };

  return (
    <g>
      {boundaries.map((b) => {
        const t = (b.angleDeg * Math.PI) / 180;
        const dx = Math.cos(t) * reach;
        const dy = -Math.sin(t) * reach;
        const active = b.key === activeKey;
        return (
          <g key={b.key} data-testid={`boundary-line-${b.key}`} data-angle={b.angleDeg}>
            <line x1={c - dx} y1={c - dy} x2={c + dx} y2={c + dy} stroke={active ? '#0E5D63' : '#5E5C57'} strokeWidth={active ? 2 : 1} strokeDasharray={active ? undefined : '6 4'} />
            <text x={c + dx} y={c + dy - 6} fontSize={11} fill="#23262B" textAnchor="middle">
              {b.label || b.key}
            </text>
            {active && editable
              ? ([1, -1] as const).map((end) => (
                  <circle
                    key={end}
                    cx={c + end * dx}
                    cy={c + end * dy}
                    r={9}
                    fill="#FAF7F0"
                    stroke="#0E5D63"
                    strokeWidth={2}
                    className="pointer-events-auto cursor-grab focus:outline-none"
                    tabIndex={0}
                    role="slider"
                    aria-label={`Angle of boundary ${b.label || b.key}`}
                    aria-valuemin={0}
                    aria-valuemax={179.99}
                    aria-valuenow={b.angleDeg}
                    aria-valuetext={`${b.angleDeg}°`}
                    data-testid={end === 1 ? `boundary-handle-${b.key}` : undefined}
                    onPointerDown={(e) => {
                      (e.currentTarget as SVGCircleElement).setPointerCapture(e.pointerId);
                      setDragging(b.key);
                    }}
                    onPointerMove={(e) => {
                      if (dragging !== b.key) return;
                      // The far handle points the other way along the same diameter: same line, same angle.
                      onAngle(b.key, fromEvent(e));
                    }}
                    onPointerUp={() => {
                      setDragging(null);
                    }}
                    onKeyDown={(e) => {
                      // Snapped, a key press moves to the next spoke diameter; free, 1° (Shift: 15°).
                      const spacing = snapSpokes ? (snapSpokes % 2 === 0 ? 360 : 180) / snapSpokes : e.shiftKey ? 15 : 1;
                      const sign = e.key === 'ArrowLeft' || e.key === 'ArrowUp' ? 1 : e.key === 'ArrowRight' || e.key === 'ArrowDown' ? -1 : 0;
                      if (!sign) return;
                      e.preventDefault();
                      const next = turn(b.angleDeg, sign * spacing);
                      onAngle(b.key, snapSpokes ? angleFromPointer(Math.cos((next * Math.PI) / 180), -Math.sin((next * Math.PI) / 180), snapSpokes) : next);
                    }}
                  />
                ))
              : null}
          </g>
        );
      })}
    </g>
  );
}
