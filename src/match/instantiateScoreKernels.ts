// Instantiates the WebAssembly SIMD score kernels on a given memory; browser-safe (no Node imports).
import { scoreKernelsWasm } from './scoreKernelsWasm.js';
import type { ScoreKernels } from './searchTypes.js';

export interface InstantiateScoreKernelsOptions {
  /**
   * Module variant; by default the one whose memory import matches `memory` (shared or not).
   * @default 'auto'
   */
  variant?: 'auto' | 'plain' | 'shared';
}

const modules = new Map<'plain' | 'shared', WebAssembly.Module | null>();

function decodeBase64(text: string): Uint8Array<ArrayBuffer> {
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

/** The compiled module, or null where the engine lacks WebAssembly SIMD (or threads, for the shared variant). */
function moduleFor(variant: 'plain' | 'shared'): WebAssembly.Module | null {
  if (!modules.has(variant)) {
    let compiled: WebAssembly.Module | null = null;
    if (typeof WebAssembly === 'object') {
      const bytes = decodeBase64(scoreKernelsWasm[variant]);
      // validate() answers false instead of throwing on engines without SIMD. Compiling can still throw: a page
      // whose Content-Security-Policy lacks 'wasm-unsafe-eval' forbids it, and the JavaScript kernels then serve.
      try {
        if (WebAssembly.validate(bytes)) compiled = new WebAssembly.Module(bytes);
      } catch {
        compiled = null;
      }
    }
    modules.set(variant, compiled);
  }
  return modules.get(variant) ?? null;
}

/** Returns null where the kernels cannot run here; callers then fall back to `jsScoreKernels`. */
export function instantiateScoreKernels(
  memory: WebAssembly.Memory,
  options: InstantiateScoreKernelsOptions = {},
): ScoreKernels | null {
  const requested = options.variant ?? 'auto';
  const isShared = typeof SharedArrayBuffer === 'function' && memory.buffer instanceof SharedArrayBuffer;
  const variant = requested === 'auto' ? (isShared ? 'shared' : 'plain') : requested;
  const module = moduleFor(variant);
  if (module === null) return null;
  const instance = new WebAssembly.Instance(module, { env: { memory } });
  return instance.exports as unknown as ScoreKernels;
}
