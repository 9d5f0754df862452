// Starts the local mail catcher and waits until its HTTP side answers.
import { join } from 'node:path';
import { log } from './log.mjs';
import { ROOT, startService } from './run.mjs';

export async function startMailCatcher({ smtpPort, httpPort }) {
  const env = { ...process.env, MAIL_CATCHER_SMTP_PORT: String(smtpPort), MAIL_CATCHER_HTTP_PORT: String(httpPort) };
  const child = startService('mail', process.execPath, [join(ROOT, 'scripts', 'mail-catcher.mjs')], env);
  const url = `http://127.0.0.1:${httpPort}`;
  for (let i = 0; i < 100; i++) {
    try {
      const res = await fetch(`${url}/health`);
      if (res.ok) break;
    } catch {
      // not up yet
    }
    if (child.exitCode !== null) throw new Error('the mail catcher exited at start (is the port taken?)');
    await new Promise((r) => setTimeout(r, 100));
  }
  log('mail', `catcher ready: smtp://127.0.0.1:${smtpPort}`);
  return { smtpUrl: `smtp://127.0.0.1:${smtpPort}`, httpUrl: url, stop: () => child.kill('SIGTERM') };
}
