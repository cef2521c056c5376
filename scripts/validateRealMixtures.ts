// The real part of `npm run validate`: mixture fits through the real match pipeline on the real files of ../shared.
//
// The files of ../shared/real-spectra (beside the checkout; never copied into it; see its PROVENANCE.md) are ingested
// into a temporary library with the default recipe. Two cases, both run through runMatchPipeline with the mixture on:
//   measured blends — the diesel/biodiesel series of one origin, measured at 0.25–7.5 % biodiesel: each blend is fitted
//                    with the 0 % and the 10 % blend in the library; by Beer–Lambert the blend is (1 − c/10) parts of
//                    the 0 % and c/10 parts of the 10 % (both are nearly all diesel, so those are also their shares of
//                    the signal, to within the 10 % blend's ester bands).
//   synthetic      — 1–3 of the library's real spectra (processed as the library stores them, each at unit area over
//                    the points all of them cover) at shares 1–60 %, plus a curved baseline and white noise at SNR
//                    100–1000, on the library's grid; the true share is taken over the points the fit used.
// Printed as the `real` part of validate's JSON: fits with a false candidate group, recall, share-interval coverage.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { seededRandom } from '../src/demo/seededRandom.js';
import { readSpectrumFile } from '../src/formats/readSpectrumFile.js';
import { ingest } from '../src/library/ingest/ingest.js';
import { closeLibrary } from '../src/library/store/closeLibrary.js';
import { initLibrary } from '../src/library/store/initLibrary.js';
import { readSearchSet } from '../src/library/store/readSearchSet.js';
import { libraryMatchSource } from '../src/match/libraryMatchSource.js';
import { runMatchPipeline } from '../src/match/pipeline/runMatchPipeline.js';
import type { MatchReport } from '../src/schema/matchReport.js';
import { gridAxis } from '../src/spectrum/gridAxis.js';
import type { Spectrum } from '../src/spectrum/types.js';

/** The measured series: file → biodiesel volume %, from the data set's own sample names (PROVENANCE.md). */
const BLENDS: Record<string, number> = {
  'text/plotftir_biodiesel_0_25.csv': 0.25,
  'text/plotftir_biodiesel_0_50.csv': 0.5,
  'text/plotftir_biodiesel_1_0.csv': 1,
  'text/plotftir_biodiesel_2_5.csv': 2.5,
  'text/plotftir_biodiesel_5_0.csv': 5,
  'text/plotftir_biodiesel_7_5.csv': 7.5,
};
const DIESEL = 'text/plotftir_biodiesel_0.csv';
const B10 = 'text/plotftir_biodiesel_10_0.csv';
/** One spectrum of each other substance (the cross-source bench's distractors and one of each of its sets). */
const OTHERS = [
  'jcamp/jtpolys.jdx',
  'text/chemospec_SrE_ET_pSrE.csv',
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

export interface ValidateRealMixturesOptions {
  /** Synthetic mixtures of real spectra. @default 40 */
  runs?: number;
  /** @default 1 */
  seed?: number;
}

function slug(file: string): string {
  return file
    .toLowerCase()
    .replace(/\.[a-z]+$/, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
}

/** ../shared/real-spectra beside the checkout (as CI places it) or beside the folder of worktrees; null if absent. */
function realSpectraFolder(): string | null {
  const found = [join('..', 'shared', 'real-spectra'), join('..', '..', 'shared', 'real-spectra')]
    .map((p) => resolve(process.cwd(), p))
    .find((p) => existsSync(join(p, 'PROVENANCE.md')));
  return found ?? null;
}

interface Tally {
  fits: number;
  fitsWithFalseGroup: number;
  fitsWithFalseComponent: number;
  trueComponents: number;
  recalled: number;
  detectable: number;
  detectableRecalled: number;
  shareIntervals: number;
  sharesCovered: number;
  shareErrors: number[];
}

const tally = (): Tally => ({
  fits: 0,
  fitsWithFalseGroup: 0,
  fitsWithFalseComponent: 0,
  trueComponents: 0,
  recalled: 0,
  detectable: 0,
  detectableRecalled: 0,
  shareIntervals: 0,
  sharesCovered: 0,
  shareErrors: [],
});

/**
 * Scores one report's mixture against the true shares (by entry id), given as a function of the fit's points (the
 * shares the fit reports are of the signal over those points).
 */
function scoreFit(
  t: Tally,
  report: MatchReport,
  truthOver: (fitPoints: readonly boolean[]) => ReadonlyMap<string, number>,
): void {
  const m = report.mixture;
  t.fits++;
  if (m === null) return;
  const truth = truthOver(m.residual.map((v) => v !== null));
  const found = m.components.filter((c) => c.significant);
  const extra = found.filter((c) => !truth.has(c.id));
  if (extra.length > 0) t.fitsWithFalseComponent++;
  if (extra.some((c) => ![c.id, ...(c.alternatives ?? [])].some((id) => truth.has(id))))
    t.fitsWithFalseGroup++;
  if (process.argv.includes('--details')) {
    const shown = m.components.map(
      (c) =>
        `${c.id} ${(100 * c.share).toFixed(2)} % [${(100 * c.shareInterval95[0]).toFixed(2)}, ${(100 * c.shareInterval95[1]).toFixed(2)}]` +
        `${truth.has(c.id) ? ` true ${(100 * truth.get(c.id)!).toFixed(2)}` : ' FALSE'}${c.significant ? '' : ' (n.s.)'}` +
        `${c.alternatives ? ` or ${c.alternatives.join('/')}` : ''}`,
    );
    const missed = [...truth.keys()].filter((id) => !m.components.some((c) => c.id === id));
    console.error(`real: ${shown.join('; ')}${missed.length > 0 ? ` | missed ${missed.join(', ')}` : ''}`);
  }
  const reported = [...truth].filter(([id]) => found.some((c) => c.id === id));
  const total = reported.reduce((s, [, x]) => s + x, 0);
  for (const [id, share] of truth) {
    t.trueComponents++;
    const c = found.find((x) => x.id === id);
    // Detectable: its share at least 3 × its detection limit (as a share) in this fit.
    const limit = (c ?? m.components.find((x) => x.id === id) ?? m.notSelected.find((x) => x.id === id))
      ?.detectionLimit.share;
    const detectable = limit !== undefined && share >= 3 * limit;
    if (detectable) t.detectable++;
    if (c === undefined) continue;
    t.recalled++;
    if (detectable) t.detectableRecalled++;
    const trueShare = share / total;
    t.shareIntervals++;
    if (trueShare >= c.shareInterval95[0] && trueShare <= c.shareInterval95[1]) t.sharesCovered++;
    t.shareErrors.push(c.share - trueShare);
  }
}

function summary(t: Tally) {
  const sorted = t.shareErrors.map(Math.abs).sort((a, b) => a - b);
  return {
    fits: t.fits,
    fitsWithAnyFalseCandidateGroup: t.fits > 0 ? t.fitsWithFalseGroup / t.fits : null,
    fitsWithAnyFalseComponent: t.fits > 0 ? t.fitsWithFalseComponent / t.fits : null,
    recallOfTrueComponents: t.trueComponents > 0 ? t.recalled / t.trueComponents : null,
    trueComponents: t.trueComponents,
    recallAt3xDetectionLimit: t.detectable > 0 ? t.detectableRecalled / t.detectable : null,
    trueComponentsAt3xDetectionLimit: t.detectable,
    shareInterval95Coverage: t.shareIntervals > 0 ? t.sharesCovered / t.shareIntervals : null,
    shareAbsoluteErrorMedian: sorted.length > 0 ? sorted[Math.floor(sorted.length / 2)]! : null,
  };
}

/**
 * Runs both real cases and returns their figures, or a note when ../shared/real-spectra is not beside the checkout.
 */
export async function validateRealMixtures(
  options: ValidateRealMixturesOptions = {},
): Promise<Record<string, unknown>> {
  const runs = options.runs ?? 40;
  const random = seededRandom(options.seed ?? 1);
  const data = realSpectraFolder();
  if (data === null) return { skipped: 'no ../shared/real-spectra beside the checkout' };
  const libraryFiles = [DIESEL, B10, ...OTHERS];
  const work = mkdtempSync(join(tmpdir(), 'bandshelf-validate-real-'));
  const library = initLibrary(join(work, 'real.sqlite'), { name: 'validate (real spectra)' });
  try {
    for (const f of libraryFiles) {
      const outcome = ingest(library, [join(data, f)], {
        meta: { id: slug(f), name: f },
        force: true,
        message: 'validate',
      });
      if (outcome.failed.length > 0) throw new Error(`${f}: ${outcome.failed[0]!.error}`);
    }
    const { source, scorer } = libraryMatchSource(library, readSearchSet(library), {});
    const matchMixture = (spectrum: Spectrum, file: string) =>
      runMatchPipeline(
        { unknown: { file, hash: '0'.repeat(64), spectrum, warnings: [] }, source, scorer, assignments: [] },
        { mixture: true, top: libraryFiles.length, candidates: libraryFiles.length },
      );

    const measured = tally();
    const blends: Record<string, unknown>[] = [];
    for (const [file, percent] of Object.entries(BLENDS)) {
      const [first] = readSpectrumFile(new Uint8Array(readFileSync(join(data, file))), { file });
      const report = await matchMixture(first!.spectrum, file);
      const truth = new Map([
        [slug(DIESEL), 1 - percent / 10],
        [slug(B10), percent / 10],
      ]);
      scoreFit(measured, report, () => truth);
      const b10 = report.mixture?.components.find((c) => c.id === slug(B10));
      blends.push({
        percent,
        trueShareOfB10: percent / 10,
        share: b10?.share ?? 0,
        shareInterval95: b10?.shareInterval95 ?? null,
        significant: b10?.significant ?? false,
        components: report.mixture?.components.map((c) => c.id) ?? [],
      });
    }

    // Synthetic mixtures of the library's own processed vectors.
    const rows = source.entries.map((e, r) => ({
      id: e.id,
      vector: Float64Array.from(source.processed.subarray(r * source.cols, (r + 1) * source.cols)),
    }));
    const axis = gridAxis(source.grid);
    const synthetic = tally();
    for (let run = 0; run < runs; run++) {
      const count = 1 + Math.floor(random.uniform() * 3);
      const chosen = new Set<number>();
      while (chosen.size < count) chosen.add(Math.floor(random.uniform() * rows.length));
      const raw = new Map<number, number>();
      for (const r of chosen) raw.set(r, 10 ** (Math.log10(0.01) + random.uniform() * Math.log10(60)));
      const sum = [...raw.values()].reduce((s, x) => s + x, 0);
      const y = new Float64Array(axis.length);
      // The unknown covers what every chosen spectrum covers; each enters at unit area over those points, so the
      // shares are of the same signal the fit's shares are of.
      const covered = Uint8Array.from(axis, (_, i) =>
        [...raw.keys()].every((r) => Number.isFinite(rows[r]!.vector[i]!)) ? 1 : 0,
      );
      const unitArea = new Map<number, Float64Array>();
      for (const [r, x] of raw) {
        const v = rows[r]!.vector;
        let area = 0;
        for (let i = 0; i < v.length; i++) if (covered[i] === 1) area += Math.abs(v[i]!);
        unitArea.set(
          r,
          Float64Array.from(v, (value, i) => (covered[i] === 1 ? value / area : 0)),
        );
        for (let i = 0; i < y.length; i++) if (covered[i] === 1) y[i] = y[i]! + ((x / sum) * v[i]!) / area;
      }
      // Each chosen spectrum's share of the mixture's signal over the points the fit used.
      const truthOver = (fitPoints: readonly boolean[]) => {
        const part = new Map<string, number>();
        for (const [r, x] of raw) {
          let area = 0;
          unitArea.get(r)!.forEach((value, i) => {
            if (fitPoints[i]) area += Math.abs(value);
          });
          part.set(rows[r]!.id, (x / sum) * area);
        }
        const total = [...part.values()].reduce((a, b) => a + b, 0);
        return new Map([...part].map(([id, a]) => [id, a / total]));
      };
      const peak = y.reduce((m, v, i) => (covered[i] ? Math.max(m, v) : m), 0);
      const sigma = peak / 10 ** (2 + random.uniform());
      const c = [0, 1, 2].map(() => (random.uniform() - 0.5) * 0.05 * peak);
      const at = Array.from(axis.keys()).filter((i) => covered[i] === 1);
      const spectrum: Spectrum = {
        wavenumber: Float64Array.from(at, (i) => axis[i]!),
        absorbance: Float64Array.from(at, (i) => {
          const u = (axis[i]! - 2300) / 1700;
          return y[i]! + c[0]! + c[1]! * u + c[2]! * u * u + sigma * random.normal();
        }),
      };
      scoreFit(synthetic, await matchMixture(spectrum, `synthetic-${run}`), truthOver);
    }
    return {
      data: 'real-spectra (see its PROVENANCE.md)',
      libraryEntries: libraryFiles.length,
      measuredBlends: { ...summary(measured), blends },
      synthetic: summary(synthetic),
    };
  } finally {
    closeLibrary(library);
    rmSync(work, { recursive: true, force: true });
  }
}
