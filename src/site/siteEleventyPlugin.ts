// The Eleventy configuration of the site, as a plugin: checks its options before Eleventy reads a template.
import type { EleventyUserConfig } from '@11ty/eleventy';
import { z } from 'zod';
import { metaErrorFromIssues } from '../schema/metaErrorFromIssues.js';
import { relativeUrl } from './relativeUrl.js';
import { reportBodyHtml } from './reportBodyHtml.js';
import type { ReportPage, SiteView } from './types.js';

export interface SiteEleventyPluginOptions {
  /** The global data every template reads as `bs`. */
  view: SiteView;
}

// Page paths become output folders: only safe path segments, always ending in `/`.
const pagePath = (prefix: string) =>
  z
    .string()
    .regex(new RegExp(`^${prefix}/[A-Za-z0-9._~-]+/$`), { message: `must be ${prefix}/<safe segment>/` });

const optionsSchema = z.object({
  view: z
    .object({
      name: z.string(),
      version: z.string(),
      caution: z.string().min(1, { message: 'every page carries the caution; it must not be empty' }),
      empty: z.boolean(),
      state: z.object({ label: z.string(), stateKey: z.string(), shortKey: z.string() }).loose(),
      entries: z.array(
        z
          .object({
            path: pagePath('entries'),
            dataFile: z.object({ file: z.string().regex(/^[A-Za-z0-9._~-]+\.json$/) }).loose(),
          })
          .loose(),
      ),
      reports: z.array(z.object({ path: pagePath('reports') }).loose()),
      contrasts: z.array(z.object({ path: pagePath('contrasts') }).loose()),
      releases: z.array(z.object({ tag: z.string(), anchor: z.string().regex(/^[A-Za-z0-9._-]+$/) }).loose()),
      assignments: z.array(z.object({}).loose()),
      browse: z.object({ rows: z.array(z.object({}).loose()) }).loose(),
    })
    .loose(),
});

/** Freezing lets Eleventy share the data with every template instead of deep-copying it into each. */
function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
}

export function siteEleventyPlugin(
  eleventyConfig: EleventyUserConfig,
  options: SiteEleventyPluginOptions,
): void {
  const parsed = optionsSchema.safeParse(options);
  if (!parsed.success) {
    throw metaErrorFromIssues(parsed.error.issues, {
      code: 'BAD_OPTION',
      lead: 'site plugin',
      knownFields: [],
    });
  }
  eleventyConfig.setTemplateFormats(['njk']);
  eleventyConfig.setUseGitIgnore(false);
  eleventyConfig.setQuietMode(true);
  // Quiet mode does not reach the configuration timings, which print "Benchmark …" notes on stderr for big sites.
  eleventyConfig.benchmarks?.config?.setIsVerbose?.(false);
  // Autoescape on: every value printed with {{ }} is HTML-escaped unless a template marks it `| safe`, and the only
  // values marked so are the site's own markup and JSON already escaped by jsonForScript.
  eleventyConfig.setNunjucksEnvironmentOptions({
    autoescape: true,
    throwOnUndefined: false,
    trimBlocks: true,
    lstripBlocks: true,
  });
  eleventyConfig.ignores.add('assets/**');
  // Every link is relative to its page (no root-absolute URL), so the same folder works from `/`, from a sub-path
  // and from disk; `--base` then needs no rewriting of links at all.
  eleventyConfig.addFilter('url', function (this: { page?: { url?: string } }, path: string) {
    return relativeUrl(String(path), { from: this.page?.url ?? '/' });
  });
  // A report's body, from the one renderer the in-browser matcher uses too.
  eleventyConfig.addFilter('reportBody', function (this: { page?: { url?: string } }, page: ReportPage) {
    const from = this.page?.url ?? '/';
    return reportBodyHtml(page, { href: (path) => relativeUrl(`/${path}`, { from }) });
  });
  eleventyConfig.addGlobalData('bs', deepFreeze(options.view));
}
