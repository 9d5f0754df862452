/**
 * The participant page's outbox: every answer is kept in localStorage until the server has confirmed it, sent at
 * once, and retried with exponential backoff while the network or the server is away. Browser-only; no React.
 */

/** One answered trial as the API takes it. */
export interface QueuedResponse {
  clientTrialId: string;
  trialIndex: number;
  responseKey: string | null;
  rating: number | null;
  rtMs: number | null;
  achievedMs: number;
  onsetMs: number;
  offsetMs: number;
  wasTabHidden: boolean;
  leftFullScreen: boolean;
}

export interface ServerCount {
  stored: number;
  planned: number;
}

/** First retry after 500 ms, doubling up to 30 s. */
const FIRST_RETRY_MS = 500;
const MAX_RETRY_MS = 30_000;

export class ResponseQueue {
  private items: QueuedResponse[];
  private isSending = false;
  private attempt = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor(
    private readonly url: string,
    private readonly storageKey: string,
    private readonly onChange: (state: { pending: number; count: ServerCount | null; error: string | null }) => void,
    /** The page uses the browser's fetch; the load test passes one that times each request. */
    private readonly send: typeof fetch = (input, init) => fetch(input, init),
  ) {
    this.items = ResponseQueue.load(storageKey);
  }

  static load(storageKey: string): QueuedResponse[] {
    try {
      const raw = localStorage.getItem(storageKey);
      return raw ? (JSON.parse(raw) as QueuedResponse[]) : [];
    } catch {
      return [];
    }
  }

  /** Trial indices answered here and not yet confirmed. */
  pendingIndices(): number[] {
    return this.items.map((i) => i.trialIndex);
  }

  get pending(): number {
    return this.items.length;
  }

  add(item: QueuedResponse): void {
    this.items.push(item);
    this.save();
    this.onChange({ pending: this.items.length, count: null, error: null });
    void this.flush();
  }

  /** Sends what is queued, oldest first; stops at the first failure and schedules a retry. */
  async flush(): Promise<void> {
    if (this.isSending) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.isSending = true;
    try {
      while (this.items.length > 0) {
        const item = this.items[0]!;
        let res: Response;
        try {
          res = await this.send(this.url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(item) });
        } catch {
          this.retryLater('No connection: your answers are kept on this computer and will be sent when it is back.');
          return;
        }
        if (res.ok) {
          const count = (await res.json()) as ServerCount;
          this.items.shift();
          this.save();
          this.attempt = 0;
          this.onChange({ pending: this.items.length, count, error: null });
        } else if (res.status >= 500 || res.status === 429 || res.status === 408) {
          this.retryLater('The server did not answer; retrying.');
          return;
        } else {
          // Refused for good (e.g. the session is complete or was withdrawn): keeping it would retry forever.
          const problem = (await res.json().catch(() => ({}))) as { detail?: string };
          this.items.shift();
          this.save();
          this.onChange({ pending: this.items.length, count: null, error: problem.detail ?? `An answer was refused (${res.status}).` });
        }
      }
    } finally {
      this.isSending = false;
    }
  }

  private retryLater(message: string): void {
    const delay = Math.min(MAX_RETRY_MS, FIRST_RETRY_MS * 2 ** this.attempt);
    this.attempt += 1;
    this.onChange({ pending: this.items.length, count: null, error: message });
    this.timer = setTimeout(() => void this.flush(), delay);
  }

  private save(): void {
    try {
      localStorage.setItem(this.storageKey, JSON.stringify(this.items));
    } catch {
      // Storage full or blocked: the answers still go out now; only a reload before they arrive would lose them.
    }
  }

  dispose(): void {
    if (this.timer) clearTimeout(this.timer);
  }
}
