// Decodes the base64 text a data script carries binary data in (a float32 vector, the search matrix) into bytes.

export interface Base64BytesOptions {
  /** Byte length expected; a different length is an error rather than a silently wrong vector.
   * @default undefined (any length) */
  length?: number;
}

/** The engine's own decoder where it has one (Uint8Array.fromBase64: no intermediate string, no loop in JS). */
const native = (Uint8Array as unknown as { fromBase64?: (text: string) => Uint8Array }).fromBase64;

export function base64Bytes(text: string, options: Base64BytesOptions = {}): Uint8Array {
  if (typeof native === 'function') {
    const bytes = native(text);
    if (options.length !== undefined && bytes.length !== options.length) {
      throw new Error(`expected ${options.length} bytes, got ${bytes.length}`);
    }
    return bytes;
  }
  const binary = atob(text);
  if (options.length !== undefined && binary.length !== options.length) {
    throw new Error(`expected ${options.length} bytes, got ${binary.length}`);
  }
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}
