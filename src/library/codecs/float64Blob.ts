// Packs a Float64Array into a little-endian blob (a copy, so the caller's array stays its own).

export function float64Blob(values: Float64Array): Buffer {
  const out = Buffer.allocUnsafe(values.length * 8);
  for (let i = 0; i < values.length; i++) out.writeDoubleLE(values[i]!, i * 8);
  return out;
}
