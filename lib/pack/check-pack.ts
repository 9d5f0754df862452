import { sha256 } from '../edition/sha256';
import { toHex } from '../edition/to-hex';
import { checkPackManifestSchema } from './check-pack-schema';
import { parsePackSums, type ParsedSums } from './check-pack-sums';
import type {
  PackCheckAltered,
  PackCheckEditionClaim,
  PackCheckEntry,
  PackCheckMode,
  PackCheckOptions,
  PackCheckProblem,
  PackCheckProblemCode,
  PackCheckReport,
  PackCheckVerdict,
  ManifestSchemaIssue,
} from './check-pack-types';
import type { EditionState } from './types';

/** The two files every pack carries at its top level. */
export const MANIFEST_PATH = 'manifest.json';
export const SUMS_PATH = 'SHA256SUMS';

/** At most this many problems are listed; a pack with every file altered would otherwise list thousands. */
export const MAX_REPORTED_PROBLEMS = 200;

const EDITION_STATES: readonly EditionState[] = ['draft', 'in_review', 'approved', 'returned'];
const HEX_64 = /^[0-9a-f]{64}$/;

// Problems are listed most serious first; within a code, by path.
const SEVERITY: readonly PackCheckProblemCode[] = [
  'no-sums',
  'no-manifest',
  'manifest-json',
  'manifest-hash',
  'altered',
  'missing',
  'lists-disagree',
  'size-differs',
  'manifest-schema',
  'sums-line',
  'sums-duplicate',
  'extra',
];

const bytesOf = (entry: PackCheckEntry | undefined): Uint8Array | undefined => (entry === undefined || entry instanceof Uint8Array ? entry : entry.data);

const byPath = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);
const defaultSha256Hex = (bytes: Uint8Array): string => toHex(sha256(bytes));
const plural = (n: number, one: string, many = `${one}s`): string => `${n} ${n === 1 ? one : many}`;

/** A file as the manifest lists it. */
interface ManifestRef {
  readonly sha256: string;
  readonly bytes: number | null;
}

interface ReadManifest {
  readonly present: boolean;
  readonly parsed: boolean;
  readonly jsonError: string | null;
  readonly schemaIssues: readonly ManifestSchemaIssue[];
  readonly refs: ReadonlyMap<string, ManifestRef>;
  readonly claim: PackCheckEditionClaim | null;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Stage: parse `manifest.json`, check it against the schema, and collect its file list and edition, leniently. */
function readManifest(bytes: Uint8Array | undefined): ReadManifest {
  if (bytes === undefined) return { present: false, parsed: false, jsonError: null, schemaIssues: [], refs: new Map(), claim: null };
  let value: unknown;
  try {
    value = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch (error) {
    const reason = error instanceof SyntaxError ? error.message : 'it is not UTF-8 text';
    return { present: true, parsed: false, jsonError: reason, schemaIssues: [], refs: new Map(), claim: null };
  }
  const refs = new Map<string, ManifestRef>();
  const addRef = (file: unknown) => {
    if (!isRecord(file) || typeof file.path !== 'string' || typeof file.sha256 !== 'string') return;
    refs.set(file.path, { sha256: file.sha256.toLowerCase(), bytes: typeof file.bytes === 'number' ? file.bytes : null });
  };
  if (isRecord(value)) {
    if (Array.isArray(value.files)) value.files.forEach(addRef);
    if (Array.isArray(value.stimuli)) {
      for (const s of value.stimuli) {
        if (isRecord(s) && isRecord(s.files)) {
          addRef(s.files.svg);
          addRef(s.files.png);
        }
      }
    }
  }
  return { present: true, parsed: true, jsonError: null, schemaIssues: checkPackManifestSchema(value), refs, claim: editionClaim(value) };
}

/** The manifest's `edition`, when its identifying members have the right types (the schema check says the rest). */
function editionClaim(manifest: unknown): PackCheckEditionClaim | null {
  if (!isRecord(manifest) || !isRecord(manifest.edition)) return null;
  const e = manifest.edition;
  if (typeof e.spaceName !== 'string' || typeof e.number !== 'number' || typeof e.contentHash !== 'string') return null;
  const state = EDITION_STATES.find((s) => s === e.state);
  if (!state || !HEX_64.test(e.contentHash) || !Number.isInteger(e.number)) return null;
  return { spaceName: e.spaceName, number: e.number, contentHash: e.contentHash, state, createdAt: typeof e.createdAt === 'string' ? e.createdAt : '' };
}

/** Stage: find the pack's root: the top of the zip, or the one folder an unpacked pack was zipped up in. */
function packRoot(files: ReadonlyMap<string, PackCheckEntry>): { folder: string | null; files: ReadonlyMap<string, PackCheckEntry> } {
  if (files.has(SUMS_PATH) || files.has(MANIFEST_PATH)) return { folder: null, files };
  const names = [...files.keys()];
  const first = names[0]?.split('/')[0];
  if (first === undefined || !names.every((n) => n.startsWith(`${first}/`))) return { folder: null, files };
  const folder = `${first}/`;
  if (!files.has(`${folder}${SUMS_PATH}`) && !files.has(`${folder}${MANIFEST_PATH}`)) return { folder: null, files };
  return { folder, files: new Map(names.map((n) => [n.slice(folder.length), files.get(n)!])) };
}

interface Collected {
  altered: PackCheckAltered[];
  missing: string[];
  extra: string[];
  problems: PackCheckProblem[];
  checked: number;
  intact: number;
}

/** Stage: problems of the two lists themselves and of how they relate. */
function listProblems(sums: ParsedSums | null, manifest: ReadManifest, mode: PackCheckMode, problems: PackCheckProblem[]): void {
  if (!sums) problems.push({ code: 'no-sums', path: SUMS_PATH, message: 'SHA256SUMS is missing, so only the hashes in the manifest can be checked, and the manifest itself cannot.' });
  if (!manifest.present) problems.push({ code: 'no-manifest', path: MANIFEST_PATH, message: 'manifest.json is missing, so the edition the pack was made from is unknown.' });
  if (manifest.jsonError !== null) problems.push({ code: 'manifest-json', path: MANIFEST_PATH, message: `manifest.json cannot be read as JSON (${manifest.jsonError}).` });
  for (const issue of manifest.schemaIssues) {
    problems.push({ code: 'manifest-schema', path: MANIFEST_PATH, message: `manifest.json ${issue.pointer || '(the whole file)'} ${issue.message}.` });
  }
  if (!sums) return;
  for (const line of sums.badLines) problems.push({ code: 'sums-line', path: SUMS_PATH, message: `SHA256SUMS line ${line} is not "<64 hex digits>  <path>".` });
  for (const path of sums.duplicates) problems.push({ code: 'sums-duplicate', path, message: `SHA256SUMS lists ${path} more than once; the first line is used.` });
  if (!manifest.parsed) return;
  const sumsByPath = new Map(sums.entries.map((e) => [e.path, e.sha256]));
  for (const [path, ref] of manifest.refs) {
    const listed = sumsByPath.get(path);
    if (listed === undefined) problems.push({ code: 'lists-disagree', path, message: `${path} is in the manifest but not in SHA256SUMS.` });
    else if (listed !== ref.sha256) problems.push({ code: 'lists-disagree', path, message: `The manifest and SHA256SUMS give different hashes for ${path}.` });
  }
  for (const { path } of sums.entries) {
    if (path !== MANIFEST_PATH && !manifest.refs.has(path)) problems.push({ code: 'lists-disagree', path, message: `${path} is in SHA256SUMS but not in the manifest.` });
  }
  if (mode === 'manifest' && !sumsByPath.has(MANIFEST_PATH)) {
    problems.push({ code: 'lists-disagree', path: MANIFEST_PATH, message: 'SHA256SUMS has no line for manifest.json, so the manifest cannot be checked against it.' });
  }
}

/** Stage: hash every listed file that is present and compare it with both lists. */
function fileFindings(files: ReadonlyMap<string, PackCheckEntry>, sums: ParsedSums | null, manifest: ReadManifest, hashHex: (b: Uint8Array) => string, out: Collected): void {
  const sumsByPath = new Map((sums?.entries ?? []).map((e) => [e.path, e.sha256]));
  const listed = new Set<string>([...sumsByPath.keys(), ...manifest.refs.keys()]);
  for (const path of [...listed].sort(byPath)) {
    const entry = files.get(path);
    if (entry === undefined) {
      out.missing.push(path);
      out.problems.push({ code: 'missing', path, message: `${path} is listed but not in the pack.` });
      continue;
    }
    out.checked++;
    const actual = entry instanceof Uint8Array ? hashHex(entry) : entry.sha256.toLowerCase();
    const size = entry instanceof Uint8Array ? entry.length : entry.size;
    const fromSums = sumsByPath.get(path);
    const ref = manifest.refs.get(path);
    const expected = [fromSums, ref?.sha256].find((h) => h !== undefined && h !== actual);
    if (expected !== undefined) {
      out.altered.push({ path, expected, actual });
      const message = path === MANIFEST_PATH
        ? 'manifest.json was changed after the pack was made: its SHA-256 differs from its line in SHA256SUMS, so its file list and edition cannot be trusted.'
        : `${path} was changed: its SHA-256 is not the one the pack lists.`;
      out.problems.push({ code: path === MANIFEST_PATH ? 'manifest-hash' : 'altered', path, message });
      continue;
    }
    out.intact++;
    if (ref && ref.bytes !== null && ref.bytes !== size) {
      out.problems.push({ code: 'size-differs', path, message: `The manifest gives ${path} as ${ref.bytes} bytes; it has ${size}.` });
    }
  }
  for (const path of [...files.keys()].sort(byPath)) {
    if (path !== SUMS_PATH && !listed.has(path)) {
      out.extra.push(path);
      out.problems.push({ code: 'extra', path, message: `${path} is in the pack but listed nowhere.` });
    }
  }
}

function verdictOf(c: Collected, sums: ParsedSums | null, manifest: ReadManifest): PackCheckVerdict {
  if (!sums && !manifest.parsed) return 'unreadable';
  if (c.altered.length > 0) return 'altered';
  if (c.missing.length > 0) return 'incomplete';
  return c.problems.length > 0 ? 'inconsistent' : 'intact';
}

function summaryOf(verdict: PackCheckVerdict, mode: PackCheckMode, c: Collected, folder: string | null): string {
  const where = folder ? ` (found inside the folder ${folder})` : '';
  switch (verdict) {
    case 'unreadable':
      return `Nothing to check against${where}: neither a SHA256SUMS file nor a readable manifest.json was found.`;
    case 'altered':
      return `${plural(c.altered.length, 'file')} differ${c.altered.length === 1 ? 's' : ''} from the hashes the pack lists${c.missing.length ? `, and ${c.missing.length} listed ${c.missing.length === 1 ? 'is' : 'are'} missing` : ''}${where}.`;
    case 'incomplete':
      return `${plural(c.missing.length, 'listed file')} ${c.missing.length === 1 ? 'is' : 'are'} missing${where}; the ${plural(c.intact, 'file')} present match their hashes.`;
    case 'inconsistent':
      return mode === 'zip'
        ? `Every file present matches its hash${where}, but the pack has the problems listed below.`
        : 'manifest.json matches SHA256SUMS, but the two lists have the problems below. The files themselves were not checked.';
    case 'intact':
      return mode === 'zip'
        ? `Intact${where}: all ${plural(c.intact, 'listed file')} are present and match their SHA-256, and the manifest agrees with SHA256SUMS.`
        : 'manifest.json matches its line in SHA256SUMS and the two lists agree. The files themselves were not checked: upload the zip to check them too.';
  }
}

function report(
  mode: PackCheckMode,
  sums: ParsedSums | null,
  manifest: ReadManifest,
  manifestHashMatches: boolean | null,
  c: Collected,
  folder: string | null,
): PackCheckReport {
  const verdict = verdictOf(c, sums, manifest);
  const rank = (p: PackCheckProblem) => SEVERITY.indexOf(p.code);
  const problems = [...c.problems].sort((a, b) => rank(a) - rank(b) || byPath(a.path ?? '', b.path ?? ''));
  const listed = new Set([...(sums?.entries ?? []).map((e) => e.path), ...manifest.refs.keys()]).size;
  return {
    mode,
    verdict,
    summary: summaryOf(verdict, mode, c, folder),
    counts: { listed, checked: c.checked, intact: c.intact, altered: c.altered.length, missing: c.missing.length, extra: c.extra.length },
    altered: c.altered,
    missing: c.missing,
    extra: c.extra,
    manifest: { present: manifest.present, parsed: manifest.parsed, hashMatchesSums: manifestHashMatches, schemaIssues: manifest.schemaIssues },
    sums: { present: sums !== null, lines: sums?.entries.length ?? 0 },
    folder,
    edition: manifest.claim,
    problems: problems.slice(0, MAX_REPORTED_PROBLEMS),
    problemsLeftOff: Math.max(0, problems.length - MAX_REPORTED_PROBLEMS),
  };
}

const emptyCollected = (): Collected => ({ altered: [], missing: [], extra: [], problems: [], checked: 0, intact: 0 });

/**
 * Checks a whole stimulus pack against its own lists: every path in `SHA256SUMS` (GNU coreutils format) and in
 * the manifest's file lists is hashed (SHA-256, FIPS 180-4) and compared; listed files absent from the pack are
 * missing, files listed nowhere are extra, and `manifest.json` is checked against its `SHA256SUMS` line and
 * against `MANIFEST_SCHEMA`. `files` maps `/`-separated paths to bytes, or to a hash and size already computed
 * (no folder entries); a pack zipped again inside one folder is found there. Pure: hashing may come in as `options.sha256Hex`.
 */
export function checkPack(files: ReadonlyMap<string, PackCheckEntry>, options: PackCheckOptions = {}): PackCheckReport {
  const hashHex = options.sha256Hex ?? defaultSha256Hex;
  const root = packRoot(files);
  const sumsBytes = bytesOf(root.files.get(SUMS_PATH));
  const sums = sumsBytes === undefined ? null : parsePackSums(new TextDecoder().decode(sumsBytes));
  const manifestBytes = bytesOf(root.files.get(MANIFEST_PATH));
  const manifest = readManifest(manifestBytes);
  const c = emptyCollected();
  listProblems(sums, manifest, 'zip', c.problems);
  fileFindings(root.files, sums, manifest, hashHex, c);
  const manifestLine = sums?.entries.find((e) => e.path === MANIFEST_PATH);
  const manifestHashMatches = manifestBytes && manifestLine ? !c.altered.some((a) => a.path === MANIFEST_PATH) : null;
  return report('zip', sums, manifest, manifestHashMatches, c, root.folder);
}

/**
 * Checks a manifest against its `SHA256SUMS` without the pack's other files: `manifest.json`'s SHA-256 against its
 * line, the manifest's file list against the other lines (same paths, same hashes), and the manifest against
 * `MANIFEST_SCHEMA`. `manifestText` must be the file exactly as shipped (its hash covers every byte).
 */
export function checkPackManifest(manifestText: string, sumsText: string, options: PackCheckOptions = {}): PackCheckReport {
  const hashHex = options.sha256Hex ?? defaultSha256Hex;
  const manifestBytes = new TextEncoder().encode(manifestText);
  const sums = parsePackSums(sumsText);
  const manifest = readManifest(manifestBytes);
  const c = emptyCollected();
  listProblems(sums, manifest, 'manifest', c.problems);
  const manifestLine = sums.entries.find((e) => e.path === MANIFEST_PATH);
  let manifestHashMatches: boolean | null = null;
  if (manifestLine) {
    const actual = hashHex(manifestBytes);
    manifestHashMatches = actual === manifestLine.sha256;
    c.checked = 1;
    if (manifestHashMatches) c.intact = 1;
    else {
      c.altered.push({ path: MANIFEST_PATH, expected: manifestLine.sha256, actual });
      c.problems.push({ code: 'manifest-hash', path: MANIFEST_PATH, message: 'manifest.json differs from its line in SHA256SUMS: either was changed, or they come from different packs.' });
    }
  }
  return report('manifest', sums, manifest, manifestHashMatches, c, null);
}
