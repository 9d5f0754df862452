import type { IncomingMessage, ServerResponse } from 'node:http';
import { API_HEADERS, siteHeaders } from '@/lib/http-headers.mjs';
import { submitResponseRoute } from '@/lib/server/api/participant-sessions';
import { maxBodyBytesOf, runRoute, type AnyRouteSpec, type RouteRequest } from '@/lib/server/http';

/**
 * The answer fast path: the few API routes that a running study calls hundreds of times a second, served by the
 * web server itself instead of through Next's router (whose per-request cost capped a 2-core machine near 200
 * answers a second). It is only a transport: each request goes to the route's own handler (`toHandler`: the same
 * validation, services, problem details, size cap and Origin rule as the Next route file), and the answer gets the
 * headers next.config.mjs gives every /api/v1 answer (lib/http-headers.mjs). Anything it does not match exactly,
 * including a path it cannot decode, is left to Next.
 */
export const FAST_ROUTES: readonly AnyRouteSpec[] = [submitResponseRoute as unknown as AnyRouteSpec];

export type FastPath = (req: IncomingMessage, res: ServerResponse) => boolean;

interface CompiledRoute {
  method: string;
  pattern: RegExp;
  names: string[];
  maxBytes: number;
  spec: AnyRouteSpec;
}

/** Returns a function that serves a matching request (and says true), or leaves it alone (false). */
export function createFastPath(options: { isProduction: boolean; routes?: readonly AnyRouteSpec[] }): FastPath {
  const routes: CompiledRoute[] = (options.routes ?? FAST_ROUTES).map((route) => {
    const names: string[] = [];
    const source = route.path.replace(/\{(\w+)\}/g, (_m, name: string) => {
      names.push(name);
      return '([^/]+)';
    });
    return { method: route.method, pattern: new RegExp(`^${source}$`), names, maxBytes: maxBodyBytesOf(route), spec: route };
  });
  const fixedHeaders = [...siteHeaders(options.isProduction), ...API_HEADERS].map(({ key, value }) => [key.toLowerCase(), value] as const);

  return (req, res) => {
    const url = req.url ?? '/';
    const q = url.indexOf('?');
    const path = q === -1 ? url : url.slice(0, q);
    for (const route of routes) {
      if (req.method !== route.method) continue;
      const m = route.pattern.exec(path);
      if (!m) continue;
      let params: Record<string, string>;
      try {
        params = Object.fromEntries(route.names.map((n, i) => [n, decodeURIComponent(m[i + 1]!)]));
      } catch {
        return false;
      }
      void serve(route, params, req, res, fixedHeaders);
      return true;
    }
    return false;
  };
}

/** The headers of a Node request as the route runner reads them (Node already lower-cases and joins them). */
const headersOf = (req: IncomingMessage) => ({
  get(name: string): string | null {
    const v = req.headers[name.toLowerCase()];
    return v === undefined ? null : Array.isArray(v) ? v.join(', ') : v;
  },
});

async function serve(route: CompiledRoute, params: Record<string, string>, req: IncomingMessage, res: ServerResponse, fixedHeaders: readonly (readonly [string, string])[]) {
  try {
    const headers = headersOf(req);
    const url = new URL(`http://${req.headers.host ?? 'localhost'}${req.url}`);
    // The body is read here up to one byte past the route's cap (a body declared larger is not read at all), and the
    // route runner then measures it against the cap, so a request too large gets the route's own 413.
    const body = Number(req.headers['content-length'] ?? '0') > route.maxBytes ? null : await readUpTo(req, route.maxBytes + 1);
    const request: RouteRequest = {
      method: req.method ?? 'GET',
      url,
      headers,
      body,
      request: () => {
        const h = new Headers();
        for (let i = 0; i < req.rawHeaders.length; i += 2) h.append(req.rawHeaders[i]!, req.rawHeaders[i + 1]!);
        return new Request(url, { method: req.method, headers: h, body: body ? new Uint8Array(body) : null });
      },
    };
    const answer = await runRoute(route.spec, request, Promise.resolve(params));
    for (const [key, value] of fixedHeaders) res.setHeader(key, value);
    let bytes: Buffer | string | null;
    if (answer instanceof Response) {
      answer.headers.forEach((value, key) => res.setHeader(key, value));
      res.statusCode = answer.status;
      bytes = Buffer.from(await answer.arrayBuffer());
    } else {
      for (const key in answer.headers) res.setHeader(key, answer.headers[key]!);
      res.statusCode = answer.status;
      bytes = answer.body;
    }
    // A body left unread (refused as too large) would be read as the next request: close the connection instead.
    if (!req.complete) res.setHeader('connection', 'close');
    res.end(bytes ?? undefined);
  } catch (error) {
    // Only a broken connection gets here (the route runner answers every error of its own as problem details).
    if (!res.headersSent) res.statusCode = 500;
    res.destroy(error instanceof Error ? error : undefined);
  }
}

/** The request body, or its first `limit` bytes when it is longer (the rest is left unread). */
function readUpTo(req: IncomingMessage, limit: number): Promise<Buffer | null> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let total = 0;
    const done = () => {
      req.off('data', onData);
      req.off('end', done);
      req.off('error', reject);
      resolve(total === 0 ? null : Buffer.concat(chunks, total));
    };
    const onData = (chunk: Buffer) => {
      chunks.push(chunk);
      total += chunk.length;
      if (total >= limit) {
        req.pause();
        done();
      }
    };
    req.on('data', onData);
    req.on('end', done);
    req.on('error', reject);
  });
}
