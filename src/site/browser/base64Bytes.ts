// Decodes the base64 text a data script carries binary data in (a float32 vector, the search matrix) into bytes.

export interface Base64BytesOptions {
  /** Byte length expected; a different length is an error rather than a silently wrong vector.
   * @default undefined (any length) */
  length?: number;
}

export function base64Bytes(text: string, options: Base64BytesOptions = {}): Uint8Array {
  const binary = atob(text);
  if (options.length !== undefined && binary.length !== options.length) {
    throw new Error(`expected ${options.length} bytes, got ${binary.length}`);
  }
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}
