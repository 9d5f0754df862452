import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { zipBytes, zipPack, type PackFile } from '@/lib/pack';
import { compressFiles, type CompressedFiles } from '@/lib/pack/compress-files';

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
  file('empty.txt', ''),
];
const DATE = new Date(Date.UTC(2024, 4, 6, 7, 8, 10));

async function zipped(ahead: CompressedFiles[] = []): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  await zipPack(FILES, DATE, (c) => void chunks.push(c), ahead);
  return Buffer.concat(chunks);
}

/** Every entry as yauzl (a second zip library) reads it, inflated and CRC-checked by yauzl. */
function entries(bytes: Buffer): Promise<{ name: string; text: string; method: number; date: Date }[]> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: true, validateEntrySizes: true }, (error, zip) => {
      if (error || !zip) return reject(error);
      const seen: { name: string; text: string; method: number; date: Date }[] = [];
      zip.on('entry', (e: yauzl.Entry) => {
        zip.openReadStream(e, (err, stream) => {
          if (err || !stream) return reject(err);
          const parts: Buffer[] = [];
          stream.on('data', (c: Buffer) => parts.push(c));
          stream.on('error', reject);
          stream.on('end', () => {
            seen.push({ name: e.fileName, text: Buffer.concat(parts).toString('utf8'), method: e.compressionMethod, date: e.getLastModDate({ forceDosFormat: true, timezone: 'UTC' }) });
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(seen));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}

describe('zipPack', () => {
  it('writes every file, in order, readable by a second zip library, with its own compression and the given date', async () => {
    const read = await entries(await zipped());
    expect(read.map((e) => e.name)).toEqual(FILES.map((f) => f.path));
    read.forEach((e, i) => {
      expect(e.text).toBe(new TextDecoder().decode(FILES[i]!.data));
      expect(e.date.getTime()).toBe(DATE.getTime());
    });
    expect(read.find((e) => e.name === 'stimuli/png/d.png')!.method).toBe(0);
    expect(read.find((e) => e.name === 'a.txt')!.method).toBe(8);
  });

  it('gives the same bytes when entries were compressed ahead (e.g. in other threads)', async () => {
    const plain = await zipped();
    const ahead = await zipped([compressFiles(FILES.slice(1, 3)), compressFiles(FILES.slice(4))]);
    expect(ahead.equals(plain)).toBe(true);
  });

  it('compresses a file itself when the block compressed it another way or from other data', async () => {
    const plain = await zipped();
    const otherWay = compressFiles([{ ...FILES[0]!, compression: 'STORE' }]);
    const otherData = compressFiles([{ ...FILES[1]!, data: encoder.encode('something else') }]);
    expect((await zipped([otherWay, otherData])).equals(plain)).toBe(true);
  });

  it('depends on the date, and zipBytes gives the same zip in memory', async () => {
    const chunks: Uint8Array[] = [];
    await zipPack(FILES, new Date(Date.UTC(2020, 0, 1)), (c) => void chunks.push(c));
    expect(Buffer.concat(chunks).equals(await zipped())).toBe(false);
    expect(Buffer.from(await zipBytes(FILES, DATE)).equals(await zipped())).toBe(true);
  });
});
