'use client';

import { checkRender } from '@/lib/render/check-render';
import type { DisplayProfile } from '@/lib/render/types';
import type { RenderOptionsValue } from '@/lib/schemas/render';

const inputClass = 'tabular mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';

function colourText(c: string | number): string {
  return typeof c === 'number' ? String(c) : c;
}
function parseColour(text: string): string | number {
  const t = text.trim();
  return /^\d{1,3}$/.test(t) ? Number(t) : t;
}

/**
 * Render options with their consequences on a display, live: the image and stimulus size in pixels, the stroke,
 * and the nominal sRGB contrast figures (IEC 61966-2-1 decoding). Errors and warnings come from `lib/render`.
 */
export function RenderCheckPanel({ profile, options, onChange, disabled = false }: { profile: DisplayProfile | null; options: RenderOptionsValue; onChange: (o: RenderOptionsValue) => void; disabled?: boolean }) {
  const check = profile ? checkRender(profile, options) : null;
  const set = (patch: Partial<RenderOptionsValue>) => onChange({ ...options, ...patch });
  return (
    <fieldset disabled={disabled} className="space-y-3 text-sm" data-testid="render-check">
      <legend className="text-base font-semibold">How stimuli are drawn</legend>
      <div className="flex flex-wrap items-end gap-3">
        <label className="text-xs">
          Size (° of visual angle)
          <input type="number" step={0.1} value={options.sizeDeg} onChange={(e) => set({ sizeDeg: Number(e.target.value) })} className={`${inputClass} w-24`} data-testid="render-size" />
        </label>
        <label className="text-xs">
          The size measures
          <select value={options.sizeMeasure} onChange={(e) => set({ sizeMeasure: e.target.value as RenderOptionsValue['sizeMeasure'] })} className={inputClass} data-testid="render-measure">
            <option value="equal-area-diameter">equal-area diameter</option>
            <option value="max-extent">maximum extent</option>
          </select>
        </label>
        <label className="text-xs">
          Image side (°)
          <input type="number" step={0.1} value={options.canvasDeg} onChange={(e) => set({ canvasDeg: Number(e.target.value) })} className={`${inputClass} w-24`} data-testid="render-canvas" />
        </label>
        <label className="text-xs">
          Drawn as
          <select
            value={options.style}
            onChange={(e) => {
              const style = e.target.value as RenderOptionsValue['style'];
              set({ style, strokeArcmin: style === 'outline' ? options.strokeArcmin ?? 3 : null });
            }}
            className={inputClass}
            data-testid="render-style"
          >
            <option value="silhouette">filled silhouette</option>
            <option value="outline">outline</option>
          </select>
        </label>
        {options.style === 'outline' ? (
          <label className="text-xs">
            Stroke (arcmin)
            <input type="number" step={0.5} value={options.strokeArcmin ?? ''} onChange={(e) => set({ strokeArcmin: Number(e.target.value) || null })} className={`${inputClass} w-24`} data-testid="render-stroke" />
          </label>
        ) : null}
        <label className="text-xs">
          Fill (grey 0–255 or #hex)
          <input value={colourText(options.fill)} onChange={(e) => set({ fill: parseColour(e.target.value) })} className={`${inputClass} w-28`} data-testid="render-fill" />
        </label>
        <label className="text-xs">
          Background
          <input value={colourText(options.background)} onChange={(e) => set({ background: parseColour(e.target.value) })} className={`${inputClass} w-28`} data-testid="render-background" />
        </label>
        <label className="flex items-center gap-2 text-xs">
          <input type="checkbox" checked={options.antiAlias} onChange={(e) => set({ antiAlias: e.target.checked })} />
          anti-aliased edges
        </label>
        <label className="flex items-center gap-2 text-xs">
          <input type="checkbox" checked={options.transparent} onChange={(e) => set({ transparent: e.target.checked })} />
          transparent PNG background
        </label>
      </div>
      {check?.sizes ? (
        <p className="tabular text-xs" data-testid="render-sizes">
          {check.sizes.pixelsPerDegree.toFixed(2)} px/° · stimulus {check.sizes.stimulusPx.toFixed(1)} px · image {check.sizes.canvasPx} × {check.sizes.canvasPx} px ({check.sizes.canvasMm.toFixed(1)} mm)
          {options.style === 'outline' ? ` · stroke ${check.sizes.strokePx.toFixed(2)} px` : ''}
        </p>
      ) : null}
      {check?.contrast ? (
        <p className="tabular text-xs" data-testid="render-contrast">
          Nominal sRGB values, not measured luminance: fill L = {check.contrast.fillLuminance.toFixed(4)}, background L = {check.contrast.backgroundLuminance.toFixed(4)} · luminance ratio{' '}
          {check.contrast.luminanceRatio.toFixed(2)}:1 · Weber {check.contrast.weber === null ? '—' : check.contrast.weber.toFixed(3)} · Michelson {check.contrast.michelson === null ? '—' : check.contrast.michelson.toFixed(3)}
        </p>
      ) : null}
      {check?.errors.map((i) => (
        <p key={`${i.field}-${i.code}`} className="text-xs text-danger" data-testid="render-error">
          {i.message}
        </p>
      ))}
      {check?.warnings.map((i) => (
        <p key={`${i.field}-${i.code}`} className="text-xs text-caution" data-testid="render-warning">
          {i.message}
        </p>
      ))}
      <p className="text-xs text-graphite-muted">For luminance-critical work, measure the screen with a photometer; these figures assume an ideal sRGB display.</p>
    </fieldset>
  );
}
