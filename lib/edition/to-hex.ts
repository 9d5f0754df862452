/** Bytes as lowercase hexadecimal, two digits per byte, most significant nibble first. */
export function toHex(bytes: Uint8Array): string {
  let text = '';
  for (const byte of bytes) text += byte.toString(16).padStart(2, '0');
  return text;
}
