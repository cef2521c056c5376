// The digest a bundle carries over all its other fields, so a damaged or hand-edited bundle is refused on import.
import type { Bundle } from '../../schema/bundle.js';
import { canonicalJson } from './canonicalJson.js';
import { sha256Hex } from './sha256Hex.js';

export function bundleDigest(bundle: Omit<Bundle, 'digest'> & { digest?: string }): string {
  const { digest: _digest, ...body } = bundle;
  return sha256Hex(canonicalJson(body));
}
