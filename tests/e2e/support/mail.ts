/** Reads the local mail catcher the test run started (MAIL_CATCHER_URL). */
export async function waitForMailLink(
  to: string,
  { after = 0, timeoutMs = 15_000, sentAfter = 0 }: { after?: number; timeoutMs?: number; sentAfter?: number } = {},
): Promise<string> {
  const base = process.env.MAIL_CATCHER_URL;
  if (!base) throw new Error('MAIL_CATCHER_URL is not set: run the e2e tier through npm test or npm run test:e2e');
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const res = await fetch(`${base}/messages?to=${encodeURIComponent(to)}`);
    const messages = (await res.json()) as { id: string; text: string; receivedAt: string }[];
    const fresh = messages.find((m) => Number(m.id) > after && Date.parse(m.receivedAt) >= sentAfter - 1000);
    const link = fresh ? /(https?:\/\/\S+)/.exec(fresh.text)?.[1] : undefined;
    if (link) return link;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail with a link reached ${to}`);
}
