'use client';

import { useQuery } from '@tanstack/react-query';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import Link from 'next/link';
import { useMemo, useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import type { Page } from '@/lib/schemas/common';
import { FAMILY_LABELS } from '@/lib/schemas/descriptor';
import type { SeedShape } from '@/lib/schemas/seed-shapes';
import { ShapePreview } from './shape-preview';
import { DataTable } from './ui/data-table';

const column = createColumnHelper<SeedShape>();
const PAGE = 100;

/** The lab's seed shapes: thumbnail, family, harmonic count, who changed each last and when; sortable. */
export function SeedShapeTable({ lab, initial }: { lab: string; initial: Page<SeedShape> }) {
  const list = useQuery({
    queryKey: ['seed-shapes', lab],
    queryFn: () => apiFetch<Page<SeedShape>>(`/api/v1/labs/${lab}/seed-shapes?limit=${PAGE}`),
    initialData: initial,
  });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const columns = useMemo(
    () => [
      column.display({
        id: 'thumbnail',
        header: () => <span className="sr-only">Outline</span>,
        cell: (c) => <ShapePreview paths={[{ d: c.row.original.thumbnailPath, fill: '#23262B' }]} size={44} extent={1.6} label={`Outline of ${c.row.original.name}`} />,
      }),
      column.accessor('name', {
        header: 'Name',
        cell: (c) => (
          <Link href={`/labs/${lab}/seed-shapes/${c.row.original.id}`} className="text-accent underline underline-offset-2" data-testid={`seed-link-${c.getValue()}`}>
            {c.getValue()}
          </Link>
        ),
      }),
      column.accessor('family', { header: 'Family', cell: (c) => FAMILY_LABELS[c.getValue()] }),
      column.accessor('harmonicCount', { header: 'Harmonics', cell: (c) => <span className="tabular">{c.getValue()}</span> }),
      column.accessor('updatedBy', { header: 'Changed by', cell: (c) => c.getValue() ?? '—' }),
      column.accessor('updatedAt', { header: 'Changed', cell: (c) => <span className="tabular text-xs">{c.getValue().slice(0, 16).replace('T', ' ')}</span> }),
    ],
    [lab],
  );
  const table = useReactTable({
    data: list.data.items,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  if (list.data.items.length === 0) return <p className="text-graphite-muted">No seed shapes yet.</p>;
  return (
    <DataTable table={table} testId="seed-shape-table" dense />
  );
}
