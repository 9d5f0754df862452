// The production web server (`npm start`, the e2e tier, `npm run load -- --kill-web`): Next serves the app, and the
// participant answers, the one request a running study sends hundreds of times a second, take the fast path beside
// it on the same origin and port (server/ingest.ts). Run with
//   node --conditions=react-server --import tsx server/serve.ts [--hostname 127.0.0.1] [--port 3000]
// after `next build`. Several of these can run behind one reverse proxy (README, "Running Epicycle for a department").
// `npm run dev` keeps plain `next dev`: the Next route file answers there, with the same handler.
import { createServer } from 'node:http';
import { parseArgs } from 'node:util';
import { getEnv } from '@/lib/server/env';

const { values: args } = parseArgs({
  options: {
    hostname: { type: 'string', default: process.env.HOST ?? '127.0.0.1' },
    port: { type: 'string', default: process.env.PORT ?? '3000' },
  },
});
const hostname = args.hostname!;
const port = Number(args.port);
(process.env as Record<string, string>).NODE_ENV = 'production';

// A bad configuration stops the server here with the variables named, before Next loads.
getEnv();

const { default: nextModule } = await import('next');
const createNext = ((nextModule as unknown as { default?: typeof nextModule }).default ?? nextModule) as typeof nextModule;
const app = createNext({ dev: false, hostname, port, dir: process.cwd() });
const nextHandler = app.getRequestHandler();
await app.prepare();

// Loaded after Next has set up its server environment (its request storage, which next/headers needs at import).
const { createFastPath } = await import('./ingest');
const fastPath = createFastPath({ isProduction: true });
const server = createServer((req, res) => {
  if (fastPath(req, res)) return;
  void nextHandler(req, res);
});
await new Promise<void>((resolve, reject) => {
  server.once('error', reject);
  server.listen(port, hostname, () => resolve());
});
process.stdout.write(`[serve] ready on http://${hostname}:${port} (answers on the fast path)\n`);

let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  server.close(() => process.exit(0));
  server.closeIdleConnections();
  // Requests in flight get a moment to finish; a participant's outbox resends anything cut off.
  setTimeout(() => process.exit(0), 3000).unref();
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
