import 'server-only';
import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import yauzl from 'yauzl';
import { MANIFEST_PATH, SUMS_PATH, type PackCheckEntry } from '@/lib/pack';
import { PACK_ZIP_LIMITS, type PackZipLimits } from './pack-zip-limits';
import { PackZipError } from './pack-zip-error';

const MIB = 1024 * 1024;
/** General purpose bit 0: traditional PKWARE encryption; bit 6: strong encryption. */
const FLAG_ENCRYPTED = 0x0001 | 0x0040;
/** The Unix file type bits of the external attributes' high 16 bits (`st_mode & S_IFMT`). */
const S_IFMT = 0o170000;
const S_IFLNK = 0o120000;
const S_IFREG = 0o100000;
const S_IFDIR = 0o040000;
const METHOD_STORE = 0;
const METHOD_DEFLATE = 8;

const mib = (bytes: number): string => `${Math.round(bytes / MIB).toLocaleString('en')} MiB`;

/**
 * Why a zip entry name is unsafe to use as a path, or null if it is a plain relative path: no NUL or control
 * characters, no backslashes, not absolute, no drive letter, no empty, `.` or `..` segments.
 */
export function unsafeEntryNameReason(name: string): string | null {
  if (name === '') return 'has an empty name';
  if (/[\u0000-\u001f\u007f]/.test(name)) return 'has a control character (such as NUL or a line break) in its name';
  if (name.includes('\\')) return 'uses a backslash in its name';
  if (name.startsWith('/')) return 'is an absolute path';
  if (/^[A-Za-z]:/.test(name)) return 'starts with a drive letter';
  const segments = (name.endsWith('/') ? name.slice(0, -1) : name).split('/');
  if (segments.includes('..')) return 'climbs out of the pack with ".."';
  if (segments.some((s) => s === '' || s === '.')) return 'has an empty or "." folder in its path';
  return null;
}

function decodeName(entry: yauzl.Entry): string {
  const raw = (entry as yauzl.Entry & { fileNameRaw?: Buffer }).fileNameRaw ?? Buffer.from(entry.fileName as unknown as Uint8Array);
  // Without the UTF-8 flag (general purpose bit 11) a name is CP437; pack names are ASCII, where the two agree,
  // and anything else is decoded as UTF-8 too (as most tools write it), so it shows up as an unlisted file.
  return new TextDecoder('utf-8').decode(raw);
}

function openZip(bytes: Buffer): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: true, decodeStrings: false, validateEntrySizes: true }, (error, zip) => {
      if (error || !zip) reject(corrupt(error));
      else resolve(zip);
    });
  });
}

function corrupt(error: unknown, entry?: string): PackZipError {
  const reason = error instanceof Error ? error.message : String(error);
  if (/too many bytes in the stream/.test(reason)) {
    return new PackZipError('bomb', `${entry ?? 'An entry'} inflates to more bytes than its header declares: the zip is damaged or built to mislead, and was not read further.`, { entry, cause: error });
  }
  const what = entry ? `The entry ${entry} cannot be read` : 'This file cannot be read as a zip';
  return new PackZipError('corrupt', `${what}: it is damaged or not a zip (${reason}). Download the pack again, or upload the original file.`, { entry, cause: error });
}

/** The next entry, or null at the end; lazy mode reads one central-directory record per call. */
function nextEntry(zip: yauzl.ZipFile): Promise<yauzl.Entry | null> {
  return new Promise((resolve, reject) => {
    const done = () => {
      zip.off('entry', onEntry);
      zip.off('end', onEnd);
      zip.off('error', onError);
    };
    const onEntry = (entry: yauzl.Entry) => (done(), resolve(entry));
    const onEnd = () => (done(), resolve(null));
    const onError = (error: Error) => (done(), reject(corrupt(error)));
    zip.on('entry', onEntry);
    zip.on('end', onEnd);
    zip.on('error', onError);
    zip.readEntry();
  });
}

function openStream(zip: yauzl.ZipFile, entry: yauzl.Entry, name: string): Promise<Readable> {
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (error, stream) => {
      if (error || !stream) reject(corrupt(error, name));
      else resolve(stream);
    });
  });
}

/** Stage: refuse an entry from its central-directory record alone (name, type, encryption, method, declared sizes). */
function refuseByHeader(entry: yauzl.Entry, name: string, limits: PackZipLimits): void {
  const reason = unsafeEntryNameReason(name);
  if (reason) throw new PackZipError('unsafe-name', `The entry ${JSON.stringify(name)} ${reason}; packs never hold such names, so the zip was refused.`, { entry: name });
  if (Buffer.byteLength(name) > limits.maxNameBytes) throw new PackZipError('unsafe-name', `An entry name is over ${limits.maxNameBytes} bytes long.`, { entry: name.slice(0, 80) });
  const type = (entry.externalFileAttributes >>> 16) & S_IFMT;
  if (type === S_IFLNK) throw new PackZipError('symlink', `The entry ${name} is a symbolic link; packs hold only plain files, so the zip was refused.`, { entry: name });
  if (type !== 0 && type !== S_IFREG && type !== S_IFDIR) throw new PackZipError('symlink', `The entry ${name} is not a plain file (a device, pipe or socket); the zip was refused.`, { entry: name });
  if ((entry.generalPurposeBitFlag & FLAG_ENCRYPTED) !== 0) throw new PackZipError('encrypted', `The entry ${name} is encrypted; packs are never encrypted. Upload the pack as it was downloaded.`, { entry: name });
  if (entry.compressionMethod !== METHOD_STORE && entry.compressionMethod !== METHOD_DEFLATE) {
    throw new PackZipError('unsupported-method', `The entry ${name} uses compression method ${entry.compressionMethod}; packs use only stored or deflated entries.`, { entry: name });
  }
  if (entry.uncompressedSize > limits.maxEntryBytes) throw new PackZipError('too-much-data', `The entry ${name} would inflate to ${mib(entry.uncompressedSize)}, over the limit of ${mib(limits.maxEntryBytes)} for one file.`, { entry: name });
  if (entry.uncompressedSize > limits.ratioFloorBytes && entry.uncompressedSize > limits.maxRatio * Math.max(1, entry.compressedSize)) {
    throw new PackZipError('bomb', `The entry ${name} would inflate ${Math.round(entry.uncompressedSize / Math.max(1, entry.compressedSize))} times its stored size (the limit is ${limits.maxRatio}): it looks like a zip bomb and was not inflated.`, { entry: name });
  }
}

/** `manifest.json` and `SHA256SUMS`, at the top or one folder down (a pack zipped again in its folder), are kept. */
function isKept(name: string): boolean {
  const parts = name.split('/');
  const base = parts[parts.length - 1];
  return parts.length <= 2 && (base === MANIFEST_PATH || base === SUMS_PATH);
}

/**
 * Reads an uploaded pack zip with limits (`PACK_ZIP_LIMITS`): the upload's size and entry count first; then per
 * entry its name (no `..`, absolute paths, backslashes, drive letters or control characters), type (no symbolic
 * links or devices), encryption, method and declared sizes; then, while inflating, the bytes actually produced,
 * per entry, in total and against the compressed size (headers can lie). Every file is hashed (SHA-256) as it
 * streams and only `manifest.json` and `SHA256SUMS` are kept, so memory stays near the upload's size. Folder
 * entries are skipped. Raises `PackZipError`; never anything else for bad input.
 */
export async function readPackZip(bytes: Buffer, limits: PackZipLimits = PACK_ZIP_LIMITS): Promise<Map<string, PackCheckEntry>> {
  if (bytes.length === 0) throw new PackZipError('empty', 'The upload is empty.');
  if (bytes.length > limits.maxZipBytes) throw new PackZipError('too-large', `The zip is ${mib(bytes.length)}; the limit is ${mib(limits.maxZipBytes)}.`);
  const zip = await openZip(bytes);
  // An error emitted between reads must not become an unhandled 'error' event; each read reports its own.
  zip.on('error', () => undefined);
  try {
    if (zip.entryCount > limits.maxEntries) {
      throw new PackZipError('too-many-entries', `The zip has ${zip.entryCount.toLocaleString('en')} entries; the limit is ${limits.maxEntries.toLocaleString('en')}.`);
    }
    const files = new Map<string, PackCheckEntry>();
    const seen = new Set<string>();
    let declaredTotal = 0;
    let inflatedTotal = 0;
    for (let entry = await nextEntry(zip); entry; entry = await nextEntry(zip)) {
      const name = decodeName(entry);
      refuseByHeader(entry, name, limits);
      if (seen.has(name)) throw new PackZipError('duplicate-name', `The zip holds ${name} twice, so which one to check is ambiguous; it was refused.`, { entry: name });
      seen.add(name);
      if (name.endsWith('/')) continue;
      declaredTotal += entry.uncompressedSize;
      if (declaredTotal > limits.maxTotalBytes) throw new PackZipError('too-much-data', `The zip would inflate to more than ${mib(limits.maxTotalBytes)} in all.`, { entry: name });

      const keep = isKept(name);
      const hash = createHash('sha256');
      const chunks: Buffer[] = [];
      let size = 0;
      const stream = await openStream(zip, entry, name);
      try {
        for await (const chunk of stream as AsyncIterable<Buffer>) {
          size += chunk.length;
          inflatedTotal += chunk.length;
          if (size > limits.maxEntryBytes) throw new PackZipError('too-much-data', `The entry ${name} inflates past ${mib(limits.maxEntryBytes)}, the limit for one file.`, { entry: name });
          if (inflatedTotal > limits.maxTotalBytes) throw new PackZipError('too-much-data', `The zip inflates past ${mib(limits.maxTotalBytes)} in all.`, { entry: name });
          if (size > limits.ratioFloorBytes && size > limits.maxRatio * Math.max(1, entry.compressedSize)) {
            throw new PackZipError('bomb', `The entry ${name} inflates more than ${limits.maxRatio} times its stored size: it looks like a zip bomb and was not read further.`, { entry: name });
          }
          if (keep && size > limits.maxKeptBytes) throw new PackZipError('too-much-data', `${name} is over ${mib(limits.maxKeptBytes)}.`, { entry: name });
          hash.update(chunk);
          if (keep) chunks.push(chunk);
        }
      } catch (error) {
        stream.destroy();
        throw error instanceof PackZipError ? error : corrupt(error, name);
      }
      const sha256 = hash.digest('hex');
      files.set(name, keep ? { sha256, size, data: new Uint8Array(Buffer.concat(chunks)) } : { sha256, size });
    }
    if (files.size === 0) throw new PackZipError('empty', 'The zip holds no files.');
    return files;
  } finally {
    zip.close();
  }
}
