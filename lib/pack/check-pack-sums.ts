/** One line of a `SHA256SUMS` file that could be read. */
export interface SumsLine {
  readonly path: string;
  /** Lowercase hex SHA-256. */
  readonly sha256: string;
  /** 1-based line number. */
  readonly line: number;
}

/** What `parsePackSums` found: readable lines, and the numbers of lines it could not read. */
export interface ParsedSums {
  readonly entries: readonly SumsLine[];
  readonly badLines: readonly number[];
  /** Paths listed more than once (the first listing is kept). */
  readonly duplicates: readonly string[];
}

// GNU coreutils `sha256sum` output: 64 hex digits, a space, then a space (text) or `*` (binary), then the path.
const SUMS_LINE = /^([0-9a-fA-F]{64}) [ *](.+)$/;

/**
 * Reads a `SHA256SUMS` file in the GNU coreutils format (`<hash>  <path>` or `<hash> *<path>`, LF or CRLF line
 * ends; blank lines skipped). Hashes are lowercased; a leading `./` on a path is dropped, as `sha256sum ./x`
 * writes it. Escaped lines (a leading backslash, for names with line breaks) are not read: packs never hold them.
 */
export function parsePackSums(text: string): ParsedSums {
  const entries: SumsLine[] = [];
  const badLines: number[] = [];
  const duplicates: string[] = [];
  const seen = new Set<string>();
  const lines = text.replace(/^\uFEFF/, '').split('\n');
  lines.forEach((raw, i) => {
    const line = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (line.trim() === '') return;
    const match = SUMS_LINE.exec(line);
    if (!match) {
      badLines.push(i + 1);
      return;
    }
    const path = match[2]!.replace(/^\.\//, '');
    if (seen.has(path)) {
      duplicates.push(path);
      return;
    }
    seen.add(path);
    entries.push({ path, sha256: match[1]!.toLowerCase(), line: i + 1 });
  });
  return { entries, badLines, duplicates };
}
