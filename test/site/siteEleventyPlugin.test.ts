// The Eleventy plugin checks its options before Eleventy reads a template, and configures escaping.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { siteEleventyPlugin } from '../../src/site/siteEleventyPlugin.js';
import type { SiteView } from '../../src/site/types.js';

function recorder() {
  const calls: [string, unknown[]][] = [];
  const config = new Proxy(
    { ignores: new Set<string>() },
    {
      get(target, key) {
        if (key === 'ignores') return target.ignores;
        return (...args: unknown[]) => calls.push([String(key), args]);
      },
    },
  );
  return { config: config as never, calls };
}

const view = (): SiteView =>
  ({
    name: 'Lab',
    version: 'bandshelf',
    caution: 'Research use only.',
    empty: true,
    state: { label: 'working state', at: null, stateKey: 'k', shortKey: 'k', newestRelease: null },
    grid: '',
    bandTolerance: 4,
    counts: { total: 0, byClass: [], byTechnique: [] },
    newest: [],
    browse: { rows: [], classes: [], techniques: [], tags: [], sampleForms: [], reviewStates: [] },
    entries: [],
    reports: [],
    contrasts: [],
    releases: [],
    assignments: [],
  }) as SiteView;

describe('siteEleventyPlugin', () => {
  it('sets Nunjucks autoescape, freezes and adds the global data', () => {
    const { config, calls } = recorder();
    const v = view();
    siteEleventyPlugin(config, { view: v });
    const nunjucks = calls.find(([k]) => k === 'setNunjucksEnvironmentOptions')![1][0] as {
      autoescape: boolean;
    };
    expect(nunjucks.autoescape).toBe(true);
    expect(calls.find(([k]) => k === 'addGlobalData')![1]).toEqual(['bs', v]);
    expect(Object.isFrozen(v)).toBe(true);
  });

  it('throws BAD_OPTION naming the field for an unsafe entry path or a missing caution, before configuring anything', () => {
    for (const [bad, field] of [
      [{ ...view(), caution: '' }, 'view.caution'],
      [
        { ...view(), entries: [{ path: 'entries/../../etc/', dataFile: { file: 'a.json' } }] },
        'view.entries.0.path',
      ],
      [
        { ...view(), entries: [{ path: 'entries/a/', dataFile: { file: '../a.json' } }] },
        'view.entries.0.dataFile.file',
      ],
    ] as const) {
      const { config, calls } = recorder();
      try {
        siteEleventyPlugin(config, { view: bad as unknown as SiteView });
        expect.unreachable();
      } catch (error) {
        expect(error).toBeInstanceOf(BandshelfError);
        expect((error as BandshelfError).code).toBe('BAD_OPTION');
        expect((error as BandshelfError).field).toBe(field);
      }
      expect(calls).toEqual([]);
    }
  });
});
