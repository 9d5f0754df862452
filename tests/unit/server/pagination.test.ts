import { describe, expect, it } from 'vitest';
import { decodeCursor, encodeCursor, toPage } from '@/db/pagination';

describe('cursor pagination', () => {
  it('round-trips a keyset position through an opaque url-safe cursor', () => {
    const pos = { at: '2026-12-02T04:00:00.000Z', id: '3f2a1d5e-0000-4000-8000-000000000001' };
    const cursor = encodeCursor(pos);
    expect(cursor).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(decodeCursor(cursor)).toEqual(pos);
  });

  it('rejects tampered cursors with a field error', () => {
    for (const bad of ['', 'abc', encodeCursor({ at: 'not a date', id: 'x' }), Buffer.from('[1,2]').toString('base64url')]) {
      expect(() => decodeCursor(bad)).toThrow(expect.objectContaining({ code: 'validation:pagination' }));
    }
  });

  it('cuts limit + 1 rows into a page and a next cursor', () => {
    const rows = [1, 2, 3].map((i) => ({ id: String(i), at: new Date(Date.UTC(2026, 0, i)) }));
    const page = toPage(rows, 2, (r) => r.at, (r) => r.id);
    expect(page.items).toEqual(['1', '2']);
    expect(decodeCursor(page.nextCursor!).id).toBe('2');
    expect(toPage(rows, 3, (r) => r.at, (r) => r.id).nextCursor).toBeNull();
  });
});
