// Runs once when a server instance starts: a bad or missing configuration stops it with a clear message.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { getEnv } = await import('./lib/server/env');
    getEnv();
  }
}
