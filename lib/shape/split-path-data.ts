import { readSubpaths } from './paper-scope';

/**
 * Splits SVG path data with several subpaths (`M … Z m … z`, relative moves included) into one absolute path
 * string per subpath, using paper.js's `CompoundPath` parser. Each part can go to `parseSvgOutline`.
 */
export function splitPathData(d: string): string[] {
  return readSubpaths(d).subpaths.map((child) => child.pathData);
}
