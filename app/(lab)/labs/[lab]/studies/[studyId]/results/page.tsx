import type { Metadata } from 'next';
import Link from 'next/link';
import { RefreshWhile } from '@/components/refresh-while';
import { ResultsExclusions } from '@/components/results-exclusions';
import { ResultsRetryButton } from '@/components/results-retry-button';
import { ResultsSettingsForm } from '@/components/results-settings-form';
import { Notice } from '@/components/ui/notice';
import type { DirectionFitValue, PlotKind, StudyReportValue } from '@/lib/schemas/study-results';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getStudy } from '@/lib/server/services/studies';
import { getStudyResults, listManualExclusions, plotSvgOf } from '@/lib/server/services/study-results';
import { listStudySessions } from '@/lib/server/services/study-sessions';

export const metadata: Metadata = { title: 'Study results' };

const num = (v: number | undefined | null, digits = 3) => (v === undefined || v === null || !Number.isFinite(v) ? '—' : v.toFixed(digits));
const ci = (i: readonly [number, number] | undefined | null, digits = 3) => (i ? `[${num(i[0], digits)}, ${num(i[1], digits)}]` : '—');
const pOf = (p: number | undefined | null) => (p === undefined || p === null ? '—' : p < 0.001 ? '< 0.001' : p.toFixed(3));
/** p as in prose: "p = 0.617" or "p < 0.001". */
const pText = (p: number) => (p < 0.001 ? 'p < 0.001' : `p = ${p.toFixed(3)}`);

function boundNote(f: DirectionFitValue): string {
  const notes = [
    f.fit?.bounds.spreadAtBound ? `spread at its ${f.fit.bounds.spreadAtBound} bound` : null,
    f.fit?.bounds.lapseAtBound === 'upper' ? 'λ at its maximum' : null,
    f.spreadAtBoundCount > 0 ? `${f.spreadAtBoundCount} resamples at a spread bound` : null,
    f.problem,
  ].filter(Boolean);
  return notes.length ? notes.join('; ') : '—';
}

function FitsTable({ fits, testId, caption }: { fits: readonly DirectionFitValue[]; testId: string; caption: string }) {
  const th = 'py-1.5 pr-3 font-medium';
  return (
    <div className="overflow-x-auto" role="region" aria-label={caption} tabIndex={0}>
      <table className="w-full text-sm" data-testid={testId}>
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b-[0.5px] border-rule-strong text-left text-xs text-graphite-soft">
            <th scope="col" className={th}>Direction</th>
            <th scope="col" className={th}>Trials</th>
            <th scope="col" className={th}>PSE [95 % CI]</th>
            <th scope="col" className={th}>Slope at PSE [95 % CI]</th>
            <th scope="col" className={th}>25–75 % spread</th>
            <th scope="col" className={th}>λ [95 % CI]</th>
            <th scope="col" className={th}>Deviance</th>
            <th scope="col" className={th}>Fit p</th>
            <th scope="col" className={th}>Notes</th>
          </tr>
        </thead>
        <tbody className="tabular">
          {fits.map((f) => (
            <tr key={`${f.participant ?? 'pooled'}:${f.directionDeg}`} className="border-b-[0.5px] border-rule align-top" data-testid="fit-row">
              <td className="py-1.5 pr-3">{f.directionDeg}°</td>
              <td className="py-1.5 pr-3">{f.trials}{f.misses ? ` (+${f.misses} missed)` : ''}</td>
              <td className="py-1.5 pr-3">{num(f.fit?.threshold)} {ci(f.intervals?.threshold)}</td>
              <td className="py-1.5 pr-3">{num(f.fit?.slopeAtThreshold, 2)} {ci(f.intervals?.slopeAtThreshold, 2)}</td>
              <td className="py-1.5 pr-3">{num(f.fit?.interquartileSpread)}</td>
              <td className="py-1.5 pr-3">{num(f.fit?.lapse)} {ci(f.intervals?.lapse)}</td>
              <td className="py-1.5 pr-3">{num(f.fit?.deviance, 2)}</td>
              <td className="py-1.5 pr-3">{pOf(f.goodnessOfFit?.p)}</td>
              <td className="py-1.5 font-sans text-xs">{boundNote(f)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Plot({ report, kind, href, label }: { report: StudyReportValue; kind: PlotKind; href: string; label: string }) {
  return (
    <figure className="space-y-1">
      {/* The SVG is built by lib/plot from numbers, with every text escaped. */}
      <div className="[&>svg]:h-auto [&>svg]:max-w-full" data-testid={`plot-${kind}`} dangerouslySetInnerHTML={{ __html: plotSvgOf(report, kind) }} />
      <figcaption className="text-xs text-graphite-soft">
        {label} ·{' '}
        <a href={href} download className="text-accent underline underline-offset-2" data-testid={`download-plot-${kind}`}>
          SVG
        </a>
      </figcaption>
    </figure>
  );
}

export default async function StudyResultsPage({ params }: { params: Promise<{ lab: string; studyId: string }> }) {
  const { lab, studyId } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/studies/${studyId}/results`);
  const db = getDb();
  const study = await getStudy(db, actor, studyId);
  const [results, manual, sessions] = await Promise.all([getStudyResults(db, actor, studyId), listManualExclusions(db, actor, studyId), listStudySessions(db, actor, studyId, { limit: 200 })]);
  const canEdit = can(actor.role, 'results:write');
  const api = `/api/v1/labs/${lab}/studies/${studyId}/results`;
  const report = results.report;
  const section = report?.sections.categorisation ?? null;
  const isComputing = results.state === 'queued' || results.state === 'running';

  return (
    <>
      <p className="mb-2 text-sm">
        <Link href={`/labs/${lab}/studies/${studyId}`} className="text-accent underline underline-offset-2">
          {study.name}
        </Link>
      </p>
      <h1 className="mb-2 text-2xl font-semibold" data-testid="results-title">
        Study results
      </h1>
      <p className="tabular mb-6 text-sm text-graphite-soft" data-testid="results-stamp">
        {study.edition.spaceName}, edition {study.edition.number}
        {report ? ` · edition hash ${report.edition.contentHash.slice(0, 12)} · data hash ${report.dataHash.slice(0, 12)}` : ''}
        {report ? ` · ${report.counts.participantsIncluded} of ${report.counts.participants} participants, ${report.counts.trialsInFits} of ${report.counts.trials} trials in the fits` : ''}
      </p>

      <div className="grid gap-10 2xl:grid-cols-[1fr_22rem]">
        <div className="min-w-0 space-y-10">
          {isComputing ? (
            <section aria-labelledby="computing-heading" data-testid="results-computing">
              <h2 id="computing-heading" className="mb-2 text-lg font-semibold">Computing the results…</h2>
              <div role="progressbar" aria-label="Results progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(results.progress * 100)} className="h-1.5 w-full max-w-md bg-paper-deep">
                <div className="h-full bg-accent" style={{ width: `${Math.round(results.progress * 100)}%` }} />
              </div>
              <p className="tabular mt-1 text-xs text-graphite-soft">{Math.round(results.progress * 100)} % · a background worker fits every direction with its bootstrap; this page updates itself.</p>
              <RefreshWhile active intervalMs={1500} />
            </section>
          ) : null}
          {results.state === 'failed' ? (
            <div className="space-y-3">
              <Notice tone="error" testId="results-failed">{results.error ?? 'The results could not be computed.'}</Notice>
              {canEdit ? <ResultsRetryButton lab={lab} studyId={studyId} /> : null}
            </div>
          ) : null}

          {report && !section ? <Notice testId="results-no-categorisation">This study has no two-choice categorisation task, so there is nothing to fit.</Notice> : null}

          {report && section ? (
            <>
              <section aria-labelledby="verdict-heading" className="space-y-3">
                <h2 id="verdict-heading" className="text-lg font-semibold">Isotropy verdict</h2>
                {section.verdict ? (
                  <p className="max-w-prose" data-testid="results-verdict">{section.verdict.text}</p>
                ) : (
                  <p className="max-w-prose" data-testid="results-verdict">No verdict yet: {section.notes.join(' ')}</p>
                )}
                <Notice tone="caution" testId="results-caution">
                  A test that does not reject is not proof of equality: with few participants or trials, real differences in slope or bias go undetected. Read the interval of the slope ratio, not only the p-value.
                </Notice>
                <table className="text-sm" data-testid="tests-table">
                  <caption className="sr-only">Tests</caption>
                  <tbody className="tabular">
                    <tr className="border-b-[0.5px] border-rule">
                      <th scope="row" className="py-1.5 pr-4 text-left font-sans font-medium">Common slope across directions (participants summed)</th>
                      <td className="py-1.5">{section.groupSlopeTest ? `χ²(${section.groupSlopeTest.df}) = ${num(section.groupSlopeTest.statistic, 2)}, ${pText(section.groupSlopeTest.p)}` : '—'}</td>
                    </tr>
                    <tr className="border-b-[0.5px] border-rule">
                      <th scope="row" className="py-1.5 pr-4 text-left font-sans font-medium">Every PSE = 0 (no bias, pooled)</th>
                      <td className="py-1.5">{section.noBiasTest ? `χ²(${section.noBiasTest.df}) = ${num(section.noBiasTest.statistic, 2)}, ${pText(section.noBiasTest.p)}` : '—'}</td>
                    </tr>
                    <tr className="border-b-[0.5px] border-rule">
                      <th scope="row" className="py-1.5 pr-4 text-left font-sans font-medium">Steepest / shallowest slope [95 % CI]</th>
                      <td className="py-1.5" data-testid="slope-ratio">{section.slopeRatio ? `${num(section.slopeRatio.ratio, 2)} ${ci(section.slopeRatio.interval, 2)}` : '—'}</td>
                    </tr>
                  </tbody>
                </table>
              </section>

              <section aria-labelledby="curves-heading" className="space-y-3">
                <h2 id="curves-heading" className="text-lg font-semibold">Psychometric curves by direction (pooled)</h2>
                <p className="max-w-prose text-sm text-graphite-soft">{section.xDefinition} PSE and spread in fractions of ρmax; slope per ρmax; fit p is the parametric-bootstrap goodness of fit.</p>
                <Plot report={report} kind="curves" href={`${api}/plots/curves`} label="Points sized by the number of trials" />
                <FitsTable fits={section.pooled} testId="pooled-fits" caption="Pooled fits by direction" />
              </section>

              <section aria-labelledby="slopes-heading" className="space-y-6">
                <h2 id="slopes-heading" className="text-lg font-semibold">Slope and PSE by direction</h2>
                <Plot report={report} kind="slopes" href={`${api}/plots/slopes`} label="Slope at the PSE, both ends of each diameter, with 95 % intervals" />
                <Plot report={report} kind="pse" href={`${api}/plots/pse`} label="PSE with 95 % intervals; dashed: no bias" />
              </section>

              <section aria-labelledby="participants-heading" className="space-y-3">
                <h2 id="participants-heading" className="text-lg font-semibold">Per participant</h2>
                <table className="text-sm" data-testid="participant-tests">
                  <caption className="sr-only">Slope test per participant</caption>
                  <thead>
                    <tr className="border-b-[0.5px] border-rule-strong text-left text-xs text-graphite-soft">
                      <th scope="col" className="py-1.5 pr-4 font-medium">Participant</th>
                      <th scope="col" className="py-1.5 font-medium">Common slope test</th>
                    </tr>
                  </thead>
                  <tbody className="tabular">
                    {section.slopeTests.map((t) => (
                      <tr key={t.participant} className="border-b-[0.5px] border-rule">
                        <td className="py-1.5 pr-4">{t.participant}</td>
                        <td className="py-1.5">{t.test ? `χ²(${t.test.df}) = ${num(t.test.statistic, 2)}, ${pText(t.test.p)}` : t.problem}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
                {section.participants.map((p) => (
                  <details key={p.participant} className="border-t-[0.5px] border-rule pt-2">
                    <summary className="cursor-pointer text-sm font-medium">Participant {p.participant}: fits by direction</summary>
                    <FitsTable fits={p.fits} testId={`participant-fits-${p.participant}`} caption={`Fits of participant ${p.participant}`} />
                  </details>
                ))}
              </section>
            </>
          ) : null}

          {report ? (
            <section aria-labelledby="exclusions-heading" className="space-y-3">
              <h2 id="exclusions-heading" className="text-lg font-semibold">Exclusions</h2>
              <ResultsExclusions lab={lab} studyId={studyId} exclusions={report.exclusions} manual={manual} sessions={sessions.items.filter((s) => !s.withdrawnAt).map((s) => ({ id: s.id, participant: s.participant }))} canEdit={canEdit} />
            </section>
          ) : null}
        </div>

        <aside className="space-y-8">
          <section aria-labelledby="exports-heading" className="space-y-2">
            <h2 id="exports-heading" className="text-lg font-semibold">Exports</h2>
            <ul className="space-y-1 text-sm">
              <li><a href={`${api}/trials/csv`} download className="text-accent underline underline-offset-2" data-testid="download-trials">trials.csv</a> — one row per trial, with exclusions</li>
              {report ? <li><a href={`${api}/fits/csv`} download className="text-accent underline underline-offset-2" data-testid="download-fits">fits.csv</a> — every fit with its intervals</li> : null}
              {report ? <li><a href={`${api}/report`} download className="text-accent underline underline-offset-2" data-testid="download-report">report.json</a> — everything on this page</li> : null}
            </ul>
            <p className="text-xs text-graphite-muted">Each file carries the study id and the edition&rsquo;s content hash. Exports are pseudonymous: participants are numbered, never named.</p>
          </section>
          <section aria-labelledby="settings-heading" className="space-y-2">
            <h2 id="settings-heading" className="text-lg font-semibold">Analysis settings</h2>
            <ResultsSettingsForm lab={lab} studyId={studyId} settings={results.settings} canEdit={canEdit} />
          </section>
        </aside>
      </div>
    </>
  );
}
