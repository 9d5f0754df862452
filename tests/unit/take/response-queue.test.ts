import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ResponseQueue, type QueuedResponse } from '@/lib/take/response-queue';

const KEY = 'epicycle:queue:TEST';
const answer = (i: number): QueuedResponse => ({ clientTrialId: `id-${i}`, trialIndex: i, responseKey: 'f', rating: null, rtMs: 400, achievedMs: 50, onsetMs: 1, offsetMs: 51, wasTabHidden: false, leftFullScreen: false });

/** A server that stores each client id once, and can be switched off (fetch rejects, as with no network). */
function fakeServer() {
  const stored = new Map<string, QueuedResponse>();
  const state = { isUp: true, refuse: false };
  const fetch = vi.fn(async (_url: string, init: { body: string }) => {
    if (!state.isUp) throw new TypeError('Failed to fetch');
    if (state.refuse) return new Response(JSON.stringify({ detail: 'This session is complete' }), { status: 409 });
    const item = JSON.parse(init.body) as QueuedResponse;
    if (!stored.has(item.clientTrialId)) stored.set(item.clientTrialId, item);
    return Response.json({ stored: stored.size, planned: 20 });
  });
  return { stored, state, fetch };
}

describe('the participant outbox', () => {
  let storage: Map<string, string>;
  beforeEach(() => {
    vi.useFakeTimers();
    storage = new Map();
    vi.stubGlobal('localStorage', { getItem: (k: string) => storage.get(k) ?? null, setItem: (k: string, v: string) => storage.set(k, v), removeItem: (k: string) => storage.delete(k) });
  });
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('keeps answers through an outage, in order, and sends each once when the server is back', async () => {
    const server = fakeServer();
    vi.stubGlobal('fetch', server.fetch);
    const counts: number[] = [];
    const q = new ResponseQueue('/r', KEY, (s) => s.count && counts.push(s.count.stored));
    q.add(answer(0));
    await vi.runOnlyPendingTimersAsync();
    server.state.isUp = false;
    for (let i = 1; i <= 10; i++) q.add(answer(i));
    await vi.advanceTimersByTimeAsync(5_000);
    expect(q.pending).toBe(10);
    // The outbox survives a reload: a new queue on the same key sees the same answers.
    expect(new ResponseQueue('/r', KEY, () => {}).pendingIndices()).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    server.state.isUp = true;
    await vi.advanceTimersByTimeAsync(31_000);
    expect(q.pending).toBe(0);
    expect([...server.stored.keys()]).toEqual(Array.from({ length: 11 }, (_, i) => `id-${i}`));
    expect(counts.at(-1)).toBe(11);
    expect(JSON.parse(storage.get(KEY)!)).toEqual([]);
  });

  it('backs off between retries: attempts double their wait', async () => {
    const server = fakeServer();
    server.state.isUp = false;
    vi.stubGlobal('fetch', server.fetch);
    const q = new ResponseQueue('/r', KEY, () => {});
    q.add(answer(0));
    await vi.advanceTimersByTimeAsync(0);
    expect(server.fetch).toHaveBeenCalledTimes(1);
    // Retries at +0.5 s, +1 s, +2 s, +4 s: 5 calls by 7.5 s, not more.
    await vi.advanceTimersByTimeAsync(7_400);
    expect(server.fetch).toHaveBeenCalledTimes(4);
    await vi.advanceTimersByTimeAsync(200);
    expect(server.fetch).toHaveBeenCalledTimes(5);
    q.dispose();
  });

  it('drops an answer the server refuses for good (4xx) and reports why, instead of retrying forever', async () => {
    const server = fakeServer();
    server.state.refuse = true;
    vi.stubGlobal('fetch', server.fetch);
    const errors: (string | null)[] = [];
    const q = new ResponseQueue('/r', KEY, (s) => errors.push(s.error));
    q.add(answer(0));
    await vi.advanceTimersByTimeAsync(60_000);
    expect(server.fetch).toHaveBeenCalledTimes(1);
    expect(q.pending).toBe(0);
    expect(errors).toContain('This session is complete');
  });
});
