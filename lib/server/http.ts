import 'server-only';
import { z } from 'zod';
import {
  AppError,
  forbidden,
  PROBLEM_CONTENT_TYPE,
  toProblemDetails,
  unauthenticated,
  validationError,
  type ActionResult,
  type FieldErrors,
} from '@/lib/errors';
import { getRequestPrincipal, type Principal } from './auth/principal';
import { logEvent } from './log';
import { getDb } from './db';
import { getEnv } from './env';
import type { PolicyAction } from './policy';
import { authorize, resolveLabActor, type LabActor } from './services/access';

/**
 * The route and action wrappers, and the one registry of API routes. Every route declares its method, path,
 * request and response schemas and the policy action it needs; the OpenAPI document and the authorisation tests
 * are generated from `ROUTE_REGISTRY`.
 */

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Who may call a route: anyone, any signed-in user, or a lab member whose role allows `action`. */
export type Access = { kind: 'public' } | { kind: 'user' } | { kind: 'lab'; action: PolicyAction };

type AnyObject = z.ZodType<Record<string, unknown>>;

export interface RouteContext<P, Q, B> {
  params: P;
  query: Q;
  body: B;
  principal: Principal;
  request: Request;
  /** The caller as a member of the route's lab (lab routes only; already authorised for the route's action). */
  labActor: () => LabActor;
  /** The raw body, for routes that take a file as text (`textBody`). */
  text: string;
  /** The file, for routes that take one as bytes (`binaryBody`) when it came in one of those types; else undefined. */
  bytes: Uint8Array | undefined;
}

export interface RouteSpec<P extends AnyObject, Q extends AnyObject, B extends z.ZodType, R extends z.ZodType> {
  /** Stable operation id, e.g. `listLabs`. */
  id: string;
  method: HttpMethod;
  /** OpenAPI-style path, e.g. `/api/v1/labs/{lab}/members`. */
  path: `/api/${string}`;
  summary: string;
  tags?: string[];
  access: Access;
  params?: P;
  query?: Q;
  body?: B;
  response: R;
  successStatus?: 200 | 201 | 202 | 204;
  /** The answer is a file of this media type (e.g. `application/zip`, `text/csv`), not JSON; documented as such. */
  produces?: string;
  /** The answer carries an ETag and is 304 when If-None-Match names it (documented as such). */
  etag?: true;
  /** Error statuses the route answers besides the ones its access implies (documented in OpenAPI). */
  errors?: readonly (404 | 409 | 413)[];
  /** Largest accepted body in bytes (default 256 KiB), enforced while the stream is read. */
  maxBodyBytes?: number;
  /** The route takes a file as text of these content types instead of JSON (e.g. an SVG upload). */
  textBody?: { contentTypes: readonly string[] };
  /**
   * The route also takes a file as raw bytes of these content types (e.g. a zip), read with a hard cap of
   * `maxBytes` before anything parses it. Such a request reaches the handler as `bytes`, with `body` left
   * unparsed (undefined), so the route's `body` schema must accept undefined; other types are read as JSON.
   */
  binaryBody?: { contentTypes: readonly string[]; maxBytes: number };
  /** Returns the JSON body (validated against `response`), or a ready `Response` for downloads and custom statuses. */
  handler: (ctx: RouteContext<z.infer<P>, z.infer<Q>, z.infer<B>>) => Promise<z.input<R> | Response>;
}

export type AnyRouteSpec = RouteSpec<AnyObject, AnyObject, z.ZodType, z.ZodType>;

const DEFAULT_MAX_BODY_BYTES = 256 * 1024;

/** The largest body a route takes, in bytes. */
export const maxBodyBytesOf = (route: AnyRouteSpec): number => route.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES;
const EMPTY_OBJECT = z.object({});

const registry = new Map<string, AnyRouteSpec>();

/** Declares a route and adds it to the registry. Ids and method+path pairs are unique. */
export function defineRoute<P extends AnyObject, Q extends AnyObject, B extends z.ZodType, R extends z.ZodType>(
  spec: RouteSpec<P, Q, B, R>,
): RouteSpec<P, Q, B, R> {
  const key = `${spec.method} ${spec.path}`;
  for (const existing of registry.values()) {
    if (existing.id === spec.id && `${existing.method} ${existing.path}` !== key) {
      throw new Error(`duplicate route id ${spec.id}`);
    }
  }
  registry.set(key, spec as unknown as AnyRouteSpec);
  return spec;
}

/** Every declared route (after the route modules have been imported, see `lib/server/api/index.ts`). */
export function registeredRoutes(): AnyRouteSpec[] {
  return [...registry.values()];
}

/** Turns a zod failure into per-field messages keyed by dot-joined path (`_` for the whole value). */
export function fieldErrorsOf(error: z.ZodError, prefix?: string): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const path = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || '_';
    (fields[path] ??= []).push(issue.message);
  }
  return fields;
}

/** The dot-joined path of the first string holding a NUL character, which PostgreSQL cannot store in text or jsonb. */
function findNulCharacter(value: unknown, path: string[] = []): string | undefined {
  if (typeof value === 'string') return value.includes('\u0000') ? path.join('.') || '_' : undefined;
  if (value === null || typeof value !== 'object') return undefined;
  for (const [key, item] of Object.entries(value)) {
    if (key.includes('\u0000')) return [...path, key].join('.');
    const found = findNulCharacter(item, [...path, key]);
    if (found !== undefined) return found;
  }
  return undefined;
}

function parseWith<S extends z.ZodType>(schema: S, value: unknown, part: string): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    throw validationError('request', `The ${part} is not valid.`, fieldErrorsOf(result.error));
  }
  const nul = findNulCharacter(result.data);
  if (nul !== undefined) throw validationError('request', `The ${part} is not valid.`, { [nul]: ['Contains a NUL character'] });
  return result.data;
}

/**
 * A request as the route runner reads it, whatever carried it: Next's web Request (`toHandler`) or the answer fast
 * path's Node request (server/ingest.ts). The body is the web stream, or bytes the carrier already read, which it
 * must stop reading one byte past the route's cap (`maxBodyBytesOf`) so that the cap below is the one that decides.
 */
export interface RouteRequest {
  method: string;
  url: URL;
  headers: { get(name: string): string | null };
  body: ReadableStream<Uint8Array> | Uint8Array | null;
  /** The web Request, for handlers that read it themselves (made on first use). */
  request: () => Request;
}

/** What a route answers: a JSON (or problem) body with its status and headers, or a ready Response (downloads). */
export type RouteAnswer = { status: number; headers: Record<string, string>; body: string | null } | Response;

async function readJsonBody(request: RouteRequest, maxBytes: number): Promise<unknown> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw new AppError('too_large:request', `The request body is over ${maxBytes} bytes.`);
  const text = await readTextCapped(request, maxBytes);
  if (text.trim() === '') return undefined;
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    throw validationError('request', 'Send the body as application/json.');
  }
  try {
    return JSON.parse(text);
  } catch {
    throw validationError('request', 'The body is not valid JSON.');
  }
}

async function readTextBody(request: RouteRequest, maxBytes: number, contentTypes: readonly string[]): Promise<string> {
  const type = contentTypeOf(request);
  if (!contentTypes.includes(type)) {
    throw validationError('request', `Send the file as ${contentTypes.join(' or ')}.`, { file: [`Unsupported type ${type || '(none)'}`] });
  }
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw new AppError('too_large:request', `The file is over ${Math.round(maxBytes / 1024)} KiB.`, { fields: { file: ['Too large'] } });
  return readTextCapped(request, maxBytes);
}

/** Reads a request body as text, stopping with 413 as soon as it passes `maxBytes`. */
async function readTextCapped(request: RouteRequest, maxBytes: number): Promise<string> {
  return new TextDecoder().decode(await readBytesCapped(request, maxBytes));
}

const contentTypeOf = (request: RouteRequest): string => (request.headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();
const mebibytes = (bytes: number): string => `${Math.round(bytes / (1024 * 1024))} MiB`;

/** A file sent as raw bytes: refused early by its declared length, cut off at `maxBytes`, and checked complete. */
async function readBinaryBody(request: RouteRequest, maxBytes: number): Promise<Uint8Array> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  const tooLarge = () => new AppError('too_large:request', `The file is over ${mebibytes(maxBytes)}.`, { fields: { file: ['Too large'] } });
  if (declared > maxBytes) throw tooLarge();
  let bytes: Uint8Array;
  try {
    bytes = await readBytesCapped(request, maxBytes);
  } catch (error) {
    throw error instanceof AppError && error.kind === 'too_large' ? tooLarge() : error;
  }
  // A proxy that buffers bodies may pass on only the first part of a large upload; say so rather than read half a file.
  if (declared > 0 && bytes.byteLength < declared) {
    throw validationError('request', `Only ${bytes.byteLength} of the ${declared} bytes sent arrived; the upload was cut short.`, { file: ['Incomplete upload'] });
  }
  return bytes;
}

/** Reads a request body as bytes, stopping with 413 as soon as it passes `maxBytes`. */
async function readBytesCapped(request: RouteRequest, maxBytes: number): Promise<Uint8Array> {
  const tooLarge = () => new AppError('too_large:request', `The request body is over ${maxBytes} bytes.`);
  const source = request.body;
  if (!source) return new Uint8Array(0);
  if (source instanceof Uint8Array) {
    if (source.byteLength > maxBytes) throw tooLarge();
    return source;
  }
  const reader = source.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** Problem details for any thrown value, as an answer; unknown errors are logged in full and answered generically. */
export function problemAnswer(error: unknown, instance?: string): Exclude<RouteAnswer, Response> {
  const problem = toProblemDetails(error, instance);
  if (problem.status >= 500) logEvent('error', 'request failed', { error, instance });
  const headers: Record<string, string> = { 'content-type': PROBLEM_CONTENT_TYPE, 'cache-control': 'no-store' };
  if (error instanceof AppError && error.headers) {
    for (const [k, v] of Object.entries(error.headers)) headers[k.toLowerCase()] = v;
  }
  return { status: problem.status, headers, body: JSON.stringify(problem) };
}

const toResponse = (answer: RouteAnswer): Response => (answer instanceof Response ? answer : new Response(answer.body, { status: answer.status, headers: answer.headers }));

/** A problem-details response for any thrown value; unknown errors are logged in full and answered generically. */
export function problemResponse(error: unknown, instance?: string): Response {
  return toResponse(problemAnswer(error, instance));
}

/** Whether the request's If-None-Match names `etag` (or `*`); weak and strong forms compare alike. */
export function matchesIfNoneMatch(request: Request, etag: string): boolean {
  const header = request.headers.get('if-none-match');
  if (!header) return false;
  const bare = (tag: string) => tag.trim().replace(/^W\//, '');
  return header.split(',').some((tag) => tag.trim() === '*' || bare(tag) === bare(etag));
}

/** A JSON answer with a strong ETag, or 304 with no body when the caller already holds that version. */
export function jsonWithEtag(request: Request, body: unknown, etag: string): Response {
  const headers = { etag, 'cache-control': 'private, no-cache' };
  if (matchesIfNoneMatch(request, etag)) return new Response(null, { status: 304, headers });
  return Response.json(body, { headers });
}

type NextRouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

/** The Next route handler for a registered route: the route runner on Next's web Request. */
export function toHandler<P extends AnyObject, Q extends AnyObject, B extends z.ZodType, R extends z.ZodType>(
  spec: RouteSpec<P, Q, B, R>,
) {
  const route = spec as unknown as AnyRouteSpec;
  return async function handle(request: Request, context?: NextRouteContext): Promise<Response> {
    const routeRequest: RouteRequest = { method: request.method, url: new URL(request.url), headers: request.headers, body: request.body, request: () => request };
    return toResponse(await runRoute(route, routeRequest, context?.params ?? Promise.resolve({})));
  };
}

/**
 * Runs a registered route on a request: parse → authenticate → call the service → map the result. The one place
 * a route's rules live; `toHandler` (Next) and the answer fast path (server/ingest.ts) only carry requests to it.
 */
export async function runRoute(route: AnyRouteSpec, request: RouteRequest, rawParamsOf: Promise<Record<string, string | string[] | undefined>>): Promise<RouteAnswer> {
  const url = request.url;
  const instance = url.pathname;
  try {
    const rawParams = (await rawParamsOf) ?? {};
    const params = parseWith(route.params ?? EMPTY_OBJECT, rawParams, 'path');
    // Who is asking is settled before the request is read further: a caller without the right gets 401/403
    // (or 404 for another lab), never a hint about what a valid body looks like.
    const principal = await getRequestPrincipal(request);
    if (route.access.kind !== 'public' && principal.kind === 'anonymous') throw unauthenticated();
    if (principal.kind === 'user') assertSameOrigin(request);
    const actor = await actorFor(route.access, principal, params);

    const query = parseWith(route.query ?? EMPTY_OBJECT, Object.fromEntries(url.searchParams), 'query');
    const hasBody = route.method !== 'GET' && route.method !== 'DELETE';
    const maxBytes = maxBodyBytesOf(route);
    const isBinary = hasBody && route.binaryBody !== undefined && route.binaryBody.contentTypes.includes(contentTypeOf(request));
    const bytes = isBinary ? await readBinaryBody(request, route.binaryBody!.maxBytes) : undefined;
    const text = route.textBody && hasBody && !isBinary ? await readTextBody(request, maxBytes, route.textBody.contentTypes) : '';
    const rawBody = hasBody && !route.textBody && !isBinary ? await readJsonBody(request, maxBytes) : undefined;
    const body = route.body && !isBinary ? parseWith(route.body, rawBody ?? {}, 'body') : undefined;

    const ctx: RouteContext<unknown, unknown, unknown> = {
      params,
      query,
      body,
      principal,
      get request() {
        return request.request();
      },
      labActor: labActorGetter(actor, route.id),
      text,
      bytes,
    };
    const result = await route.handler(ctx as Parameters<AnyRouteSpec['handler']>[0]);
    if (result instanceof Response) return result;
    const status = route.successStatus ?? 200;
    if (status === 204) return { status, headers: {}, body: null };
    const output = route.response.parse(result);
    return { status, headers: { 'content-type': 'application/json', 'cache-control': 'no-store' }, body: JSON.stringify(output) };
  } catch (error) {
    return problemAnswer(error, instance);
  }
}

const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * A change made with the session cookie must come from this site (CSRF): browsers send Origin on every cross-site
 * POST, PUT, PATCH and DELETE, and one naming another site (or `null`, a sandboxed frame) is refused. A request
 * without Origin is no browser's cross-site request; a bearer token is no ambient credential, so it is not asked.
 */
function assertSameOrigin(request: RouteRequest): void {
  if (!UNSAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get('origin');
  if (origin === null) return;
  const host = request.headers.get('x-forwarded-host') ?? request.headers.get('host') ?? request.url.host;
  let originHost: string | undefined;
  try {
    originHost = new URL(origin).host;
  } catch {
    originHost = undefined;
  }
  if (originHost !== undefined && (originHost === host || origin === new URL(getEnv().APP_URL).origin)) return;
  throw forbidden('origin', 'This request came from another site, so it was refused. Make the change in Epicycle itself.');
}

async function actorFor(access: Access, principal: Principal, params: Record<string, unknown>): Promise<LabActor | undefined> {
  if (access.kind !== 'lab') return undefined;
  const slug = params.lab;
  if (typeof slug !== 'string') throw new Error('a lab route needs a {lab} path parameter');
  const actor = await resolveLabActor(getDb(), principal, slug);
  authorize(actor, access.action);
  return actor;
}

function labActorGetter(actor: LabActor | undefined, routeId: string): () => LabActor {
  return () => {
    if (!actor) throw new Error(`route ${routeId} is not a lab route`);
    return actor;
  };
}

/** A registered server action: validates its input and returns a typed success/failure union. */
export interface ActionSpec<I extends z.ZodType, O> {
  id: string;
  access: Access;
  input: I;
  handler: (input: z.infer<I>, principal: Principal) => Promise<O>;
}

const actionRegistry = new Map<string, ActionSpec<z.ZodType, unknown>>();

export function registeredActions(): ActionSpec<z.ZodType, unknown>[] {
  return [...actionRegistry.values()];
}

/**
 * Declares a server action. The returned function authorises itself whatever the page did, and never throws
 * to the client: failures come back as `{ ok: false, code, message, fields }`.
 */
export function defineAction<I extends z.ZodType, O>(
  spec: ActionSpec<I, O>,
  resolvePrincipal: () => Promise<Principal>,
): (input: z.input<I>) => Promise<ActionResult<O>> {
  actionRegistry.set(spec.id, spec as unknown as ActionSpec<z.ZodType, unknown>);
  return async (input) => {
    try {
      const parsed = spec.input.safeParse(input);
      if (!parsed.success) {
        throw validationError('action', 'Please correct the highlighted fields.', fieldErrorsOf(parsed.error));
      }
      const nul = findNulCharacter(parsed.data);
      if (nul !== undefined) throw validationError('action', 'Please correct the highlighted fields.', { [nul]: ['Contains a NUL character'] });
      const principal = await resolvePrincipal();
      if (spec.access.kind !== 'public' && principal.kind === 'anonymous') throw unauthenticated();
      return { ok: true, data: await spec.handler(parsed.data, principal) };
    } catch (error) {
      const problem = toProblemDetails(error);
      if (problem.status >= 500) logEvent('error', 'action failed', { error, action: spec.id });
      return {
        ok: false,
        code: problem.code,
        message: problem.detail,
        ...(problem.errors ? { fields: problem.errors } : {}),
      };
    }
  };
}
