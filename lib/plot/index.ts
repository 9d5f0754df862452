// lib/plot — analysis plots as standalone SVG text (shown inline and downloaded as files): psychometric curves per
// direction, slope by direction in polar form, PSE by direction. Pure and deterministic: same data → same bytes.

export type { CurvePanel, CurveParameters, DirectionEstimate, PlotText } from './types';
export { PLOT_STYLE } from './plot-style';
export { escapeXml, formatCoordinate, formatTick } from './svg-text';
export { niceTicks } from './nice-ticks';
export { svgDocument } from './svg-document';
export { psychometricCurvesSvg } from './psychometric-curves-svg';
export { slopePolarSvg } from './slope-polar-svg';
export { pseByDirectionSvg } from './pse-by-direction-svg';
