import { SiteHeader } from '@/components/site-header';
import { ButtonLink } from '@/components/ui/button-link';
import { contourToSvgPath } from '@/lib/shape/contour-to-svg-path';
import { synthesizeContour } from '@/lib/shape/synthesize-contour';

const STEPS = [
  ['Seed shapes', 'Describe a seed outline by its Fourier harmonics, or fit harmonics to an outline you upload.'],
  ['Shape spaces', 'Sweep two axes in descriptor space into rings, a lattice or diameters, with size and position held fixed.'],
  ['Boundaries', 'Draw category boundaries as diameters of the circular space and read every stimulus’s signed distance.'],
  ['Editions & review', 'Freeze a space as an immutable edition; a reviewer comments on single stimuli and approves it.'],
  ['Stimulus packs', 'Download SVG and PNG sized in degrees of visual angle, a manifest, model RDMs and checksums.'],
  ['Norming studies', 'Run two-choice categorisation and pair-similarity sessions in the browser, then fit and compare.'],
  ['Run orders', 'Produce carry-over balanced trial orders for scanning and EEG as BIDS events.tsv files.'],
] as const;

export default function LandingPage() {
  return (
    <>
      <SiteHeader>
        <ButtonLink href="/sign-in" variant="quiet" data-testid="sign-in-link">
          Sign in
        </ButtonLink>
      </SiteHeader>
      <main id="main" className="mx-auto max-w-page px-6 pb-24">
        <section className="grid gap-10 py-16 md:grid-cols-[3fr_2fr] md:items-center">
          <div>
            <p className="tabular text-xs uppercase tracking-[0.14em] text-graphite-muted">
              Shape stimuli for vision science
            </p>
            <h1 className="mt-4 text-4xl font-semibold leading-tight text-graphite md:text-5xl">
              Novel shapes whose similarity you set, and can prove.
            </h1>
            <p className="mt-6 max-w-xl text-lg leading-relaxed text-graphite-soft">
              Epicycle builds two-dimensional shape spaces from Fourier descriptors, freezes them into reviewed
              editions, exports reproducible stimulus packs, and checks with norming studies that people perceive the
              space the way it was built — before a behavioural, EEG or MRI study begins.
            </p>
            <div className="mt-8 flex gap-3">
              <ButtonLink href="/sign-in">Open your lab</ButtonLink>
              <ButtonLink href="/sign-up" variant="quiet">
                Start a lab
              </ButtonLink>
            </div>
          </div>
          <HeroFigure />
        </section>

        <section aria-labelledby="steps" className="border-t-[0.5px] border-rule pt-10">
          <h2 id="steps" className="text-sm font-semibold uppercase tracking-[0.12em] text-graphite-muted">
            From seed to scanner
          </h2>
          <ol className="mt-6 grid gap-x-10 gap-y-6 md:grid-cols-2">
            {STEPS.map(([title, text], i) => (
              <li key={title} className="grid grid-cols-[2rem_1fr] gap-2 border-t-[0.5px] border-rule pt-4">
                <span className="tabular text-sm text-accent">{String(i + 1).padStart(2, '0')}</span>
                <div>
                  <h3 className="font-medium">{title}</h3>
                  <p className="mt-1 text-sm leading-relaxed text-graphite-soft">{text}</p>
                </div>
              </li>
            ))}
          </ol>
        </section>
      </main>
    </>
  );
}

/** A ring of radial-frequency outlines around a seed, drawn by the contour engine: the kind of space Epicycle builds. */
function HeroFigure() {
  const spokes = 8;
  const shapes = Array.from({ length: spokes }, (_, i) => {
    const angle = (2 * Math.PI * i) / spokes;
    return { cx: 150 + 100 * Math.cos(angle), cy: 150 - 100 * Math.sin(angle), a: 0.12 * Math.cos(angle), b: 0.12 * Math.sin(angle), upper: Math.sin(angle) > 1e-9 };
  });
  return (
    <figure className="mx-auto w-full max-w-sm" aria-label="A ring of shapes around a seed shape">
      <svg viewBox="0 0 300 300" className="w-full" role="img" aria-hidden="true">
        <circle cx="150" cy="150" r="100" fill="none" stroke="#DDD6C8" strokeWidth="0.8" />
        <line x1="40" y1="150" x2="260" y2="150" stroke="#0E5D63" strokeWidth="0.8" strokeDasharray="3 3" />
        <path d={outline(150, 150, 0, 0)} fill="#23262B" />
        {shapes.map((s, i) => (
          <path key={i} d={outline(s.cx, s.cy, s.a, s.b)} fill={s.upper ? '#D55E00' : '#0072B2'} />
        ))}
      </svg>
    </figure>
  );
}

/** A seed with a third harmonic, moved along its 2nd and 5th harmonics, in page coordinates. */
function outline(cx: number, cy: number, a2: number, a5: number): string {
  const contour = synthesizeContour(
    { family: 'radial', baseRadius: 22, terms: [{ k: 2, amplitude: a2, phase: 0 }, { k: 3, amplitude: 0.18, phase: 0 }, { k: 5, amplitude: a5, phase: 0.6 }] },
    128,
  );
  return contourToSvgPath({ x: contour.x.map((v) => v + cx), y: contour.y.map((v) => v - cy) }, { decimals: 2 });
}
