// The score kernels in plain JavaScript over Float32Array views: the fallback without WebAssembly SIMD, and the
// reference the SIMD kernels are tested against.
import type { ScoreKernels } from './searchTypes.js';

export function jsScoreKernels(memory: WebAssembly.Memory): ScoreKernels {
  // Views are taken per call: a memory that grows replaces its buffer.
  const f32 = () => new Float32Array(memory.buffer);
  const dotRow = (m: Float32Array, base: number, vec: number, stride: number): number => {
    // Summed in double precision: plain JavaScript arithmetic, so within float32 rounding of the SIMD kernel.
    let acc = 0;
    for (let i = 0; i < stride; i++) acc += m[base + i]! * m[vec + i]!;
    return acc;
  };
  return {
    dotF32(r0, r1, mat, stride, vec, out) {
      const m = f32();
      for (let r = r0; r < r1; r++)
        m[(out >>> 2) + r] = dotRow(m, (mat >>> 2) + r * stride, vec >>> 2, stride);
    },
    dotF32Rows(j0, j1, mat, stride, vec, idx, out) {
      const m = f32();
      const rows = new Uint32Array(memory.buffer);
      for (let j = j0; j < j1; j++) {
        const r = rows[(idx >>> 2) + j]!;
        m[(out >>> 2) + j] = dotRow(m, (mat >>> 2) + r * stride, vec >>> 2, stride);
      }
    },
    dotF32Batch(r0, r1, mat, stride, queries, nq, out, outStride) {
      const m = f32();
      for (let r = r0; r < r1; r++) {
        for (let q = 0; q < nq; q++) {
          const value = dotRow(m, (mat >>> 2) + r * stride, (queries >>> 2) + q * stride, stride);
          m[(out >>> 2) + q * outStride + r] = value;
        }
      }
    },
    dotI8(r0, r1, mat, stride, vec, scale, queryScale, out) {
      const m = f32();
      const i8 = new Int8Array(memory.buffer);
      const i16 = new Int16Array(memory.buffer);
      for (let r = r0; r < r1; r++) {
        let acc = 0;
        const base = mat + r * stride;
        for (let i = 0; i < stride; i++) acc += i8[base + i]! * i16[(vec >>> 1) + i]!;
        m[(out >>> 2) + r] = acc * m[(scale >>> 2) + r]! * queryScale;
      }
    },
    dotI8Batch(r0, r1, mat, stride, queries, nq, scale, queryScale, out, outStride) {
      const m = f32();
      const i8 = new Int8Array(memory.buffer);
      const i16 = new Int16Array(memory.buffer);
      for (let r = r0; r < r1; r++) {
        const base = mat + r * stride;
        for (let q = 0; q < nq; q++) {
          const vec = (queries >>> 1) + q * stride;
          let acc = 0;
          for (let i = 0; i < stride; i++) acc += i8[base + i]! * i16[vec + i]!;
          m[(out >>> 2) + q * outStride + r] = acc * m[(scale >>> 2) + r]! * m[(queryScale >>> 2) + q]!;
        }
      }
    },
    sumF32(r0, r1, mat, stride, out) {
      const m = f32();
      for (let r = r0; r < r1; r++) {
        let acc = 0;
        const base = (mat >>> 2) + r * stride;
        for (let i = 0; i < stride; i++) acc += m[base + i]!;
        m[(out >>> 2) + r] = acc;
      }
    },
  };
}
