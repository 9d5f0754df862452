import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/errors';
import type { PackManifest } from '@/lib/pack/types';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { getPack, getPackManifest } from '@/lib/server/services/packs';

export const metadata: Metadata = { title: 'Pack manifest' };

const SHOWN = 200;

export default async function PackManifestPage({ params }: { params: Promise<{ lab: string; packId: string }> }) {
  const { lab, packId } = await params;
  requireUuidSegment(packId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/packs/${packId}`);
  const [pack, manifest] = await Promise.all([getPack(getDb(), actor, packId), getPackManifest(getDb(), actor, packId).then((m) => m.manifest as PackManifest)]).catch((e: unknown) => {
    if (e instanceof AppError && (e.kind === 'not_found' || e.kind === 'conflict')) notFound();
    throw e;
  });
  const keys = manifest.boundaries.map((b) => b.key);
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/packs`} className="text-accent underline underline-offset-2">
          Packs
        </Link>{' '}
        / manifest
      </p>
      <h1 className="mb-2 text-2xl font-semibold">
        {pack.edition.spaceName}, edition {pack.edition.number}
      </h1>
      {manifest.notice ? <p className="mb-3 border-l-2 border-caution bg-caution-soft px-4 py-2 text-sm">{manifest.notice}</p> : null}
      <dl className="tabular mb-6 grid max-w-3xl grid-cols-[12rem_1fr] gap-x-4 gap-y-1 text-sm" data-testid="manifest-summary">
        <dt className="text-graphite-soft">Edition hash</dt>
        <dd className="break-all text-xs">{manifest.edition.contentHash}</dd>
        <dt className="text-graphite-soft">Pack SHA-256</dt>
        <dd className="break-all text-xs">{pack.sha256}</dd>
        <dt className="text-graphite-soft">Engine</dt>
        <dd>{manifest.engine.version}</dd>
        <dt className="text-graphite-soft">Display</dt>
        <dd>
          {manifest.displayProfile.name}: {manifest.displayProfile.resolutionPx.width} × {manifest.displayProfile.resolutionPx.height} px at {manifest.displayProfile.viewingDistanceCm} cm,{' '}
          {manifest.displayProfile.derived.pixelsPerDegree.toFixed(2)} px/°
        </dd>
        <dt className="text-graphite-soft">Drawn</dt>
        <dd>
          {manifest.render.options.sizeDeg}° ({manifest.render.options.sizeMeasure}), image {manifest.render.png.widthPx} × {manifest.render.png.heightPx} px, {manifest.render.options.style}, fill{' '}
          {manifest.render.options.fill} on {manifest.render.options.background}
        </dd>
        <dt className="text-graphite-soft">Nominal contrast</dt>
        <dd>
          ratio {manifest.render.contrast.luminanceRatio.toFixed(2)}:1, Michelson {manifest.render.contrast.michelson?.toFixed(3) ?? '—'} ({manifest.render.contrast.basis})
        </dd>
        <dt className="text-graphite-soft">Stimuli</dt>
        <dd data-testid="manifest-stimulus-count">
          {manifest.stimuli.length} ({manifest.space.layoutStimuli} on the layout, {manifest.space.prototypes} prototypes)
        </dd>
      </dl>
      <table className="w-full border-collapse text-sm" data-testid="manifest-stimuli">
        <thead>
          <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
            <th scope="col" className="py-2 pr-4 font-medium">Stimulus</th>
            <th scope="col" className="py-2 pr-4 font-medium">a, b</th>
            {keys.map((k) => (
              <th key={k} scope="col" className="py-2 pr-4 font-medium">
                {k}
              </th>
            ))}
            <th scope="col" className="py-2 pr-4 font-medium">PNG SHA-256</th>
          </tr>
        </thead>
        <tbody>
          {manifest.stimuli.slice(0, SHOWN).map((s) => (
            <tr key={s.id} className="tabular border-b-[0.5px] border-rule text-xs">
              <td className="py-1 pr-4">{s.id}</td>
              <td className="py-1 pr-4">
                {s.position.a.toFixed(3)}, {s.position.b.toFixed(3)}
              </td>
              {s.boundaries.map((b) => (
                <td key={b.boundaryKey} className="py-1 pr-4">
                  {b.category ?? 'on'} ({b.signedDistance.toFixed(3)})
                </td>
              ))}
              <td className="py-1 pr-4">{s.files.png.sha256.slice(0, 12)}…</td>
            </tr>
          ))}
        </tbody>
      </table>
      {manifest.stimuli.length > SHOWN ? <p className="mt-2 text-xs text-graphite-muted">The first {SHOWN} of {manifest.stimuli.length}; the JSON below has them all.</p> : null}
      <details className="mt-6 text-sm">
        <summary className="cursor-pointer font-medium">The whole manifest (JSON)</summary>
        <pre className="tabular mt-2 max-h-[32rem] overflow-auto border-[0.5px] border-rule bg-paper-raised p-3 text-xs">{JSON.stringify(manifest, null, 2)}</pre>
      </details>
    </>
  );
}
