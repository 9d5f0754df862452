import type { Metadata } from 'next';
import Link from 'next/link';
import { EqualizeSpaceButton } from '@/components/equalize-space-button';
import { Notice } from '@/components/ui/notice';
import { mdsMapSvg } from '@/lib/render/mds-map-svg';
import { rdmHeatmapsSvg } from '@/lib/render/rdm-heatmaps-svg';
import type { EqualizationSuggestionValue, StudySimilarityValue } from '@/lib/schemas/similarity';
import { getDb } from '@/lib/server/db';
import { orNotFound, requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getStudySimilarity } from '@/lib/server/services/study-similarity';

export const metadata: Metadata = { title: 'Perceptual vs designed similarity' };

const MODEL_LABELS = { design: 'Designed distance', contour: 'Contour distance', silhouette: 'Silhouette distance (1 − IoU)' } as const;

const num = (v: number | null | undefined, digits = 3) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits));
const pValue = (p: number) => (p < 0.001 ? p.toExponential(1) : p.toFixed(3));

function Suggestion({ s, lab, studyId, canDerive, defaultName, unit }: { s: EqualizationSuggestionValue; lab: string; studyId: string; canDerive: boolean; defaultName: string; unit: string }) {
  return (
    <div className="space-y-3" data-testid={`suggestion-${s.basis}`}>
      <table className="tabular w-full max-w-2xl text-sm">
        <thead>
          <tr className="border-b-[0.5px] border-rule text-left text-graphite-soft">
            <th className="py-1 pr-4 font-normal">Direction</th>
            <th className="py-1 pr-4 font-normal">Measured {unit}</th>
            <th className="py-1 pr-4 font-normal">Radius factor</th>
            <th className="py-1 font-normal">Predicted after</th>
          </tr>
        </thead>
        <tbody>
          {s.directions.map((d) => (
            <tr key={d.angleDeg} className="border-b-[0.5px] border-rule">
              <td className="py-1 pr-4 font-mono">{d.angleDeg.toFixed(1)}°</td>
              <td className="py-1 pr-4 font-mono">{num(d.rate)}</td>
              <td className="py-1 pr-4 font-mono">
                × {num(d.scale)}
                {d.limited ? ' (held at the floor)' : ''}
              </td>
              <td className="py-1 font-mono">{num(d.predictedRate)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-sm" data-testid={`ratio-${s.basis}`}>
        Largest / smallest {unit}: <span className="font-mono">{num(s.ratioBefore, 2)}</span> now, predicted <span className="font-mono">{num(s.ratioAfter, 2)}</span> after the change.
      </p>
      {canDerive ? <EqualizeSpaceButton lab={lab} studyId={studyId} basis={s.basis} defaultName={defaultName} /> : null}
    </div>
  );
}

function CorrelationTable({ v }: { v: StudySimilarityValue }) {
  return (
    <table className="tabular w-full max-w-3xl text-sm" data-testid="correlations">
      <thead>
        <tr className="border-b-[0.5px] border-rule text-left text-graphite-soft">
          <th className="py-1 pr-4 font-normal">Perceptual RDM against</th>
          <th className="py-1 pr-4 font-normal">Spearman ρ</th>
          <th className="py-1 pr-4 font-normal">Pairs</th>
          <th className="py-1 font-normal">Mantel p</th>
        </tr>
      </thead>
      <tbody>
        {v.correlations.map((c) => (
          <tr key={c.model} className="border-b-[0.5px] border-rule" data-testid={`correlation-${c.model}`}>
            <td className="py-1 pr-4">{MODEL_LABELS[c.model]}</td>
            <td className="py-1 pr-4 font-mono">{num(c.spearman)}</td>
            <td className="py-1 pr-4 font-mono">{c.pairs}</td>
            <td className="py-1 font-mono">{c.mantel ? pValue(c.mantel.p) : '—'}</td>
          </tr>
        ))}
        <tr>
          <td className="py-1 pr-4">Noise ceiling (split-half, Spearman–Brown)</td>
          <td className="py-1 pr-4 font-mono" data-testid="noise-ceiling">
            {num(v.noiseCeiling?.ceiling)}
          </td>
          <td className="py-1 pr-4 font-mono">{v.noiseCeiling?.pairs ?? '—'}</td>
          <td className="py-1 text-graphite-soft">{v.noiseCeiling ? `split by ${v.noiseCeiling.split}; split-half ρ ${num(v.noiseCeiling.splitHalf)}` : 'needs two participants or repeated pairs'}</td>
        </tr>
      </tbody>
    </table>
  );
}

export default async function StudySimilarityPage({ params }: { params: Promise<{ lab: string; studyId: string }> }) {
  const { lab, studyId } = await params;
  requireUuidSegment(studyId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/studies/${studyId}/similarity`);
  const v = await orNotFound(getStudySimilarity(getDb(), actor, studyId));
  const canDerive = can(actor.role, 'space:derive');
  const api = `/api/v1/labs/${lab}/studies/${studyId}/similarity`;
  const heatmaps =
    v.perceptual && v.models
      ? rdmHeatmapsSvg(
          [
            { title: 'Perceptual (ratings)', values: v.perceptual.values },
            { title: MODEL_LABELS.design, values: v.models.design },
            { title: MODEL_LABELS.contour, values: v.models.contour },
            { title: MODEL_LABELS.silhouette, values: v.models.silhouette },
          ],
          'The perceptual RDM beside the design, contour and silhouette RDMs, on one colour scale',
        )
      : null;
  const map = v.mds ? mdsMapSvg(v.stimuli.map((s, i) => ({ id: s.id, design: [s.a, s.b], recovered: v.mds!.aligned[i]! })), 'MDS map: each designed position joined to its recovered position') : null;
  const defaultName = `${v.edition.spaceName} (perceptually equalised)`.slice(0, 80);
  return (
    <>
      <p className="mb-2 text-sm">
        <Link href={`/labs/${lab}/studies/${studyId}`} className="text-accent underline underline-offset-2">
          {v.study.name}
        </Link>
      </p>
      <h1 className="mb-2 text-2xl font-semibold" data-testid="similarity-title">
        Perceptual vs designed similarity
      </h1>
      <p className="tabular mb-6 text-sm text-graphite-soft" data-testid="similarity-facts">
        {v.edition.spaceName}, edition {v.edition.number} (content hash <span className="font-mono">{v.edition.contentHash.slice(0, 12)}…</span>) · {v.ratings.count} ratings from {v.ratings.participants} {v.ratings.participants === 1 ? 'participant' : 'participants'} ·{' '}
        {v.stimuli.length} stimuli rated{v.ratings.excludedSessions > 0 ? ` · ${v.ratings.excludedSessions} excluded sessions left out` : ''}
      </p>
      <div className="space-y-10">
        <section aria-labelledby="rdm-heading" className="space-y-4">
          <h2 id="rdm-heading" className="text-lg font-semibold">
            Dissimilarity matrices
          </h2>
          {v.perceptual ? (
            <p className="max-w-3xl text-sm">
              Perceptual dissimilarity is (7 − mean rating) / 6 for each pair, so 0 means rated most similar{v.scale ? ` (“${v.scale.high}”)` : ''} and 1 least similar{v.scale ? ` (“${v.scale.low}”)` : ''}. Rows and columns are the
              rated stimuli in the edition&apos;s order. The Mantel tests relabel the stimuli {v.correlations[0]?.mantel?.permutations ?? 5000} times (seeded), p = (b + 1)/(m + 1), one-sided.
            </p>
          ) : (
            <Notice testId="no-ratings">This study has no pair-similarity ratings yet. The matrices appear once participants have rated pairs.</Notice>
          )}
          {heatmaps ? <div className="[&_svg]:h-auto [&_svg]:max-w-full" data-testid="rdm-heatmaps" dangerouslySetInnerHTML={{ __html: heatmaps }} /> : null}
          {v.perceptual ? <CorrelationTable v={v} /> : null}
          {v.perceptual ? (
            <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm" data-testid="similarity-downloads">
              <a href={`${api}/csv`} download className="text-accent underline underline-offset-2" data-testid="download-similarity-csv">
                similarity.csv
              </a>
              {(['perceptual', 'design', 'contour', 'silhouette'] as const).map((r) => (
                <a key={r} href={`${api}/rdms/${r}`} download className="text-accent underline underline-offset-2" data-testid={`download-rdm-${r}`}>
                  {r} RDM (TSV)
                </a>
              ))}
            </p>
          ) : null}
        </section>

        <section aria-labelledby="mds-heading" className="space-y-4">
          <h2 id="mds-heading" className="text-lg font-semibold">
            MDS map
          </h2>
          {v.mds && map ? (
            <div className="grid gap-8 lg:grid-cols-[auto_1fr]">
              <div className="[&_svg]:h-auto [&_svg]:max-w-full" data-testid="mds-map" dangerouslySetInnerHTML={{ __html: map }} />
              <div className="space-y-3 text-sm">
                {v.mds.method === 'classical' ? (
                  <>
                    <p data-testid="mds-method">
                      Classical (Torgerson) scaling of the perceptual RDM to two dimensions, rotated, reflected, scaled and shifted onto the designed positions (Procrustes): scale{' '}
                      <span className="font-mono">{num(v.mds.procrustes.scale)}</span>, residual sum of squares <span className="font-mono" data-testid="procrustes-residual">{num(v.mds.procrustes.residual, 4)}</span> (
                      <span className="font-mono">{num(v.mds.procrustes.standardizedResidual)}</span> of the design&apos;s spread). The two dimensions carry{' '}
                      <span className="font-mono">{num(100 * (v.mds.explained ?? 0), 1)} %</span> of Σ|λ|.
                    </p>
                    <table className="tabular text-sm" data-testid="eigenvalues">
                      <caption className="mb-1 text-left text-graphite-soft">Every eigenvalue, largest first</caption>
                      <tbody>
                        <tr>
                          {v.mds.eigenvalues.map((l, i) => (
                            <td key={i} className={`border-[0.5px] border-rule px-1.5 py-0.5 font-mono ${l < 0 ? 'text-danger' : ''}`}>
                              {l.toFixed(3)}
                            </td>
                          ))}
                        </tr>
                      </tbody>
                    </table>
                    <p className="max-w-xl text-graphite-soft" data-testid="negative-note">
                      {v.mds.negativeEigenvalues > 0
                        ? `${v.mds.negativeEigenvalues} eigenvalues are negative: no arrangement of points in any number of dimensions reproduces these dissimilarities exactly (they are not Euclidean distances). Small negative values are usual with rating noise; large ones, compared with the first two, mean the map leaves much of the data out.`
                        : 'No eigenvalue is negative: the dissimilarities behave like Euclidean distances.'}
                    </p>
                  </>
                ) : (
                  <p data-testid="mds-method">
                    {v.mds.unratedPairs} pairs have no rating, so classical scaling cannot be used. This map is metric MDS by majorisation (SMACOF) over the rated pairs only, started from the classical map of shortest paths between them, after{' '}
                    <span className="font-mono">{v.mds.iterations}</span> steps: stress-1 <span className="font-mono" data-testid="mds-stress">{num(v.mds.stress ?? 0, 3)}</span> (0 is a perfect fit). It is rotated, reflected, scaled and shifted onto the designed positions (Procrustes): scale{' '}
                    <span className="font-mono">{num(v.mds.procrustes.scale)}</span>, residual sum of squares <span className="font-mono" data-testid="procrustes-residual">{num(v.mds.procrustes.residual, 4)}</span> (
                    <span className="font-mono">{num(v.mds.procrustes.standardizedResidual)}</span> of the design&apos;s spread). Pairs rated by few people weigh as much as the others; where many are missing, read the map with care.
                  </p>
                )}
              </div>
            </div>
          ) : (
            <Notice testId="no-mds">{v.mdsNote}</Notice>
          )}
        </section>

        <section aria-labelledby="equalise-heading" className="space-y-4">
          <h2 id="equalise-heading" className="text-lg font-semibold">
            Perceptual equalisation
          </h2>
          <p className="max-w-3xl text-sm">
            A direction seen to change faster than the others per designed unit is compressed to match the slowest one, so perceived spacing becomes even. The new space is a copy of the edition&apos;s space with this
            radius re-mapping; the edition itself does not change. Norm the new space again before relying on it: the prediction assumes the response changes with the re-mapped radius alone.
          </p>
          <h3 className="font-semibold">From the psychometric slopes</h3>
          {v.slopes.length > 0 ? (
            <table className="tabular w-full max-w-2xl text-sm" data-testid="slopes">
              <thead>
                <tr className="border-b-[0.5px] border-rule text-left text-graphite-soft">
                  <th className="py-1 pr-4 font-normal">Diameter</th>
                  <th className="py-1 pr-4 font-normal">Trials</th>
                  <th className="py-1 pr-4 font-normal">Slope at PSE (per ρmax)</th>
                  <th className="py-1 pr-4 font-normal">PSE</th>
                  <th className="py-1 font-normal">Note</th>
                </tr>
              </thead>
              <tbody>
                {v.slopes.map((s) => (
                  <tr key={s.directionDeg} className="border-b-[0.5px] border-rule">
                    <td className="py-1 pr-4 font-mono">{s.directionDeg}°</td>
                    <td className="py-1 pr-4 font-mono">{s.trials}</td>
                    <td className="py-1 pr-4 font-mono">{num(s.slope)}</td>
                    <td className="py-1 pr-4 font-mono">{num(s.threshold)}</td>
                    <td className="py-1 text-graphite-soft">{s.error ?? (s.spreadAtBound ? `spread on its ${s.spreadAtBound} bound; left out` : '')}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
          {v.equalization.slopes ? (
            <Suggestion s={v.equalization.slopes} lab={lab} studyId={studyId} canDerive={canDerive} defaultName={defaultName} unit="slope" />
          ) : (
            <p className="text-sm text-graphite-soft">{v.equalization.slopesNote}</p>
          )}
          <h3 className="font-semibold">From the MDS map</h3>
          {v.equalization.map ? (
            <Suggestion s={v.equalization.map} lab={lab} studyId={studyId} canDerive={canDerive} defaultName={defaultName} unit="map rate" />
          ) : (
            <p className="text-sm text-graphite-soft" data-testid="map-note">
              {v.equalization.mapNote}
            </p>
          )}
          {v.derivedSpaces.length > 0 ? (
            <div className="text-sm" data-testid="derived-spaces">
              <h3 className="mb-1 font-semibold">Spaces made from this study</h3>
              <ul className="list-disc pl-5">
                {v.derivedSpaces.map((d) => (
                  <li key={d.id}>
                    <Link href={`/labs/${lab}/spaces/${d.id}`} className="text-accent underline underline-offset-2">
                      {d.name}
                    </Link>{' '}
                    (from the {d.basis === 'slopes' ? 'slopes' : 'MDS map'})
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </section>
      </div>
    </>
  );
}
