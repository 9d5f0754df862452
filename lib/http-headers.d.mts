export interface HeaderEntry {
  key: string;
  value: string;
}
export function siteHeaders(isProduction: boolean): HeaderEntry[];
export const API_HEADERS: readonly HeaderEntry[];
