import type { Metadata } from 'next';
import Link from 'next/link';
import { API_EXAMPLES, PYTHON_EXAMPLE } from '@/lib/api-examples';
import { ROLE_LABELS } from '@/lib/schemas/roles';
import '@/lib/server/api';
import { getEnv } from '@/lib/server/env';
import { registeredRoutes, type AnyRouteSpec } from '@/lib/server/http';
import { POLICY, TOKEN_SCOPE_ROLES, can } from '@/lib/server/policy';
import { requireLabPageActor } from '@/lib/server/page-context';

export const metadata: Metadata = { title: 'API' };

const METHOD_ORDER = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];

/** Who may call a route, in words: the roles of the policy table, and the token scopes that reach it. */
function whoMay(route: AnyRouteSpec): string {
  if (route.access.kind === 'public') return 'Anyone';
  if (route.access.kind === 'user') return 'A signed-in user (no token)';
  const action = route.access.action;
  const roles = POLICY[action].map((r) => ROLE_LABELS[r]).join(', ');
  const scopes = (Object.keys(TOKEN_SCOPE_ROLES) as (keyof typeof TOKEN_SCOPE_ROLES)[]).filter((s) => can(TOKEN_SCOPE_ROLES[s], action));
  return `${roles}${scopes.length ? ` · token: ${scopes.join(' or ')}` : ' · no token'}`;
}

function Code({ children, label }: { children: string; label: string }) {
  return (
    <pre aria-label={label} tabIndex={0} className="overflow-x-auto border-[0.5px] border-rule bg-paper-deep p-3 font-mono text-xs leading-relaxed">
      {children}
    </pre>
  );
}

export default async function ApiPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  await requireLabPageActor(lab, `/labs/${lab}/api`);
  const base = getEnv().APP_URL;
  const routes = registeredRoutes()
    .filter((r) => r.path.startsWith('/api/'))
    .sort((a, b) => a.path.localeCompare(b.path) || METHOD_ORDER.indexOf(a.method) - METHOD_ORDER.indexOf(b.method));
  return (
    <div className="max-w-5xl space-y-10">
      <header>
        <h1 className="mb-2 text-2xl font-semibold">API</h1>
        <p className="max-w-3xl text-sm text-graphite-soft">
          Scripts reach the lab through <span className="font-mono">{base}/api/v1/labs/{lab}/…</span> with a lab API token in the header{' '}
          <span className="font-mono">Authorization: Bearer epk_…</span>. An Owner makes tokens under{' '}
          <Link href={`/labs/${lab}/settings/api-tokens`} className="text-accent underline underline-offset-2">
            API tokens
          </Link>
          . The whole API is described by the OpenAPI 3.1 document at{' '}
          <a href="/api/v1/openapi.json" className="font-mono text-accent underline underline-offset-2" data-testid="openapi-link">
            /api/v1/openapi.json
          </a>
          , generated from the same schemas the server checks requests with.
        </p>
        <ul className="mt-3 max-w-3xl list-disc space-y-1 pl-5 text-sm text-graphite-soft">
          <li>Lists take <span className="font-mono">cursor</span> and <span className="font-mono">limit</span> (at most 200) and answer <span className="font-mono">{'{ items, nextCursor }'}</span>; pass <span className="font-mono">nextCursor</span> back until it is null.</li>
          <li>Errors are problem details (<span className="font-mono">application/problem+json</span>) with a <span className="font-mono">detail</span> in plain words and, for bad input, <span className="font-mono">errors</span> per field.</li>
          <li>A manifest and a pack download carry an ETag; send it back as <span className="font-mono">If-None-Match</span> to get 304 instead of the same bytes again.</li>
          <li>Each token may make a limited number of requests a minute; beyond it the answer is 429 with <span className="font-mono">Retry-After</span> in seconds.</li>
          <li>A token for another lab gets 404, as if nothing were there; a read token that tries to write gets 403.</li>
        </ul>
      </header>

      <section aria-labelledby="examples-heading" className="space-y-6">
        <h2 id="examples-heading" className="text-lg font-semibold">
          Examples
        </h2>
        <p className="text-sm text-graphite-soft">
          Set <span className="font-mono">EPICYCLE_URL={base}</span> and <span className="font-mono">EPICYCLE_TOKEN</span> first. The same examples are in the README.
        </p>
        {API_EXAMPLES.map((e) => (
          <div key={e.task} className="space-y-2" data-testid="api-example">
            <h3 className="text-sm font-semibold">{e.task}</h3>
            <Code label={`${e.task}: curl`}>{e.curl}</Code>
            <Code label={`${e.task}: R with httr2`}>{e.r}</Code>
          </div>
        ))}
        <div className="space-y-2">
          <h3 className="text-sm font-semibold">All three in Python, with requests</h3>
          <Code label="Python with requests">{PYTHON_EXAMPLE}</Code>
        </div>
      </section>

      <section aria-labelledby="endpoints-heading">
        <h2 id="endpoints-heading" className="mb-2 text-lg font-semibold">
          Every endpoint ({routes.length})
        </h2>
        <table className="w-full border-collapse text-sm" data-testid="api-endpoints">
          <thead>
            <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
              <th scope="col" className="py-2 pr-3 font-medium">Method</th>
              <th scope="col" className="py-2 pr-3 font-medium">Path</th>
              <th scope="col" className="py-2 pr-3 font-medium">What it does</th>
              <th scope="col" className="py-2 font-medium">Who may call it</th>
            </tr>
          </thead>
          <tbody>
            {routes.map((r) => (
              <tr key={`${r.method} ${r.path}`} className="border-b-[0.5px] border-rule align-top" data-testid={`endpoint-${r.id}`}>
                <td className="py-2 pr-3 font-mono text-xs">{r.method}</td>
                <td className="py-2 pr-3 font-mono text-xs break-all">{r.path}</td>
                <td className="py-2 pr-3">{r.summary}</td>
                <td className="py-2 text-xs text-graphite-soft">{whoMay(r)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}
