import Link from 'next/link';

/** The lab's sections, in the order of the job. Entries join as their pages land. */
export const LAB_SECTIONS = [
  { segment: '', label: 'Overview' },
  { segment: 'seed-shapes', label: 'Seed shapes' },
  { segment: 'spaces', label: 'Shape spaces' },
  { segment: 'packs', label: 'Packs' },
  { segment: 'display-profiles', label: 'Display profiles' },
  { segment: 'studies', label: 'Norming studies' },
  { segment: 'settings/members', label: 'Members' },
  { segment: 'settings/api-tokens', label: 'API tokens' },
  { segment: 'api', label: 'API' },
  { segment: 'settings/audit', label: 'Audit log' },
] as const;

export function LabNav({ lab }: { lab: string }) {
  return (
    <nav aria-label="Lab sections" className="text-sm">
      <ul className="space-y-1 border-l-[0.5px] border-rule">
        {LAB_SECTIONS.map((s) => (
          <li key={s.label}>
            <Link
              href={`/labs/${lab}${s.segment ? `/${s.segment}` : ''}`}
              className="-ml-px block border-l border-transparent py-1.5 pl-4 text-graphite-soft hover:border-accent hover:text-graphite"
              data-testid={`nav-${s.label.toLowerCase().replace(/ /g, '-')}`}
            >
              {s.label}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
