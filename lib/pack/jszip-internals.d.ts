// Types of the two jszip 3.10 internals zipPack uses to hand jszip entries compressed ahead (jszip has no public
// API for that; its loadAsync builds the same objects for the entries of a zip it reads).
declare module 'jszip/lib/compressedObject' {
  class CompressedObject {
    constructor(compressedSize: number, uncompressedSize: number, crc32: number, compression: { readonly magic: string }, data: Uint8Array);
  }
  export = CompressedObject;
}

declare module 'jszip/lib/compressions' {
  export const STORE: { readonly magic: string };
  export const DEFLATE: { readonly magic: string };
}
