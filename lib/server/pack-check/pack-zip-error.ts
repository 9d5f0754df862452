import 'server-only';

/** Why an uploaded zip was refused before it could be checked. */
export type PackZipErrorCode =
  | 'corrupt'
  | 'empty'
  | 'too-large'
  | 'too-many-entries'
  | 'too-much-data'
  | 'bomb'
  | 'unsafe-name'
  | 'duplicate-name'
  | 'symlink'
  | 'encrypted'
  | 'unsupported-method';

/** A zip the pack check refuses to read, with a message a person can act on and the entry at fault. */
export class PackZipError extends Error {
  readonly code: PackZipErrorCode;
  readonly entry: string | undefined;

  constructor(code: PackZipErrorCode, message: string, options: { entry?: string; cause?: unknown } = {}) {
    super(message, { cause: options.cause });
    this.name = 'PackZipError';
    this.code = code;
    this.entry = options.entry;
  }

  /** Limits exceeded (the upload is too big, or inflates too far) rather than a malformed or unsafe zip. */
  get isSizeLimit(): boolean {
    return this.code === 'too-large' || this.code === 'too-many-entries' || this.code === 'too-much-data' || this.code === 'bomb';
  }
}
