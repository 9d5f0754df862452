/** Characters that make a spreadsheet read a cell as a formula (OWASP's CSV-injection list). */
export const FORMULA_START = /^[=+\-@\t\r]/;
const NUMBER = /^-?\d+(\.\d+)?(e[+-]?\d+)?$/i;

/**
 * A cell made safe for spreadsheets (OWASP, "CSV Injection"): text that starts with `=`, `+`, `-`, `@`, a tab or a
 * carriage return gets a leading apostrophe, so the spreadsheet shows it as text instead of running it. Numbers
 * are left as they are: a negative position such as `-0.4` is data, not a formula. null and undefined are empty.
 */
export function neutralizeCsvCell(value: unknown): string {
  if (value === null || value === undefined) return '';
  const text = String(value);
  if (typeof value === 'number' || NUMBER.test(text)) return text;
  return FORMULA_START.test(text) ? `'${text}` : text;
}
