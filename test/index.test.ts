// Snapshot of the public export list: adding or removing a public name is a decision, so it must show in review.
import { describe, expect, it } from 'vitest';
import * as api from '../src/index.js';

describe('public API', () => {
  it('exports exactly the documented names', () => {
    expect(Object.keys(api).sort()).toMatchSnapshot();
  });

  it('exports only functions, classes, schemas and the caution text', () => {
    for (const [name, value] of Object.entries(api)) {
      const kind = typeof value;
      expect(['function', 'object', 'string'].includes(kind), name).toBe(true);
    }
  });
});
