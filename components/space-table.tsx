import Link from 'next/link';
import type { ShapeSpace } from '@/lib/schemas/space';

const LAYOUT = (s: ShapeSpace) =>
  s.layout.kind === 'rings' ? `Rings ${s.layout.rings} × ${s.layout.spokes} + centre` : s.layout.kind === 'lattice' ? `Lattice ${s.layout.size} × ${s.layout.size}` : `Diameters ${s.layout.directions} × ${s.layout.steps}`;

/** The lab's shape spaces. */
export function SpaceTable({ lab, spaces }: { lab: string; spaces: ShapeSpace[] }) {
  if (spaces.length === 0) return <p className="text-graphite-muted">No shape spaces yet.</p>;
  return (
    <table className="w-full border-collapse text-sm" data-testid="space-table">
      <thead>
        <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
          <th scope="col" className="py-2 pr-4 font-medium">Name</th>
          <th scope="col" className="py-2 pr-4 font-medium">Seed shape</th>
          <th scope="col" className="py-2 pr-4 font-medium">Layout</th>
          <th scope="col" className="py-2 pr-4 font-medium">Stimuli</th>
          <th scope="col" className="py-2 pr-4 font-medium">Changed</th>
        </tr>
      </thead>
      <tbody>
        {spaces.map((s) => (
          <tr key={s.id} className="border-b-[0.5px] border-rule">
            <td className="py-2 pr-4">
              <Link href={`/labs/${lab}/spaces/${s.id}`} className="text-accent underline underline-offset-2" data-testid={`space-link-${s.name}`}>
                {s.name}
              </Link>
            </td>
            <td className="py-2 pr-4">{s.seedShape.name}</td>
            <td className="py-2 pr-4">{LAYOUT(s)}</td>
            <td className="tabular py-2 pr-4">{s.stimulusCount}</td>
            <td className="tabular py-2 pr-4 text-xs">
              {s.updatedAt.slice(0, 16).replace('T', ' ')} · {s.updatedBy ?? '—'}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
