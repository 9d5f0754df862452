// The participant load driver, shared by `npm run load` and the integration test: simulated participants start
// sessions over HTTP and answer trials at a fixed pace through the page's own outbox (lib/take/response-queue), so
// a failed request is resent with the same client trial id exactly as a browser would resend it.
import { randomUUID } from 'node:crypto';
import { Agent, request as httpRequest } from 'node:http';
import { ResponseQueue, type QueuedResponse } from '@/lib/take/response-queue';

export interface LoadOptions {
  /** The server's origin, e.g. http://127.0.0.1:3300. */
  baseUrl: string;
  /** The study's invite token. */
  token: string;
  sessions: number;
  trialsPerSession: number;
  /** Each participant answers one trial every this many milliseconds (open loop: late answers do not slow it). */
  intervalMs: number;
  /** Longest wait for the outboxes to empty after the last answer. */
  drainTimeoutMs?: number;
  /** The web server's CPU milliseconds so far, when known: read as the answers start and after they drain. */
  serverCpuMs?: () => number | undefined;
  /** Called once a second with the progress so far (for the fault scripts). */
  onTick?: (progress: { added: number; confirmed: number; pending: number; failedRequests: number }) => void;
}

export interface LoadReport {
  sessions: number;
  /** Answers the participants gave (each queued once). */
  trialsSent: number;
  /** Answers the server confirmed (a 2xx answer to the queue). */
  trialsConfirmed: number;
  /** Answers still in an outbox when the drain timed out (0 when everything arrived). */
  trialsPending: number;
  /** Answers the server refused for good (4xx): should be 0. */
  trialsRefused: number;
  /** Requests that failed (no connection, or 5xx) and were retried. */
  failedRequests: number;
  /** Requests whose answer said the trial was already stored: a resend of an answer that had arrived. */
  duplicatesAbsorbed: number;
  requests: number;
  durationSeconds: number;
  targetRatePerSecond: number;
  throughputPerSecond: number;
  latencyMs: { p50: number; p99: number; max: number; mean: number };
  /** CPU time the load generator itself spent per request (it shares the machine with the server). */
  clientCpuMsPerRequest: number;
  /** CPU time the web server spent per answer request, from the first answer on (sessions started before), when known. */
  serverCpuMsPerRequest?: number;
  sessionCodes: string[];
}

interface PlannedTrial {
  index: number;
  task: 'categorisation' | 'similarity';
  correctKey?: string | null;
}

interface StartedSession {
  sessionCode: string;
  trials: PlannedTrial[];
  keys?: string[];
}

const SCREEN = { pxPerMm: 3.78, viewingDistanceCm: 57, distanceMethod: 'typed', refreshHz: 60, isFullScreen: true };
/** Sessions started at once: starts take the study's row lock, so a burst of 100 only queues behind it. */
const START_CONCURRENCY = 10;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * What the outbox's `send` gets back: the part of a fetch Response it reads (ok, status, json, text). The load runs
 * on the machine it measures, so its requests go out over node:http with keep-alive (one connection per participant,
 * as each browser has its own) rather than through undici's fetch, which cost the generator about 2 ms of CPU per
 * request; the outbox code that queues, sends, retries and confirms is the page's own.
 */
function httpSender(agent: Agent): typeof fetch {
  return (input, init) =>
    new Promise((resolve, reject) => {
      const url = new URL(String(input));
      const body = typeof init?.body === 'string' ? init.body : '';
      const req = httpRequest(
        {
          agent,
          host: url.hostname,
          port: url.port,
          path: url.pathname + url.search,
          method: init?.method ?? 'GET',
          headers: { ...(init?.headers as Record<string, string>), 'content-length': String(Buffer.byteLength(body)) },
        },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('error', reject);
          res.on('end', () => {
            const text = Buffer.concat(chunks).toString('utf8');
            const status = res.statusCode ?? 0;
            resolve({ ok: status >= 200 && status < 300, status, text: async () => text, json: async () => JSON.parse(text) as unknown } as unknown as Response);
          });
        },
      );
      req.on('error', reject);
      req.end(body);
    });
}

/** The page keeps its outbox in localStorage; outside a browser the load gives it an in-memory one. */
function ensureStorage(): void {
  const g = globalThis as { localStorage?: Pick<Storage, 'getItem' | 'setItem' | 'removeItem'> };
  if (g.localStorage) return;
  const items = new Map<string, string>();
  g.localStorage = { getItem: (k) => items.get(k) ?? null, setItem: (k, v) => void items.set(k, String(v)), removeItem: (k) => void items.delete(k) };
}

/** The q-quantile (0..1) of sorted values, nearest rank. */
export function quantile(sorted: readonly number[], q: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[rank]!;
}

async function startSessions(baseUrl: string, token: string, n: number): Promise<StartedSession[]> {
  const out: StartedSession[] = [];
  let next = 0;
  const one = async () => {
    while (next < n) {
      next += 1;
      for (let attempt = 0; ; attempt += 1) {
        try {
          const res = await fetch(`${baseUrl}/api/v1/join/${token}/sessions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ screen: SCREEN }) });
          if (res.status !== 201) throw new Error(`starting a session answered ${res.status}: ${await res.text()}`);
          out.push((await res.json()) as StartedSession);
          break;
        } catch (error) {
          if (attempt >= 5) throw error;
          await sleep(500 * 2 ** attempt);
        }
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(START_CONCURRENCY, n) }, one));
  return out;
}

function answerOf(trial: PlannedTrial, session: StartedSession, i: number): QueuedResponse {
  const isRating = trial.task === 'similarity';
  return {
    clientTrialId: randomUUID(),
    trialIndex: trial.index,
    responseKey: isRating ? null : (trial.correctKey ?? session.keys?.[i % 2] ?? 'f'),
    rating: isRating ? 1 + (i % 5) : null,
    rtMs: 350 + (i % 400),
    achievedMs: 200.2,
    onsetMs: 1000 + i * 10,
    offsetMs: 1200.2 + i * 10,
    wasTabHidden: false,
    leftFullScreen: false,
  };
}

/**
 * Runs the load: starts `sessions` sessions, then every participant answers one trial each `intervalMs` until it
 * has answered `trialsPerSession`, and waits for every outbox to empty. Latency is measured per request, from
 * sending to the end of the answer's body.
 */
export async function runParticipantLoad(options: LoadOptions): Promise<LoadReport> {
  const { baseUrl, token, sessions: n, trialsPerSession, intervalMs } = options;
  const started = await startSessions(baseUrl, token, n);
  for (const s of started) {
    if (s.trials.length < trialsPerSession) throw new Error(`a session plans ${s.trials.length} trials, fewer than the ${trialsPerSession} asked for`);
  }

  ensureStorage();
  const agent = new Agent({ keepAlive: true, maxSockets: Infinity });
  const send = httpSender(agent);
  const latencies: number[] = [];
  let failedRequests = 0;
  let duplicatesAbsorbed = 0;
  let refused = 0;
  let confirmed = 0;
  let added = 0;
  let requests = 0;
  const timedFetch: typeof fetch = async (input, init) => {
    const t0 = performance.now();
    requests += 1;
    try {
      const res = await send(input, init);
      const body = await res.text();
      latencies.push(performance.now() - t0);
      if (res.status >= 500 || res.status === 429 || res.status === 408) failedRequests += 1;
      else if (!res.ok) refused += 1;
      else if (res.ok && (JSON.parse(body) as { isNew?: boolean }).isNew === false) duplicatesAbsorbed += 1;
      return res;
    } catch (error) {
      failedRequests += 1;
      throw error;
    }
  };
  const queues = started.map(
    (s) =>
      new ResponseQueue(
        `${baseUrl}/api/v1/join/${token}/sessions/${s.sessionCode}/responses`,
        `load:${s.sessionCode}`,
        (state) => {
          if (state.count) confirmed += 1;
        },
        timedFetch,
      ),
  );

  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const serverCpu0 = options.serverCpuMs?.();
  const ticker = options.onTick
    ? setInterval(() => options.onTick!({ added, confirmed, pending: queues.reduce((sum, q) => sum + q.pending, 0), failedRequests }), 1000)
    : null;
  try {
    // Each participant starts at a random phase of the interval, so arrivals spread evenly over time.
    await Promise.all(
      started.map(async (s, k) => {
        const queue = queues[k]!;
        const phase = Math.random() * intervalMs;
        for (let i = 0; i < trialsPerSession; i += 1) {
          const due = t0 + phase + i * intervalMs;
          const wait = due - performance.now();
          if (wait > 0) await sleep(wait);
          queue.add(answerOf(s.trials[i]!, s, i));
          added += 1;
        }
      }),
    );
    const drainUntil = performance.now() + (options.drainTimeoutMs ?? 120_000);
    while (queues.some((q) => q.pending > 0) && performance.now() < drainUntil) await sleep(50);
  } finally {
    if (ticker) clearInterval(ticker);
    for (const q of queues) q.dispose();
    agent.destroy();
  }
  const durationSeconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const serverCpu1 = options.serverCpuMs?.();
  const sorted = [...latencies].sort((a, b) => a - b);
  const round = (x: number) => Math.round(x * 10) / 10;
  return {
    sessions: started.length,
    trialsSent: added,
    trialsConfirmed: confirmed,
    trialsPending: queues.reduce((sum, q) => sum + q.pending, 0),
    trialsRefused: refused,
    failedRequests,
    duplicatesAbsorbed,
    requests,
    durationSeconds: round(durationSeconds),
    targetRatePerSecond: round((n * 1000) / intervalMs),
    throughputPerSecond: round(confirmed / durationSeconds),
    latencyMs: { p50: round(quantile(sorted, 0.5)), p99: round(quantile(sorted, 0.99)), max: round(sorted.at(-1) ?? Number.NaN), mean: round(sorted.reduce((a, b) => a + b, 0) / Math.max(1, sorted.length)) },
    clientCpuMsPerRequest: Math.round(((cpu.user + cpu.system) / 1000 / Math.max(1, requests)) * 100) / 100,
    ...(serverCpu0 !== undefined && serverCpu1 !== undefined ? { serverCpuMsPerRequest: Math.round(((serverCpu1 - serverCpu0) / Math.max(1, requests)) * 100) / 100 } : {}),
    sessionCodes: started.map((s) => s.sessionCode),
  };
}
