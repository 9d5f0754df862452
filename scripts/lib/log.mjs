// One-line, prefixed logging for the start and test scripts.
export function log(area, message) {
  process.stdout.write(`[${area}] ${message}\n`);
}
