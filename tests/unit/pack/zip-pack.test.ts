import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { zipPack, type PackFile } from '@/lib/pack';
import { zipEntries } from '@/lib/pack/zip-entries';

const encoder = new TextEncoder();
const file = (path: string, text: string, compression: PackFile['compression'] = 'DEFLATE'): PackFile => {
  const data = encoder.encode(text);
  return { path, data, bytes: data.length, sha256: createHash('sha256').update(data).digest('hex'), compression };
};
const FILES: PackFile[] = [
  file('a.txt', 'alpha '.repeat(5000)),
  file('rdm/b.tsv', Array.from({ length: 4000 }, (_, i) => Math.sin(i).toFixed(7)).join('\t')),
  file('rdm/c.tsv', 'c\t'.repeat(3000)),
  file('stimuli/png/d.png', 'not really a png', 'STORE'),
  file('z.txt', 'zed'),
];
const DATE = new Date(Date.UTC(2024, 4, 6, 7, 8, 10));

async function zipped(premade: Awaited<ReturnType<typeof zipEntries>>[] = []): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  await zipPack(FILES, DATE, (c) => void chunks.push(c), premade);
  return Buffer.concat(chunks);
}

function names(bytes: Buffer): Promise<string[]> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: false }, (error, zip) => {
      if (error || !zip) return reject(error);
      const seen: string[] = [];
      zip.on('entry', (e: yauzl.Entry) => seen.push(e.fileName));
      zip.on('end', () => resolve(seen));
      zip.on('error', reject);
    });
  });
}

describe('zipPack with entries compressed ahead', () => {
  it('gives the same bytes as compressing every entry itself', async () => {
    const plain = await zipped();
    const ahead = await zipped([await zipEntries(FILES.slice(1, 3), DATE), await zipEntries(FILES.slice(4), DATE)]);
    expect(ahead.equals(plain)).toBe(true);
    expect(await names(ahead)).toEqual(FILES.map((f) => f.path));
  });

  it('compresses a file itself when its premade run is out of place, and the bytes stay the same', async () => {
    const plain = await zipped();
    // a.txt and z.txt are not consecutive: that zip is not used.
    const misplaced = await zipped([await zipEntries([FILES[0]!, FILES[4]!], DATE)]);
    expect(misplaced.equals(plain)).toBe(true);
  });

  it('would carry a premade entry’s own date, so premade zips must share the pack’s date', async () => {
    const plain = await zipped();
    const otherDate = await zipped([await zipEntries(FILES.slice(1, 2), new Date(Date.UTC(2020, 0, 1)))]);
    expect(otherDate.equals(plain)).toBe(false);
  });
});
