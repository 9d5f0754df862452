import type { Link } from '@/lib/stats';

/** A fitted psychometric function ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread). */
export interface CurveParameters {
  readonly link: Link;
  readonly threshold: number;
  readonly spread: number;
  readonly lapse: number;
}

/** One direction's panel: the observed proportions (with their trial counts) and the fitted curve, if any. */
export interface CurvePanel {
  readonly directionDeg: number;
  readonly points: readonly { readonly x: number; readonly n: number; readonly k: number }[];
  readonly curve: CurveParameters | null;
}

/** A per-direction estimate with its 95 % interval (null when there is none). */
export interface DirectionEstimate {
  readonly directionDeg: number;
  readonly value: number;
  readonly interval: readonly [number, number] | null;
}

/** Common options: the document's title (read by screen readers) and its description. */
export interface PlotText {
  readonly title: string;
  readonly description: string;
}
