import { getDb } from '@/lib/server/db';
import { matchesIfNoneMatch } from '@/lib/server/http';
import { resolvePackDownload } from '@/lib/server/services/packs';

export const dynamic = 'force-dynamic';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A pack download link: checked here, then redirected to a presigned object-store URL that lives a minute. */
export async function GET(request: Request, { params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const r = await resolvePackDownload(getDb(), token);
  if (r.ok) {
    // The ETag is the zip's SHA-256: a script holding that file already gets 304 and downloads nothing.
    if (matchesIfNoneMatch(request, r.etag)) return new Response(null, { status: 304, headers: { etag: r.etag, 'cache-control': 'no-store' } });
    return new Response(null, { status: 302, headers: { location: r.url, etag: r.etag, 'cache-control': 'no-store' } });
  }
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escape(r.title)} · Epicycle</title></head>
<body style="background:#FAF7F0;color:#23262B;font-family:system-ui,sans-serif;padding:48px"><main style="max-width:520px">
<h1 style="font-size:22px">${escape(r.title)}</h1><p>${escape(r.message)}</p></main></body></html>`;
  return new Response(html, { status: r.status, headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' } });
}
