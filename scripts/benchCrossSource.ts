// npm run bench:cross-source -- [--data DIR]: top-1 identification across sources on real spectra, bandshelf vs plain r.
//
// The real files in ../shared/real-spectra (beside the checkout; never copied into it) include sets of one substance
// measured by different instruments, labs or samples (see that folder's PROVENANCE.md and the titles in the files):
// polystyrene from the JCAMP-DX test disk, from the Lancashire test set and from the PlotFTIR sample set; the PlotFTIR diesel and
// biodiesel-blend series; the ChemoSpec saw-palmetto extract spectra of four brands. For each member of a set in turn,
// a library is built from that member, one fixed member of every other set and every other distinct spectrum of the
// folder (distractors); the set's other members are the queries. A query's top-1 is right when the best hit belongs to
// its set. Scored side by side in the same run on the same library: bandshelf's own ingest and match pipeline under
// each recipe listed, and a plain Pearson correlation of the unprocessed absorbance linearly interpolated onto a
// 2 cm⁻¹ grid over the two spectra's overlap (at least 200 cm⁻¹, the matcher's default minimum overlap). Besides
// top-1, each method's margin per query (best score of the query's own set minus the best score of anything else;
// > 0 is a right top-1) is summarised by its median and minimum, on each method's own score scale. One JSON.
// The sets come from the files' provenance, not from the scores; nothing here is tuned to these files.
// As recorded, that set is at its ceiling for every method, so each query is also scored as the synthetic query
// benches without water (below) would record it: measureOnBench applied to the real recording (a coarser Gaussian
// line shape and spacing, ATR weighting — declared as technique atr, as `match --technique atr` does — baselines
// and seeded noise), the library left as recorded (`degradedQueries` in the JSON).
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { demoCompounds } from '../src/demo/demoCompounds.js';
import { readSpectrumFile } from '../src/formats/readSpectrumFile.js';
import { ingest } from '../src/library/ingest/ingest.js';
import { closeLibrary } from '../src/library/store/closeLibrary.js';
import { initLibrary } from '../src/library/store/initLibrary.js';
import { readSearchSet } from '../src/library/store/readSearchSet.js';
import { compareAtCoarserResolution } from '../src/match/compareAtCoarserResolution.js';
import { libraryMatchSource } from '../src/match/libraryMatchSource.js';
import { runMatchPipeline } from '../src/match/pipeline/runMatchPipeline.js';
import { type RecipeInput, recipeSchema } from '../src/schema/recipe.js';
import { RECIPE_PRESETS } from '../src/schema/recipePresets.js';
import { correlation } from '../src/spectrum/correlation.js';
import { pinAtr } from '../src/spectrum/pinAtr.js';
import { processSpectrum } from '../src/spectrum/processSpectrum.js';
import { resolutionOf } from '../src/spectrum/resolutionOf.js';
import type { Spectrum } from '../src/spectrum/types.js';
import { type Bench, measureOnBench } from './measureOnBench.js';

/** Sets of the same substance from different sources or samples (PROVENANCE.md and the files' own titles). */
const SETS: Record<string, string[]> = {
  // dupdec1.jdx (another origin, 1 cm⁻¹ spacing, a thicker film) carries no name; it shows all seven European
  // Pharmacopoeia 2.2.24 polystyrene check bands (3060.0 … 1028.3 cm⁻¹) within 1 cm⁻¹, so it is polystyrene too.
  polystyrene: ['jcamp/jtpolys.jdx', 'jcamp/dupdec1.jdx', 'text/plotftir_polystyrene.csv'],
  'diesel-biodiesel-blend': [
    'text/plotftir_biodiesel_0.csv',
    'text/plotftir_biodiesel_0_25.csv',
    'text/plotftir_biodiesel_0_50.csv',
    'text/plotftir_biodiesel_1_0.csv',
    'text/plotftir_biodiesel_2_5.csv',
    'text/plotftir_biodiesel_5_0.csv',
    'text/plotftir_biodiesel_7_5.csv',
    'text/plotftir_biodiesel_10_0.csv',
    'text/plotftir_biodiesel_B0_5.csv',
    'text/plotftir_biodiesel_B5.csv',
    'text/plotftir_diesel_unknown.csv',
  ],
  'saw-palmetto-extract': [
    'text/chemospec_SrE_CVS_adSrE.csv',
    'text/chemospec_SrE_ET_pSrE.csv',
    'text/chemospec_SrE_MDB_pSrE.csv',
    'text/chemospec_SrE_NR_pSrE.csv',
  ],
};

/**
 * One spectrum of every other distinct substance of the folder; files that are the same record in another
 * encoding (JCAMP-DX compression forms, transmittance and absorbance of one measurement) appear once. Multi-block,
 * non-infrared, wavelength-only and arbitrary-unit test files are left out.
 */
const DISTRACTORS = [
  'jcamp/BRUKER2.JCM',
  'jcamp/LABCALC.DX',
  'jcamp/PE1800.DX',
  'jcamp/SBO.jdx',
  'jcamp/SPECFILE.DX',
  'jcamp/chemspectra_IR.dx',
  'jcamp/chemspectra_fdm_c175.dx',
  'jcamp/xyinc1.jdx',
  'text/plotftir_heptanes.csv',
  'text/plotftir_isopropanol.csv',
  'text/plotftir_paper.csv',
  'text/plotftir_toluene.csv',
];

/** The recipes bandshelf is scored with: what `init` gives, that plus resolution matching, and the film preset. */
const RECIPES: Record<string, RecipeInput> = {
  default: {},
  'default+resolution-4': { resolution: { target: 4 } },
  'dried-film-preset': RECIPE_PRESETS['dried-film'],
};

const PLAIN_STEP = 2;
const MIN_OVERLAP = 200;

function argument(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? process.argv[at + 1]! : fallback;
}

function slug(file: string): string {
  return file
    .toLowerCase()
    .replace(/\.[a-z]+$/, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
}

/** Linear interpolation of the spectrum at 2 cm⁻¹ grid points inside its own range (NaN outside); no processing. */
function plainVector(s: Spectrum, lo: number, count: number): Float64Array {
  const order = Array.from(s.wavenumber.keys()).sort((a, b) => s.wavenumber[a]! - s.wavenumber[b]!);
  const x = Float64Array.from(order, (i) => s.wavenumber[i]!);
  const y = Float64Array.from(order, (i) => s.absorbance[i]!);
  const out = new Float64Array(count).fill(Number.NaN);
  let j = 0;
  for (let k = 0; k < count; k++) {
    const g = lo + k * PLAIN_STEP;
    if (g < x[0]! || g > x[x.length - 1]!) continue;
    while (j < x.length - 2 && x[j + 1]! < g) j++;
    const t = x[j + 1]! === x[j]! ? 0 : (g - x[j]!) / (x[j + 1]! - x[j]!);
    out[k] = y[j]! + t * (y[j + 1]! - y[j]!);
  }
  return out;
}

/** Pearson r over the points both vectors cover; null below the minimum overlap. */
function pearson(a: Float64Array, b: Float64Array): number | null {
  let n = 0;
  let sa = 0;
  let sb = 0;
  for (let i = 0; i < a.length; i++) {
    if (Number.isFinite(a[i]!) && Number.isFinite(b[i]!)) {
      n++;
      sa += a[i]!;
      sb += b[i]!;
    }
  }
  if ((n - 1) * PLAIN_STEP < MIN_OVERLAP) return null;
  const ma = sa / n;
  const mb = sb / n;
  let ab = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < a.length; i++) {
    if (!(Number.isFinite(a[i]!) && Number.isFinite(b[i]!))) continue;
    ab += (a[i]! - ma) * (b[i]! - mb);
    aa += (a[i]! - ma) ** 2;
    bb += (b[i]! - mb) ** 2;
  }
  return aa > 0 && bb > 0 ? ab / Math.sqrt(aa * bb) : null;
}

interface Tally {
  right: number;
  queries: number;
  /** Per query: the best score of the query's own set minus the best score of any other entry. */
  margins: number[];
  bySet: Record<string, { right: number; queries: number }>;
}

function tally(): Tally {
  return {
    right: 0,
    queries: 0,
    margins: [],
    bySet: Object.fromEntries(Object.keys(SETS).map((k) => [k, { right: 0, queries: 0 }])),
  };
}

function count(t: Tally, set: string, right: boolean): void {
  t.queries++;
  t.bySet[set]!.queries++;
  if (right) {
    t.right++;
    t.bySet[set]!.right++;
  }
}

/** Median of the finite values, to 4 decimals. */
function median(values: readonly number[]): number | null {
  const v = values.filter(Number.isFinite).sort((a, b) => a - b);
  if (v.length === 0) return null;
  const m = v.length % 2 === 1 ? v[v.length >> 1]! : (v[v.length / 2 - 1]! + v[v.length / 2]!) / 2;
  return Math.round(1e4 * m) / 1e4;
}

async function realPart(): Promise<Record<string, unknown>> {
  // Beside the checkout (as CI places it), or beside the folder of worktrees a checkout may sit in.
  const besides = [join('..', 'shared', 'real-spectra'), join('..', '..', 'shared', 'real-spectra')];
  const found = besides
    .map((p) => resolve(process.cwd(), p))
    .find((p) => existsSync(join(p, 'PROVENANCE.md')));
  const data = resolve(argument('data', found ?? besides[0]!));
  const spectra = new Map<string, Spectrum & { resolution?: unknown }>();
  for (const file of [...Object.values(SETS).flat(), ...DISTRACTORS]) {
    const [first] = readSpectrumFile(new Uint8Array(readFileSync(join(data, file))), { file });
    spectra.set(file, { ...first!.spectrum, resolution: first!.meta.resolution });
  }
  const setOf = new Map<string, string>();
  for (const [set, files] of Object.entries(SETS)) for (const f of files) setOf.set(f, set);

  const plainLo = 400;
  const plainCount = Math.round((4400 - plainLo) / PLAIN_STEP) + 1;
  const plain = new Map([...spectra].map(([f, s]) => [f, plainVector(s, plainLo, plainCount)]));
  const methods = ['plain-pearson-2cm', ...Object.keys(RECIPES).map((k) => `bandshelf:${k}`)];
  const results: Record<string, Tally> = Object.fromEntries(methods.map((m) => [m, tally()]));
  const degraded: Record<string, Record<string, Tally>> = Object.fromEntries(
    REAL_QUERY_BENCHES.map((b) => [b.name, Object.fromEntries(methods.map((m) => [m, tally()]))]),
  );
  const fileIndex = new Map([...spectra.keys()].map((f, i) => [f, i]));
  const misses: Record<string, { query: string; library: string; top: string }[]> = {};
  let libraryMember = '';
  const miss = (method: string, query: string, top: string) => {
    const list = misses[method] ?? [];
    list.push({ query, library: libraryMember, top });
    misses[method] = list;
  };

  const work = mkdtempSync(join(tmpdir(), 'bandshelf-cross-source-'));
  try {
    for (const [set, members] of Object.entries(SETS)) {
      for (const member of members) {
        const others = Object.entries(SETS)
          .filter(([s]) => s !== set)
          .map(([, files]) => files[0]!);
        const libraryFiles = [member, ...others, ...DISTRACTORS];
        const queries = members.filter((m) => m !== member);
        libraryMember = member;

        // Each query as recorded, then as each degrading bench would record it (seeded by bench and file).
        const variants = queries.flatMap((q) => [
          {
            query: q,
            tally: results,
            bench: null as Bench | null,
            spectrum: spectra.get(q)! as Spectrum,
            resolution: spectra.get(q)!.resolution,
            plain: plain.get(q)!,
          },
          ...REAL_QUERY_BENCHES.map((bench, b) => {
            const measured = measureOnBench(spectra.get(q)!, bench, {
              seed: 1000 * (b + 1) + fileIndex.get(q)!,
            });
            const own = resolutionOf(spectra.get(q)!, { stated: spectra.get(q)!.resolution }).value;
            return {
              query: q,
              tally: degraded[bench.name]!,
              bench,
              spectrum: measured,
              // What the degrading bench would state: its line shape on top of the recording's (widths in quadrature).
              resolution: Math.sqrt(own * own + bench.resolution * bench.resolution),
              plain: plainVector(measured, plainLo, plainCount),
            };
          }),
        ]);

        // Plain Pearson on the unprocessed absorbance.
        for (const { query: q, tally: t, bench, plain: vector } of variants) {
          let best = '';
          let bestR = Number.NEGATIVE_INFINITY;
          let own = Number.NEGATIVE_INFINITY;
          let other = Number.NEGATIVE_INFINITY;
          for (const f of libraryFiles) {
            const r = pearson(vector, plain.get(f)!);
            if (r === null) continue;
            if (setOf.get(f) === set) own = Math.max(own, r);
            else other = Math.max(other, r);
            if (r > bestR) {
              bestR = r;
              best = f;
            }
          }
          count(t['plain-pearson-2cm']!, set, setOf.get(best) === set);
          t['plain-pearson-2cm']!.margins.push(own - other);
          if (setOf.get(best) !== set)
            miss(bench === null ? 'plain-pearson-2cm' : `plain-pearson-2cm@${bench.name}`, q, best);
        }

        // bandshelf: the ingest and match pipeline `add` and `match` run, under each recipe.
        for (const [name, recipe] of Object.entries(RECIPES)) {
          const path = join(work, `${slug(member)}-${name}.sqlite`);
          const library = initLibrary(path, { recipe, name: 'cross-source bench' });
          try {
            for (const f of libraryFiles) {
              const outcome = ingest(library, [join(data, f)], {
                meta: { id: slug(f), name: f },
                force: true,
                message: 'cross-source bench',
              });
              if (outcome.failed.length > 0) throw new Error(`${f}: ${outcome.failed[0]!.error}`);
            }
            const searchSet = readSearchSet(library);
            const { source, scorer } = libraryMatchSource(library, searchSet, {});
            const bySlug = new Map(libraryFiles.map((f) => [slug(f), f]));
            for (const { query: q, tally: t, bench, spectrum, resolution } of variants) {
              const report = await runMatchPipeline(
                {
                  unknown: {
                    file: q,
                    hash: '0'.repeat(64),
                    spectrum,
                    warnings: [],
                    resolution,
                    ...(bench?.technique === 'atr' ? { technique: 'atr' } : {}),
                  },
                  source,
                  scorer,
                  assignments: [],
                },
                { top: libraryFiles.length },
              );
              // runMatchPipeline compares like with like, as `bandshelf match` does.
              const hits = report.hitsByMetric.pearson ?? [];
              const top = hits[0]?.id;
              const ownHit = hits.find((h) => setOf.get(bySlug.get(h.id) ?? '') === set);
              const otherHit = hits.find((h) => setOf.get(bySlug.get(h.id) ?? '') !== set);
              const method = `bandshelf:${name}`;
              t[method]!.margins.push(
                (ownHit?.score ?? Number.NEGATIVE_INFINITY) - (otherHit?.score ?? Number.NEGATIVE_INFINITY),
              );
              const topFile = top === undefined ? '' : (bySlug.get(top) ?? '');
              const right = setOf.get(topFile) === set;
              count(t[method]!, set, right);
              if (!right) miss(bench === null ? method : `${method}@${bench.name}`, q, topFile);
            }
          } finally {
            closeLibrary(library);
          }
        }
      }
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
  }

  const percent = (t: { right: number; queries: number }) =>
    t.queries === 0 ? null : Math.round((1000 * t.right) / t.queries) / 10;
  const summarise = (tallies: Record<string, Tally>) =>
    Object.fromEntries(
      Object.entries(tallies).map(([k, t]) => [
        k,
        {
          top1Percent: percent(t),
          right: t.right,
          queries: t.queries,
          marginMedian: median(t.margins),
          marginMin: Math.round(1e4 * Math.min(...t.margins)) / 1e4,
          bySet: Object.fromEntries(
            Object.entries(t.bySet).map(([s, v]) => [s, { top1Percent: percent(v), ...v }]),
          ),
        },
      ]),
    );
  const summary = summarise(results);
  const degradedSummary = Object.fromEntries(
    Object.entries(degraded).map(([bench, tallies]) => [bench, summarise(tallies)]),
  );
  // Every degraded query of every bench pooled, per method.
  const pooled = Object.fromEntries(
    methods.map((m) => {
      const all = Object.values(degraded).reduce(
        (a, t) => ({ right: a.right + t[m]!.right, queries: a.queries + t[m]!.queries }),
        { right: 0, queries: 0 },
      );
      return [m, { top1Percent: percent(all), ...all }];
    }),
  );
  const minusPlain = (of: Record<string, { top1Percent: number | null }>) =>
    Object.fromEntries(
      Object.keys(RECIPES).map((k) => [
        k,
        Math.round(
          10 * ((of[`bandshelf:${k}`]!.top1Percent ?? 0) - (of['plain-pearson-2cm']!.top1Percent ?? 0)),
        ) / 10,
      ]),
    );
  return {
    about:
      'Top-1 identification across sources on real spectra (../shared/real-spectra); research use only: hits are candidates, not identifications.',
    data: 'real-spectra (see its PROVENANCE.md)',
    sets: Object.fromEntries(Object.entries(SETS).map(([k, v]) => [k, v.length])),
    distractors: DISTRACTORS.length,
    plain: { grid: `${PLAIN_STEP} cm⁻¹, linear interpolation, no processing`, minOverlap: MIN_OVERLAP },
    recipes: RECIPES,
    results: summary,
    bandshelfMinusPlainPoints: minusPlain(summary),
    degradedQueries: {
      about:
        'The same queries as each bench below would record them (scripts/measureOnBench.ts applied to the real recording: its line shape, spacing, range, baseline, ATR weighting and noise on top of the recording own; the library is unchanged; ATR queries are declared as technique atr, as `match --technique atr` does). Synthetic degradations of real spectra, fixed before scoring.',
      benches: REAL_QUERY_BENCHES,
      pooled,
      bandshelfMinusPlainPoints: minusPlain(pooled),
      byBench: degradedSummary,
    },
    misses,
  };
}

/**
 * Synthetic instruments (invented, labelled synthetic): the library is measured on the first, the queries on each
 * other. They differ in resolution (Gaussian instrument line shape 2–16 cm⁻¹), point spacing (0.5–8 cm⁻¹), range,
 * baseline (offset, slope, curvature, a scattering-like ν² term), ATR weighting vs transmission, a liquid-water
 * background and noise. The settings are chosen to span what benches differ in, not from any score.
 */
const BENCHES: Bench[] = [
  {
    name: 'transmission-4cm-1.93',
    resolution: 4,
    spacing: 1.93,
    range: { min: 600, max: 4000 },
    technique: 'transmission',
    baseline: { offset: 0.03, slope: 0.02, curvature: 0.01, scattering: 0 },
    noise: 0.002,
  },
  {
    name: 'atr-diamond-4cm-0.96',
    resolution: 4,
    spacing: 0.96,
    range: { min: 650, max: 4000 },
    technique: 'atr',
    baseline: { offset: 0.02, slope: 0.01, curvature: 0, scattering: 0 },
    noise: 0.001,
  },
  {
    name: 'transmission-2cm-0.5-scattering',
    resolution: 2,
    spacing: 0.5,
    range: { min: 700, max: 3900 },
    technique: 'transmission',
    baseline: { offset: 0.1, slope: 0.05, curvature: 0.05, scattering: 0.4 },
    noise: 0.002,
  },
  {
    name: 'transmission-16cm-8',
    resolution: 16,
    spacing: 8,
    range: { min: 600, max: 4000 },
    technique: 'transmission',
    baseline: { offset: 0.05, slope: 0.05, curvature: 0.02, scattering: 0 },
    noise: 0.003,
  },
  {
    name: 'liquid-water-8cm-4',
    resolution: 8,
    spacing: 4,
    range: { min: 800, max: 3800 },
    technique: 'transmission',
    baseline: { offset: 0.02, slope: 0.02, curvature: 0, scattering: 0 },
    water: 1,
    noise: 0.002,
  },
  {
    name: 'atr-water-4cm-1.93',
    resolution: 4,
    spacing: 1.93,
    range: { min: 650, max: 4000 },
    technique: 'atr',
    baseline: { offset: 0.02, slope: 0.02, curvature: 0.02, scattering: 0.1 },
    water: 0.5,
    noise: 0.002,
  },
];

/**
 * The real part's degrading benches: the synthetic query benches without a water background (the real part's
 * recipes have no water step, and the real substances are not aqueous), applied to each real query.
 */
const REAL_QUERY_BENCHES: Bench[] = BENCHES.slice(1).filter((b) => b.water === undefined);

/** The synthetic part's recipes: the real part's, the liquid-biofluid preset, and the resolution step at 16 cm⁻¹. */
const SYNTHETIC_RECIPES: Record<string, RecipeInput> = {
  ...RECIPES,
  'default+resolution-16': { resolution: { target: 16 } },
  'liquid-biofluid-preset': RECIPE_PRESETS['liquid-biofluid'],
};

function csvOf(s: Spectrum): string {
  const lines = ['wavenumber_cm-1,absorbance'];
  for (let i = 0; i < s.wavenumber.length; i++)
    lines.push(`${s.wavenumber[i]},${s.absorbance[i]!.toFixed(6)}`);
  return `${lines.join('\n')}\n`;
}

/** Top-1 of every demo compound measured on each query bench against a library measured on the first bench. */
async function syntheticPart(): Promise<Record<string, unknown>> {
  const only = argument('recipes', '');
  const recipes = Object.fromEntries(
    Object.entries(SYNTHETIC_RECIPES).filter(([k]) => only === '' || only.split(',').includes(k)),
  );
  const water = demoCompounds.find((c) => c.id === 'water-liquid')!.bands;
  const [libraryBench, ...queryBenches] = BENCHES;
  const work = mkdtempSync(join(tmpdir(), 'bandshelf-cross-synthetic-'));
  // One seed per (compound, bench), fixed by their positions in the lists.
  const measure = (c: number, b: number) =>
    measureOnBench(demoCompounds[c]!.bands, BENCHES[b]!, { seed: 1000 * (b + 1) + c, water });
  const library = demoCompounds.map((_, c) => measure(c, 0));
  const queries = queryBenches.map((_, q) =>
    demoCompounds.map((c, i) => (c.id === 'water-liquid' ? null : measure(i, q + 1))),
  );
  const plainLo = 400;
  const plainCount = Math.round((4400 - plainLo) / PLAIN_STEP) + 1;
  const libraryPlain = library.map((s) => plainVector(s, plainLo, plainCount));
  const methods = [
    'plain-pearson-2cm',
    ...Object.keys(recipes).map((k) => `bandshelf:${k}`),
    ...Object.keys(recipes).map((k) => `pipeline-only:${k}`),
  ];
  const tallies: Record<string, Record<string, { right: number; queries: number }>> = {};
  const missed: Record<string, Record<string, string[]>> = {};
  for (const m of methods) {
    tallies[m] = Object.fromEntries(queryBenches.map((b) => [b.name, { right: 0, queries: 0 }]));
    missed[m] = {};
  }
  const record = (method: string, bench: string, id: string, top: string | undefined) => {
    const t = tallies[method]![bench]!;
    t.queries++;
    if (top === id) t.right++;
    else {
      const list = missed[method]![bench] ?? [];
      list.push(`${id}→${top ?? 'none'}`);
      missed[method]![bench] = list;
    }
  };
  try {
    // Plain Pearson on the unprocessed absorbance, 2 cm⁻¹ grid.
    for (const [q, bench] of queryBenches.entries()) {
      for (const [c, spectrum] of queries[q]!.entries()) {
        if (spectrum === null) continue;
        const v = plainVector(spectrum, plainLo, plainCount);
        let best = -1;
        let bestR = Number.NEGATIVE_INFINITY;
        for (let e = 0; e < library.length; e++) {
          const r = pearson(v, libraryPlain[e]!);
          if (r !== null && r > bestR) {
            bestR = r;
            best = e;
          }
        }
        record('plain-pearson-2cm', bench.name, demoCompounds[c]!.id, demoCompounds[best]?.id);
      }
    }
    const files = library.map((s, c) => {
      const path = join(work, `${demoCompounds[c]!.id}.csv`);
      writeFileSync(path, csvOf(s));
      return path;
    });
    for (const [name, recipe] of Object.entries(recipes)) {
      const lib = initLibrary(join(work, `${name}.sqlite`), { recipe, name: 'cross-source synthetic bench' });
      try {
        // Water first: the liquid-biofluid preset subtracts the library's water-liquid entry.
        const order = demoCompounds
          .map((_, c) => c)
          .sort(
            (a, b) =>
              Number(demoCompounds[b]!.id === 'water-liquid') -
              Number(demoCompounds[a]!.id === 'water-liquid'),
          );
        for (const c of order) {
          const compound = demoCompounds[c]!;
          const outcome = ingest(lib, [files[c]!], {
            meta: {
              id: compound.id,
              name: `${compound.name} (synthetic)`,
              class: compound.class,
              technique: libraryBench!.technique,
              resolution: libraryBench!.resolution,
              synthetic: true,
            },
            force: true,
            message: 'cross-source synthetic bench',
          });
          if (outcome.failed.length > 0) throw new Error(`${compound.id}: ${outcome.failed[0]!.error}`);
        }
        const { source, scorer } = libraryMatchSource(lib, readSearchSet(lib), {});
        for (const [q, bench] of queryBenches.entries()) {
          for (const [c, spectrum] of queries[q]!.entries()) {
            if (spectrum === null) continue;
            const report = await runMatchPipeline(
              {
                unknown: {
                  file: `${demoCompounds[c]!.id}@${bench.name}`,
                  hash: '0'.repeat(64),
                  spectrum,
                  warnings: [],
                  resolution: bench.resolution,
                  ...(bench.technique === 'atr' ? { technique: 'atr' } : {}),
                },
                source,
                scorer,
                assignments: [],
              },
              { top: 5, likeWithLike: false },
            );
            // As runMatchPipeline does by default (and so `bandshelf match`): hits of another resolution compared
            // again at the coarser of the two; kept apart here to report the pipeline's own ranking beside it.
            const alike = await compareAtCoarserResolution({
              report,
              unknown: spectrum,
              resolution: bench.resolution,
              source,
            });
            const id = demoCompounds[c]!.id;
            record(`bandshelf:${name}`, bench.name, id, alike.report.hits[0]?.id);
            record(`pipeline-only:${name}`, bench.name, id, report.hits[0]?.id);
          }
        }
      } finally {
        closeLibrary(lib);
      }
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
  const percent = (t: { right: number; queries: number }) =>
    t.queries === 0 ? null : Math.round((1000 * t.right) / t.queries) / 10;
  const results = Object.fromEntries(
    methods.map((m) => {
      const all = Object.values(tallies[m]!).reduce(
        (a, t) => ({ right: a.right + t.right, queries: a.queries + t.queries }),
        { right: 0, queries: 0 },
      );
      return [
        m,
        {
          top1Percent: percent(all),
          ...all,
          byBench: Object.fromEntries(Object.entries(tallies[m]!).map(([b, t]) => [b, percent(t)])),
        },
      ];
    }),
  );
  return {
    about:
      'Top-1 identification across synthetic instruments: the invented demo compounds (src/demo/demoCompounds.ts) measured on synthetic benches (scripts/measureOnBench.ts); every spectrum is synthetic. Research use only: hits are candidates, not identifications.',
    libraryBench: libraryBench,
    queryBenches,
    compounds: demoCompounds.length,
    recipes,
    results,
    misses: missed,
  };
}

/**
 * Two of the targets on the demo compounds (synthetic): (1) each compound measured by ATR (the ATR bench's
 * weighting, line shape and spacing, no baseline, water or noise) and by transmission on the same bench otherwise,
 * both processed with the default recipe, the ATR one declared `technique: atr` as `match --technique atr` does:
 * Pearson r of the two processed vectors over the points both cover (target ≥ 0.98); (2) a tunable-laser cut of each
 * compound — the library bench's measurement cut to the 600 cm⁻¹ window centred on its strongest band (kept inside
 * 4000–600) — matched against the library of every compound on that bench: is its own entry first?
 */
async function targetsPart(): Promise<Record<string, unknown>> {
  const [libraryBench] = BENCHES;
  const atrBench = BENCHES.find((b) => b.technique === 'atr' && b.water === undefined)!;
  const clean = (b: Bench, technique: Bench['technique']): Bench => ({
    ...b,
    technique,
    baseline: { offset: 0, slope: 0, curvature: 0, scattering: 0 },
    noise: 0,
  });
  const recipe = recipeSchema.parse({});
  const grid = { start: 4000, stop: 600, step: 2 };
  const atr: { id: string; r: number; uncorrected: number }[] = [];
  for (const [c, compound] of demoCompounds.entries()) {
    const t = measureOnBench(compound.bands, clean(atrBench, 'transmission'), { seed: 7000 + c });
    const a = measureOnBench(compound.bands, clean(atrBench, 'atr'), { seed: 7000 + c });
    const pt = processSpectrum(t, recipe, grid).processed;
    const pa = processSpectrum(a, pinAtr(recipe, { technique: 'atr' }), grid).processed;
    const uncorrected = processSpectrum(a, recipe, grid).processed;
    atr.push({ id: compound.id, r: correlation(pt, pa), uncorrected: correlation(pt, uncorrected) });
  }
  const work = mkdtempSync(join(tmpdir(), 'bandshelf-cross-targets-'));
  const cuts: { id: string; window: string; top: string | undefined }[] = [];
  try {
    const lib = initLibrary(join(work, 'targets.sqlite'), { recipe: {}, name: 'cross-source targets' });
    try {
      const measured = demoCompounds.map((c, i) =>
        measureOnBench(c.bands, libraryBench!, { seed: 1000 + i }),
      );
      for (const [c, compound] of demoCompounds.entries()) {
        const path = join(work, `${compound.id}.csv`);
        writeFileSync(path, csvOf(measured[c]!));
        const outcome = ingest(lib, [path], {
          meta: {
            id: compound.id,
            name: `${compound.name} (synthetic)`,
            class: compound.class,
            technique: libraryBench!.technique,
            resolution: libraryBench!.resolution,
            synthetic: true,
          },
          force: true,
          message: 'cross-source targets',
        });
        if (outcome.failed.length > 0) throw new Error(`${compound.id}: ${outcome.failed[0]!.error}`);
      }
      const { source, scorer } = libraryMatchSource(lib, readSearchSet(lib), {});
      for (const [c, compound] of demoCompounds.entries()) {
        const strongest = [...compound.bands].sort((a, b) => b.height - a.height)[0]!.position;
        const lo = Math.min(Math.max(600, strongest - 300), 3400);
        const s = measured[c]!;
        const keep = Array.from(s.wavenumber.keys()).filter(
          (i) => s.wavenumber[i]! >= lo && s.wavenumber[i]! <= lo + 600,
        );
        const cut: Spectrum = {
          wavenumber: Float64Array.from(keep, (i) => s.wavenumber[i]!),
          absorbance: Float64Array.from(keep, (i) => s.absorbance[i]!),
        };
        const report = await runMatchPipeline(
          {
            unknown: {
              file: `${compound.id}-cut.csv`,
              hash: '0'.repeat(64),
              spectrum: cut,
              warnings: [],
              resolution: libraryBench!.resolution,
            },
            source,
            scorer,
            assignments: [],
          },
          { top: 3 },
        );
        cuts.push({ id: compound.id, window: `${lo + 600}–${lo}`, top: report.hits[0]?.id });
      }
    } finally {
      closeLibrary(lib);
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
  const rs = atr.map((a) => a.r);
  return {
    about:
      'Issue targets on the invented demo compounds (every spectrum synthetic). Research use only: hits are candidates, not identifications.',
    atrVsTransmission: {
      bench: atrBench.name,
      compounds: atr.length,
      atLeast098: rs.filter((r) => r >= 0.98).length,
      min: Math.round(1e4 * Math.min(...rs)) / 1e4,
      median: median(rs),
      uncorrectedMin: Math.round(1e4 * Math.min(...atr.map((a) => a.uncorrected))) / 1e4,
      below098: atr.filter((a) => a.r < 0.98),
    },
    tunableLaserCuts: {
      bench: libraryBench!.name,
      compounds: cuts.length,
      ownFirst: cuts.filter((c) => c.top === c.id).length,
      misses: cuts.filter((c) => c.top !== c.id),
    },
  };
}

async function main(): Promise<void> {
  const part = argument('part', 'both');
  const out: Record<string, unknown> = {};
  if (part === 'both' || part === 'real') out.real = await realPart();
  if (part === 'both' || part === 'synthetic') out.synthetic = await syntheticPart();
  if (part === 'both' || part === 'targets') out.targets = await targetsPart();
  process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
}

main().catch((error: unknown) => {
  process.stderr.write(`bench:cross-source: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
