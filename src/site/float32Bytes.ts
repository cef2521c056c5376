// Raw little-endian float32 bytes of a vector: the processed-vector download, readable by any numeric tool.

export interface Float32BytesOptions {
  /** Byte order. Little-endian is what every current CPU and numpy's `<f4` use.
   * @default true */
  littleEndian?: boolean;
}

/** NaN (not covered) stays NaN; float64 input is rounded to float32 as the library stores it. */
export function float32Bytes(values: ArrayLike<number>, options: Float32BytesOptions = {}): Uint8Array {
  const littleEndian = options.littleEndian ?? true;
  const bytes = new Uint8Array(values.length * 4);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < values.length; i++) view.setFloat32(i * 4, values[i]!, littleEndian);
  return bytes;
}
