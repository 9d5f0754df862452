import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { Socket } from 'node:net';
import { toHandler, type AnyRouteSpec } from '@/lib/server/http';

/**
 * A plain Node HTTP front for a few registered routes, so that a test can drive them over real sockets (with
 * real connection failures) without a Next build. Faults: `stop()` drops every connection and stops listening,
 * as a killed server would, and `start()` listens again on the same port; `loseAnswers` answers a share of the
 * successful requests with a cut connection after the route has run (the write happened, the client never hears).
 */
export class RouteServer {
  private server: Server | null = null;
  private readonly sockets = new Set<Socket>();
  private readonly routes: { pattern: RegExp; names: string[]; handle: ReturnType<typeof toHandler>; method: string }[];
  port = 0;
  loseAnswers = 0;
  answersLost = 0;

  constructor(routes: readonly AnyRouteSpec[]) {
    this.routes = routes.map((r) => {
      const names: string[] = [];
      const pattern = new RegExp(`^${r.path.replace(/\{(\w+)\}/g, (_m, name: string) => (names.push(name), '([^/]+)'))}$`);
      return { pattern, names, handle: toHandler(r), method: r.method };
    });
  }

  get url(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    const server = createServer((req, res) => void this.serve(req, res));
    server.on('connection', (socket) => {
      this.sockets.add(socket);
      socket.on('close', () => this.sockets.delete(socket));
    });
    await new Promise<void>((resolve) => server.listen(this.port, '127.0.0.1', resolve));
    this.port = (server.address() as { port: number }).port;
    this.server = server;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (!server) return;
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    // Connections accepted a moment before close() would otherwise keep it waiting for their keep-alive timeout.
    server.closeAllConnections();
    for (const s of this.sockets) s.destroy();
    await closed;
  }

  private async serve(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const path = (req.url ?? '/').split('?')[0]!;
    for (const route of this.routes) {
      const m = route.method === req.method ? route.pattern.exec(path) : null;
      if (!m) continue;
      const chunks: Buffer[] = [];
      for await (const c of req) chunks.push(c as Buffer);
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === 'string') headers.set(k, v);
      const request = new Request(`${this.url}${req.url}`, { method: req.method, headers, body: chunks.length ? Buffer.concat(chunks) : undefined });
      const params = Object.fromEntries(route.names.map((n, i) => [n, decodeURIComponent(m[i + 1]!)]));
      const response = await route.handle(request, { params: Promise.resolve(params) });
      if (response.ok && this.loseAnswers > 0 && Math.random() < this.loseAnswers) {
        this.answersLost += 1;
        req.socket.destroy();
        return;
      }
      res.writeHead(response.status, Object.fromEntries(response.headers));
      res.end(Buffer.from(await response.arrayBuffer()));
      return;
    }
    res.writeHead(404).end();
  }
}
