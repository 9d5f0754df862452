/** Text made safe for SVG/XML content and attribute values (&, <, >, " and '). */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c] as string);
}

/** A coordinate with at most two decimals (SVG user units are pixels; finer is noise in the file). */
export function formatCoordinate(value: number): string {
  return (Math.round(value * 100) / 100).toString();
}

/** A tick label: up to three significant digits, no trailing zeros, "−" for minus. */
export function formatTick(value: number): string {
  if (value === 0) return '0';
  const text = Number(value.toPrecision(3)).toString();
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}
