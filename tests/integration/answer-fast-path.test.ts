import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { randomUUID } from 'node:crypto';
import { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { POST as nextRoutePost } from '@/app/api/v1/join/[token]/sessions/[code]/responses/route';
import { API_HEADERS, siteHeaders } from '@/lib/http-headers.mjs';
import { createFastPath } from '@/server/ingest';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { makeEdition } from '../support/editions';
import { categorisation, SCREEN } from '../support/study-designs';

// The answer fast path (server/ingest.ts) beside the Next route file it stands in for, both over real sockets on
// the same PostgreSQL: for every kind of request a participant's page (or anyone else) can send, the two give the
// same status and the same body. The Next side streams the request body into the route file's POST, as Next does.
const CATEGORISATION = categorisation();

interface Trial {
  index: number;
  correctKey?: string | null;
}
interface Session {
  sessionCode: string;
  trials: Trial[];
}
interface Answer {
  status: number;
  body: unknown;
  headers: Headers;
}

function listen(handler: (req: IncomingMessage, res: ServerResponse) => void): Promise<Server> {
  const server = createServer(handler);
  return new Promise((resolve) => server.listen(0, '127.0.0.1', () => resolve(server)));
}
const urlOf = (server: Server) => `http://127.0.0.1:${(server.address() as { port: number }).port}`;

/** The Next route file's POST behind a plain adapter: the body streams in, the params come as Next gives them. */
async function viaRouteFile(req: IncomingMessage, res: ServerResponse): Promise<void> {
  const m = /^\/api\/v1\/join\/([^/]+)\/sessions\/([^/]+)\/responses$/.exec(req.url ?? '');
  if (!m || req.method !== 'POST') {
    res.writeHead(404).end();
    return;
  }
  const headers = new Headers();
  for (let i = 0; i < req.rawHeaders.length; i += 2) headers.append(req.rawHeaders[i]!, req.rawHeaders[i + 1]!);
  const body = Readable.toWeb(req) as ReadableStream<Uint8Array>;
  const request = new Request(`http://${req.headers.host}${req.url}`, { method: 'POST', headers, body, duplex: 'half' } as RequestInit);
  const response = await nextRoutePost(request, { params: Promise.resolve({ token: decodeURIComponent(m[1]!), code: decodeURIComponent(m[2]!) }) });
  res.writeHead(response.status, Object.fromEntries(response.headers));
  res.end(Buffer.from(await response.arrayBuffer()));
  if (!req.complete) req.destroy();
}

describe('the answer fast path answers as the Next route does', () => {
  let lab: TestLab;
  let token: string;
  let fast: Server;
  let routeFile: Server;
  const fastPath = createFastPath({ isProduction: true });

  const start = async (): Promise<Session> => (await callRoute(api.startSessionRoute, { params: { token }, body: { screen: SCREEN } })).body as Session;
  const answerOf = (t: Trial, clientTrialId = randomUUID()) => ({
    clientTrialId,
    trialIndex: t.index,
    responseKey: t.correctKey ?? 'f',
    rating: null,
    rtMs: 400,
    achievedMs: 200.4,
    onsetMs: 1000,
    offsetMs: 1200.4,
    wasTabHidden: false,
    leftFullScreen: false,
  });
  async function send(base: string, path: string, init: RequestInit): Promise<Answer> {
    const res = await fetch(`${base}${path}`, init);
    const text = await res.text();
    return { status: res.status, body: text && (res.headers.get('content-type') ?? '').includes('json') ? JSON.parse(text) : text, headers: res.headers };
  }
  const post = (base: string, path: string, body: string | ReadableStream<Uint8Array>, headers: Record<string, string> = {}) =>
    send(base, path, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body, ...(typeof body === 'string' ? {} : { duplex: 'half' }) } as RequestInit);
  const pathOf = (code: string, t = token) => `/api/v1/join/${t}/sessions/${code}/responses`;
  /** The same request to both; the bodies compared with each session's own code replaced. */
  const expectSame = (a: Answer, b: Answer, codes: [string, string] = ['', '']) => {
    const norm = (x: Answer, code: string) => ({ status: x.status, body: code ? JSON.parse(JSON.stringify(x.body).replaceAll(code, '<code>')) : x.body, type: x.headers.get('content-type'), cache: x.headers.get('cache-control') });
    expect(norm(a, codes[0])).toEqual(norm(b, codes[1]));
  };

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const { editionId } = await makeEdition(lab, 'Fast path space', true);
    const made = await callRoute(api.createStudyRoute, {
      params: { lab: lab.slug },
      body: { name: 'Fast path study', editionId, consentText: 'I agree.', finishCodePrefix: 'FP-', targetParticipants: 10, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } },
      cookie: lab.members.experimenter.cookie,
    });
    const studyId = (made.body as { id: string }).id;
    const opened = await callRoute(api.openStudyRoute, { params: { lab: lab.slug, studyId }, body: { confirmEthics: true }, cookie: lab.members.experimenter.cookie });
    token = new URL((opened.body as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;
    fast = await listen((req, res) => {
      if (!fastPath(req, res)) res.writeHead(404).end();
    });
    routeFile = await listen((req, res) => void viaRouteFile(req, res));
  }, 60_000);
  afterAll(async () => {
    fast.closeAllConnections();
    routeFile.closeAllConnections();
    await Promise.all([fast, routeFile].map((s) => new Promise((r) => s.close(r))));
    await getDb().destroy();
  });

  it('a valid answer, then its resend (stored once), then a finished session', async () => {
    const [a, b] = [await start(), await start()];
    const codes: [string, string] = [a.sessionCode, b.sessionCode];
    for (const t of a.trials) {
      const id = randomUUID();
      const fresh = [await post(urlOf(fast), pathOf(a.sessionCode), JSON.stringify(answerOf(t, id))), await post(urlOf(routeFile), pathOf(b.sessionCode), JSON.stringify(answerOf(t, id)))] as const;
      expect(fresh[0].status).toBe(200);
      expect(fresh[0].body).toMatchObject({ stored: t.index + 1, isNew: true });
      expectSame(...fresh, codes);
      const resent = [await post(urlOf(fast), pathOf(a.sessionCode), JSON.stringify(answerOf(t, id))), await post(urlOf(routeFile), pathOf(b.sessionCode), JSON.stringify(answerOf(t, id)))] as const;
      expect(resent[0].body).toMatchObject({ stored: t.index + 1, isNew: false });
      expectSame(...resent, codes);
    }
    for (const s of [a, b]) expect((await callRoute(api.finishSessionRoute, { params: { token, code: s.sessionCode } })).status).toBe(200);
    const late = [await post(urlOf(fast), pathOf(a.sessionCode), JSON.stringify(answerOf(a.trials[0]!))), await post(urlOf(routeFile), pathOf(b.sessionCode), JSON.stringify(answerOf(a.trials[0]!)))] as const;
    expect(late[0].status).toBe(409);
    expect(late[0].body).toMatchObject({ code: 'conflict:session-complete' });
    expectSame(...late, codes);
  });

  it('malformed JSON, a body of the wrong type, an invalid answer, a wrong code and a wrong token', async () => {
    const s = await start();
    const valid = JSON.stringify(answerOf(s.trials[0]!));
    const cases: { path: string; body: string; headers?: Record<string, string>; status: number }[] = [
      { path: pathOf(s.sessionCode), body: '{"clientTrialId": ', status: 400 },
      { path: pathOf(s.sessionCode), body: valid, headers: { 'content-type': 'text/plain' }, status: 400 },
      { path: pathOf(s.sessionCode), body: JSON.stringify({ ...answerOf(s.trials[0]!), trialIndex: 999 }), status: 400 },
      { path: pathOf(s.sessionCode), body: JSON.stringify({ ...answerOf(s.trials[0]!), rtMs: 'soon' }), status: 400 },
      { path: pathOf(s.sessionCode), body: '', status: 400 },
      { path: pathOf('ABCDE-FGHJK-MNPQR-STVWX'), body: valid, status: 404 },
      { path: pathOf('not a code'.replaceAll(' ', '%20')), body: valid, status: 400 },
      { path: pathOf(s.sessionCode, 'not-a-token!'), body: valid, status: 400 },
    ];
    for (const c of cases) {
      const pair = [await post(urlOf(fast), c.path, c.body, c.headers), await post(urlOf(routeFile), c.path, c.body, c.headers)] as const;
      if (c.status) expect(pair[0].status, c.path).toBe(c.status);
      expect(pair[0].headers.get('content-type') ?? '', c.path).toMatch(/json/);
      expectSame(...pair);
    }
    // Another well-formed token, not the session's link: both answer as for an unknown code, and store nothing.
    const [a, b] = [await start(), await start()];
    const other = 'x'.repeat(token.length);
    const pair = [await post(urlOf(fast), pathOf(a.sessionCode, other), JSON.stringify(answerOf(a.trials[0]!))), await post(urlOf(routeFile), pathOf(b.sessionCode, other), JSON.stringify(answerOf(b.trials[0]!)))] as const;
    expect(pair[0].status).toBe(404);
    expectSame(...pair, [a.sessionCode, b.sessionCode]);
  });

  it('an oversized body, declared or streamed, is refused with 413 and nothing is stored', async () => {
    const s = await start();
    const big = JSON.stringify({ ...answerOf(s.trials[0]!), padding: 'x'.repeat(8 * 1024) });
    const declared = [await post(urlOf(fast), pathOf(s.sessionCode), big), await post(urlOf(routeFile), pathOf(s.sessionCode), big)] as const;
    expect(declared[0].status).toBe(413);
    expectSame(...declared);
    const stream = () =>
      new ReadableStream<Uint8Array>({
        start(controller) {
          for (let i = 0; i < 8; i += 1) controller.enqueue(new TextEncoder().encode(i === 0 ? big.slice(0, 1024) : 'x'.repeat(1024)));
          controller.close();
        },
      });
    const streamed = [await post(urlOf(fast), pathOf(s.sessionCode), stream()), await post(urlOf(routeFile), pathOf(s.sessionCode), stream())] as const;
    expect(streamed[0].status).toBe(413);
    expectSame(...streamed);
    // The fast path's connection is still usable afterwards (a fresh request is answered normally).
    expect((await post(urlOf(fast), pathOf(s.sessionCode), JSON.stringify(answerOf(s.trials[0]!)))).status).toBe(200);
  });

  it('a signed-in caller from another site is refused (the Origin rule); from this site it is served', async () => {
    const [a, b] = [await start(), await start()];
    const cookie = lab.members.experimenter.cookie;
    const cross = { cookie, origin: 'https://elsewhere.example' };
    const refused = [await post(urlOf(fast), pathOf(a.sessionCode), JSON.stringify(answerOf(a.trials[0]!)), cross), await post(urlOf(routeFile), pathOf(b.sessionCode), JSON.stringify(answerOf(b.trials[0]!)), cross)] as const;
    expect(refused[0].status).toBe(403);
    expectSame(...refused, [a.sessionCode, b.sessionCode]);
    const same = [
      await post(urlOf(fast), pathOf(a.sessionCode), JSON.stringify(answerOf(a.trials[0]!)), { cookie, origin: urlOf(fast) }),
      await post(urlOf(routeFile), pathOf(b.sessionCode), JSON.stringify(answerOf(b.trials[0]!)), { cookie, origin: urlOf(routeFile) }),
    ] as const;
    expect(same[0].status).toBe(200);
    expectSame(...same, [a.sessionCode, b.sessionCode]);
  });

  it('carries the headers next.config.mjs gives every /api/v1 answer, and leaves other requests alone', async () => {
    const s = await start();
    const ok = await post(urlOf(fast), pathOf(s.sessionCode), JSON.stringify(answerOf(s.trials[0]!)));
    const bad = await post(urlOf(fast), pathOf(s.sessionCode), '{');
    for (const answer of [ok, bad]) {
      for (const { key, value } of [...siteHeaders(true), ...API_HEADERS]) expect(answer.headers.get(key), key).toBe(value);
      expect(answer.headers.get('cache-control')).toBe('no-store');
    }
    // Not the fast path's: another method, a trailing slash, another route, an undecodable segment.
    for (const [method, path] of [['GET', pathOf(s.sessionCode)], ['POST', `${pathOf(s.sessionCode)}/`], ['POST', `/api/v1/join/${token}/sessions`], ['POST', pathOf('%E0%A4%A')]] as const) {
      expect((await send(urlOf(fast), path, { method, ...(method === 'POST' ? { body: '{}' } : {}) })).status, `${method} ${path}`).toBe(404);
    }
  });
});
