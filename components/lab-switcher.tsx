'use client';

import { useRouter } from 'next/navigation';

/** Switches between the labs the user belongs to. */
export function LabSwitcher({ current, labs }: { current: string; labs: { slug: string; name: string }[] }) {
  const router = useRouter();
  if (labs.length < 2) return <span className="text-sm text-graphite" data-testid="lab-name">{labs.find((l) => l.slug === current)?.name}</span>;
  return (
    <label className="flex items-center gap-2 text-sm">
      <span className="sr-only">Lab</span>
      <select
        value={current}
        onChange={(e) => router.push(`/labs/${e.target.value}`)}
        className="h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm"
        data-testid="lab-switcher"
      >
        {labs.map((l) => (
          <option key={l.slug} value={l.slug}>
            {l.name}
          </option>
        ))}
      </select>
    </label>
  );
}
