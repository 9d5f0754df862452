/** A JSON Pointer (RFC 6901) extended by one reference token: `~` is written `~0` and `/` is written `~1`. */
export function jsonPointer(path: string, token: string | number): string {
  return `${path}/${String(token).replace(/~/g, '~0').replace(/\//g, '~1')}`;
}
