import 'server-only';

type Level = 'debug' | 'info' | 'warn' | 'error';

/** One JSON line per event on stderr, with the error's cause chain for failures. */
export function logEvent(level: Level, message: string, fields: Record<string, unknown> = {}): void {
  const line: Record<string, unknown> = { level, time: new Date().toISOString(), message, ...fields };
  if (fields.error instanceof Error) line.error = serialiseError(fields.error);
  process.stderr.write(JSON.stringify(line) + '\n');
}

function serialiseError(error: Error, depth = 0): Record<string, unknown> {
  return {
    name: error.name,
    message: error.message,
    stack: error.stack,
    ...(error.cause instanceof Error && depth < 5 ? { cause: serialiseError(error.cause, depth + 1) } : {}),
  };
}
