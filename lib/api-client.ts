import { isProblemDetails, type ErrorCode, type FieldErrors, type ProblemDetails } from './errors';

/** A failed API call, carrying the server's problem details; the client branches on `code`. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ErrorCode;
  readonly fields: FieldErrors;

  constructor(problem: ProblemDetails) {
    super(problem.detail);
    this.name = 'ApiError';
    this.status = problem.status;
    this.code = problem.code;
    this.fields = problem.errors ?? {};
  }
}

/** Calls an Epicycle API route with JSON in and out; throws `ApiError` for problem-details answers. */
export async function apiFetch<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const res = await fetch(path, {
    method: init.method ?? 'GET',
    headers: init.body === undefined ? {} : { 'content-type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
    credentials: 'same-origin',
  });
  if (res.status === 204) return undefined as T;
  const data: unknown = await res.json().catch(() => undefined);
  if (!res.ok) {
    throw new ApiError(
      isProblemDetails(data)
        ? data
        : { type: '/problems/internal/server', title: 'Error', status: res.status, detail: `The server answered ${res.status}.`, code: 'internal:server' },
    );
  }
  return data as T;
}
