// Doubles the typed-array buffers a text reader fills point by point, so it never builds per-point objects.

/** Parallel buffers of read points: abscissa, ordinate and the 1-based file line each point came from. */
export interface PointBuffers {
  x: Float64Array;
  y: Float64Array;
  pointLine: Uint32Array;
}

export interface GrowPointBuffersOptions {
  /** Capacity of the new buffers; never below the current one.
   * @default twice the current capacity */
  capacity?: number;
}

/** New buffers holding the old points at the front; the input buffers are left as they are. */
export function growPointBuffers(buffers: PointBuffers, options: GrowPointBuffersOptions = {}): PointBuffers {
  const capacity = Math.max(buffers.x.length, options.capacity ?? Math.max(1, buffers.x.length * 2));
  const x = new Float64Array(capacity);
  x.set(buffers.x);
  const y = new Float64Array(capacity);
  y.set(buffers.y);
  const pointLine = new Uint32Array(capacity);
  pointLine.set(buffers.pointLine);
  return { x, y, pointLine };
}
