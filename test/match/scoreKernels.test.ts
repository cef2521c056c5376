// The WebAssembly SIMD score kernels against the plain JavaScript ones, and the committed module bytes against the WAT.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { instantiateScoreKernels } from '../../src/match/instantiateScoreKernels.js';
import { jsScoreKernels } from '../../src/match/jsScoreKernels.js';
import { scoreKernelsWasm } from '../../src/match/scoreKernelsWasm.js';
import { compileScoreKernels, scoreKernelsModuleText } from '../../src/match/wasm/compileScoreKernels.mjs';
import { seeded } from './searchFixtures.js';

const rows = 203; // odd, so the batch kernel's single-row tail runs
const stride = 64;
const mat = 1 << 16;
const mat8 = mat + rows * stride * 4;
const vec = 64;
const queries = 4096;
const q16 = 2048;
const scale = mat8 + rows * stride;
const out = scale + rows * 4;
const idx = out + 8 * rows * 4;

function fill(memory: WebAssembly.Memory, seed: number): void {
  const random = seeded(seed);
  const f32 = new Float32Array(memory.buffer);
  for (let i = 0; i < rows * stride; i++) f32[(mat >> 2) + i] = random() * 2 - 1;
  for (let i = 0; i < stride; i++) f32[(vec >> 2) + i] = random() * 2 - 1;
  for (let i = 0; i < 8 * stride; i++) f32[(queries >> 2) + i] = random() * 2 - 1;
  const i8 = new Int8Array(memory.buffer, mat8, rows * stride);
  for (let i = 0; i < i8.length; i++) i8[i] = Math.floor(random() * 255) - 127;
  const i16 = new Int16Array(memory.buffer, q16, stride);
  for (let i = 0; i < stride; i++) i16[i] = Math.floor(random() * 65535) - 32767;
  const s = new Float32Array(memory.buffer, scale, rows);
  for (let r = 0; r < rows; r++) s[r] = random() * 1e-3;
  const list = new Uint32Array(memory.buffer, idx, 50);
  for (let j = 0; j < list.length; j++) list[j] = Math.floor(random() * rows);
}

function plane(memory: WebAssembly.Memory, count: number): Float32Array {
  return new Float32Array(memory.buffer, out, count).slice();
}

describe('score kernels', () => {
  const memory = new WebAssembly.Memory({ initial: 32, maximum: 32 });
  fill(memory, 11);
  const wasm = instantiateScoreKernels(memory)!;
  const js = jsScoreKernels(memory);

  it('instantiates: Node 20 has WebAssembly SIMD', () => {
    expect(wasm).not.toBeNull();
  });

  it('dotF32 (SIMD) equals the JavaScript mat-vec to 1e-5', () => {
    wasm.dotF32(0, rows, mat, stride, vec, out);
    const a = plane(memory, rows);
    js.dotF32(0, rows, mat, stride, vec, out);
    const b = plane(memory, rows);
    for (let r = 0; r < rows; r++) expect(Math.abs(a[r]! - b[r]!)).toBeLessThan(1e-5);
    // An independent hand check of one row.
    const f32 = new Float32Array(memory.buffer);
    let direct = 0;
    for (let i = 0; i < stride; i++) direct += f32[(mat >> 2) + 5 * stride + i]! * f32[(vec >> 2) + i]!;
    expect(a[5]).toBeCloseTo(direct, 5);
  });

  it('a row range writes only its rows', () => {
    new Float32Array(memory.buffer, out, rows).fill(-99);
    wasm.dotF32(10, 20, mat, stride, vec, out);
    const a = plane(memory, rows);
    expect(a[9]).toBe(-99);
    expect(a[20]).toBe(-99);
    expect(a[10]).not.toBe(-99);
  });

  it('dotF32Rows equals dotF32 on the listed rows', () => {
    wasm.dotF32(0, rows, mat, stride, vec, out);
    const all = plane(memory, rows);
    wasm.dotF32Rows(0, 50, mat, stride, vec, idx, out);
    const picked = plane(memory, 50);
    const list = new Uint32Array(memory.buffer, idx, 50);
    for (let j = 0; j < 50; j++) expect(Math.abs(picked[j]! - all[list[j]!]!)).toBeLessThan(1e-5);
  });

  it('the blocked batch kernel equals single queries (SIMD and JavaScript)', () => {
    wasm.dotF32Batch(0, rows, mat, stride, queries, 8, out, rows);
    const batch = plane(memory, 8 * rows);
    js.dotF32Batch(0, rows, mat, stride, queries, 8, out, rows);
    const jsBatch = plane(memory, 8 * rows);
    for (let q = 0; q < 8; q++) {
      wasm.dotF32(0, rows, mat, stride, queries + q * stride * 4, out);
      const single = plane(memory, rows);
      for (let r = 0; r < rows; r++) {
        expect(Math.abs(batch[q * rows + r]! - single[r]!)).toBeLessThan(1e-5);
        expect(Math.abs(jsBatch[q * rows + r]! - single[r]!)).toBeLessThan(1e-5);
      }
    }
  });

  it('dotI8 equals the integer dot product times both scales', () => {
    const queryScale = 2.5e-5;
    wasm.dotI8(0, rows, mat8, stride, q16, scale, queryScale, out);
    const a = plane(memory, rows);
    js.dotI8(0, rows, mat8, stride, q16, scale, queryScale, out);
    const b = plane(memory, rows);
    for (let r = 0; r < rows; r++) {
      // float32 rounding of the lane sums and the two multiplications only
      expect(Math.abs(a[r]! - b[r]!)).toBeLessThanOrEqual(1e-6 * Math.abs(b[r]!) + 1e-12);
    }
  });

  it('dotI8Batch equals dotI8 per query and the JavaScript kernel', () => {
    const queryScale = new Float32Array(memory.buffer, idx + 4096, 4);
    queryScale.set([1e-5, 2e-5, 3e-5, 4e-5]);
    // Four int16 queries from offset q16: the first is the one dotI8 uses below.
    const q16s = 1 << 19;
    const i16 = new Int16Array(memory.buffer, q16s, 4 * stride);
    const random = seeded(5);
    for (let i = 0; i < i16.length; i++) i16[i] = Math.floor(random() * 65535) - 32767;
    wasm.dotI8Batch(0, rows, mat8, stride, q16s, 4, scale, idx + 4096, out, rows);
    const batch = plane(memory, 4 * rows);
    js.dotI8Batch(0, rows, mat8, stride, q16s, 4, scale, idx + 4096, out, rows);
    const jsBatch = plane(memory, 4 * rows);
    for (let q = 0; q < 4; q++) {
      wasm.dotI8(0, rows, mat8, stride, q16s + q * stride * 2, scale, queryScale[q]!, out);
      const single = plane(memory, rows);
      for (let r = 0; r < rows; r++) {
        const tolerance = 1e-6 * Math.abs(jsBatch[q * rows + r]!) + 1e-12;
        expect(Math.abs(batch[q * rows + r]! - jsBatch[q * rows + r]!)).toBeLessThanOrEqual(tolerance);
        expect(Math.abs(batch[q * rows + r]! - single[r]!)).toBeLessThanOrEqual(tolerance);
      }
    }
  });

  it('sumF32 equals a plain sum', () => {
    wasm.sumF32(0, rows, mat, stride, out);
    const a = plane(memory, rows);
    js.sumF32(0, rows, mat, stride, out);
    const b = plane(memory, rows);
    for (let r = 0; r < rows; r++) expect(Math.abs(a[r]! - b[r]!)).toBeLessThan(1e-4);
  });

  it('the shared-memory variant gives the same bytes of output', () => {
    const sharedMemory = new WebAssembly.Memory({ initial: 32, maximum: 32, shared: true });
    new Uint8Array(sharedMemory.buffer).set(new Uint8Array(memory.buffer));
    const sharedKernels = instantiateScoreKernels(sharedMemory)!;
    wasm.dotF32(0, rows, mat, stride, vec, out);
    sharedKernels.dotF32(0, rows, mat, stride, vec, out);
    expect(new Float32Array(sharedMemory.buffer, out, rows)).toEqual(
      new Float32Array(memory.buffer, out, rows),
    );
  });
});

describe('committed module bytes', () => {
  it('match what scoreKernels.wat compiles to (run src/match/wasm/compileScoreKernels.mjs after editing it)', async () => {
    const compiled = await compileScoreKernels();
    expect(scoreKernelsWasm.plain).toBe(compiled.plain);
    expect(scoreKernelsWasm.shared).toBe(compiled.shared);
    const committed = readFileSync(new URL('../../src/match/scoreKernelsWasm.ts', import.meta.url), 'utf8');
    expect(committed).toBe(scoreKernelsModuleText(compiled));
  });
});
