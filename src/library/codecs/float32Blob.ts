// Packs values into a little-endian Float32 blob; NaN (not covered) stays NaN.

export function float32Blob(values: Float64Array | Float32Array): Buffer {
  const out = Buffer.allocUnsafe(values.length * 4);
  for (let i = 0; i < values.length; i++) out.writeFloatLE(values[i]!, i * 4);
  return out;
}
