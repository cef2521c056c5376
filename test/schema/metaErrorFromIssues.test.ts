// zod issues → one BandshelfError naming the field, with a "did you mean" hint for a near-miss key.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { metaErrorFromIssues } from '../../src/schema/metaErrorFromIssues.js';
import { timeDomainSchema } from '../../src/schema/recipe.js';

describe('metaErrorFromIssues', () => {
  it('names the first issue as the field and counts the rest', () => {
    const schema = z.object({ a: z.number(), b: z.string() }).strict();
    const parsed = schema.safeParse({ a: 'x', b: 1 });
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    const error = metaErrorFromIssues(parsed.error.issues, { file: 'f.json', line: 3, prefix: 'meta' });
    expect(error.code).toBe('BAD_METADATA');
    expect(error.field).toBe('meta.a');
    expect(error.file).toBe('f.json');
    expect(error.line).toBe(3);
    expect(error.message).toContain('must be a number');
    expect(error.message).toContain('(and 1 more: meta.b)');
  });

  it('hints the known field within two edits of an unknown key', () => {
    // "zeroFil" is one edit from the time-domain step's "zeroFill" (Levenshtein distance, worked by hand).
    const parsed = timeDomainSchema.safeParse({ zeroFil: 2 });
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    const error = metaErrorFromIssues(parsed.error.issues, {
      code: 'BAD_RECIPE',
      prefix: 'timeDomain',
      knownFields: Object.keys(timeDomainSchema.shape),
    });
    expect(error.code).toBe('BAD_RECIPE');
    expect(error.field).toBe('timeDomain.zeroFil');
    expect(error.message).toContain('did you mean "zeroFill"');
  });
});
