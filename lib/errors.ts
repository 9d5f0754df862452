/**
 * The one error vocabulary, shared by server and client. A code has the form `kind:area`
 * (e.g. `validation:seed-shape`); the HTTP status comes from the kind alone, and the client branches on the code,
 * never on message text. Problem details follow RFC 9457.
 */

export const ERROR_KINDS = {
  validation: { status: 400, title: 'The request is not valid' },
  unauthenticated: { status: 401, title: 'Sign-in required' },
  forbidden: { status: 403, title: 'Not allowed' },
  not_found: { status: 404, title: 'Not found' },
  conflict: { status: 409, title: 'Conflict with the current state' },
  too_large: { status: 413, title: 'Too large' },
  rate_limited: { status: 429, title: 'Too many requests' },
  unavailable: { status: 503, title: 'Temporarily unavailable' },
  internal: { status: 500, title: 'Something went wrong on our side' },
} as const;

export type ErrorKind = keyof typeof ERROR_KINDS;
export type ErrorCode = `${ErrorKind}:${string}`;

/** Field path (dot-joined, e.g. `terms.2.amplitude`) → messages for that field. */
export type FieldErrors = Record<string, string[]>;

export interface ProblemDetails {
  type: string;
  title: string;
  status: number;
  detail: string;
  code: ErrorCode;
  errors?: FieldErrors;
  instance?: string;
}

export const PROBLEM_CONTENT_TYPE = 'application/problem+json';

const GENERIC_INTERNAL_DETAIL = 'An unexpected error occurred. It has been logged; please try again.';

/** A domain error: its kind decides the HTTP status; `cause` keeps the original error for the server log. */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields: FieldErrors | undefined;
  readonly headers: Record<string, string> | undefined;

  constructor(
    code: ErrorCode,
    message: string,
    options: { fields?: FieldErrors; cause?: unknown; headers?: Record<string, string> } = {},
  ) {
    super(message, { cause: options.cause });
    this.name = 'AppError';
    this.code = code;
    this.fields = options.fields;
    this.headers = options.headers;
  }

  get kind(): ErrorKind {
    return kindOf(this.code);
  }

  get status(): number {
    return ERROR_KINDS[this.kind].status;
  }
}

/** The kind part of a code; unknown kinds count as internal. */
export function kindOf(code: string): ErrorKind {
  const kind = code.split(':', 1)[0] ?? '';
  return kind in ERROR_KINDS ? (kind as ErrorKind) : 'internal';
}

export const validationError = (area: string, message: string, fields?: FieldErrors) =>
  new AppError(`validation:${area}`, message, { fields });
export const notFound = (area: string, message = 'Not found.') => new AppError(`not_found:${area}`, message);
export const forbidden = (area: string, message = 'You do not have permission to do that.') =>
  new AppError(`forbidden:${area}`, message);
export const conflict = (area: string, message: string, fields?: FieldErrors) =>
  new AppError(`conflict:${area}`, message, { fields });
export const unauthenticated = (message = 'Please sign in.') => new AppError('unauthenticated:session', message);

/** Maps any thrown value to problem details. Unknown errors become a generic 500 that reveals nothing. */
export function toProblemDetails(error: unknown, instance?: string): ProblemDetails {
  if (error instanceof AppError && error.kind !== 'internal') {
    const kind = ERROR_KINDS[error.kind];
    return {
      type: `/problems/${error.code.replace(':', '/')}`,
      title: kind.title,
      status: kind.status,
      detail: error.message,
      code: error.code,
      ...(error.fields ? { errors: error.fields } : {}),
      ...(instance ? { instance } : {}),
    };
  }
  return {
    type: '/problems/internal/server',
    title: ERROR_KINDS.internal.title,
    status: 500,
    detail: GENERIC_INTERNAL_DETAIL,
    code: 'internal:server',
    ...(instance ? { instance } : {}),
  };
}

/** Type guard for a parsed JSON body that is problem details (client side). */
export function isProblemDetails(value: unknown): value is ProblemDetails {
  return (
    typeof value === 'object' &&
    value !== null &&
    typeof (value as ProblemDetails).status === 'number' &&
    typeof (value as ProblemDetails).code === 'string'
  );
}

/** The result type every server action returns: success, or a failure with per-field messages. */
export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; code: ErrorCode; message: string; fields?: FieldErrors };
