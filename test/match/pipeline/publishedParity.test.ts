// Integration: the match pipeline run in Node on a built site's published files gives the same report JSON as
// `bandshelf match --json --mixture` on the same library, for every demo unknown (file path and timing aside).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import type { MatchReport } from '../../../src/schema/matchReport.js';
import { matchSpectrumFile, type PublishedSearchSet } from '../../../src/site/browser/matchSpectrumFile.js';
import {
  type PublishedEntryDocument,
  publishedMatchSource,
} from '../../../src/site/browser/publishedMatchSource.js';
import { bandshelf } from '../../cli/bandshelfCli.js';
import { buildTestLibrary, DEMO_LIBRARY, type SiteFixture } from '../../site/siteFixture.js';

const UNKNOWNS = join(DEMO_LIBRARY, 'unknowns');
const unknownFiles = readdirSync(UNKNOWNS).filter(
  (n) => /\.(csv|jdx|dx|txt)$/i.test(n) && !n.startsWith('.'),
);

/** The published set with each row's exact float32 vector from its entry folder (`<slug>.processed.f32`). */
function loadPublished(site: string): PublishedSearchSet {
  const meta = JSON.parse(readFileSync(join(site, 'assets', 'search-matrix.json'), 'utf8')) as Omit<
    PublishedSearchSet,
    'processed'
  > & { cols: number };
  const processed = new Float32Array(meta.entries.length * meta.cols);
  meta.entries.forEach((e, r) => {
    const slug = e.path!.replace(/\/$/, '').split('/').pop()!;
    const bytes = readFileSync(join(site, e.path!, `${slug}.processed.f32`));
    processed.set(new Float32Array(bytes.buffer, bytes.byteOffset, bytes.byteLength / 4), r * meta.cols);
  });
  return { ...meta, processed };
}

/** The report without what legitimately differs: the file path and the timing. */
function comparable(report: MatchReport): unknown {
  const { query, ...rest } = report as MatchReport & { timing?: unknown; createdAt?: unknown };
  const { file: _file, ...q } = query;
  const { timing: _t, createdAt: _c, ...others } = rest as Record<string, unknown>;
  return { query: q, ...others };
}

describe('the match pipeline on published site data', () => {
  let fx: SiteFixture;
  let site: string;
  beforeAll(() => {
    fx = buildTestLibrary({ demo: true });
    site = join(fx.dir, 'site');
    const r = bandshelf(['site', '--library', fx.library, '--out', site]);
    expect(r.code, r.stderr).toBe(0);
  }, 240_000);

  it.each(unknownFiles)('%s gives the report `bandshelf match --json --mixture` gives', async (name) => {
    const published = loadPublished(site);
    const source = publishedMatchSource(published, {
      loadEntry: async (path) => {
        const slug = path.replace(/\/$/, '').split('/').pop()!;
        return JSON.parse(readFileSync(join(site, path, `${slug}.json`), 'utf8')) as PublishedEntryDocument;
      },
    });
    const file = join(UNKNOWNS, name);
    const atArgs = published.at ? ['--at', published.at] : [];
    const cli = JSON.parse(
      bandshelf(['match', file, '--library', fx.library, '--json', '--mixture', ...atArgs]).stdout,
    ) as MatchReport;
    const page = await matchSpectrumFile(readFileSync(file), name, published, { source });
    expect(comparable(page.report)).toEqual(comparable(cli));
  });
});
