// The page model of one contrast report: groups, method, the difference bands, the band-level test and the plots.
import { gridAxis } from '../spectrum/gridAxis.js';
import { formatNumber } from './formatNumber.js';
import { jsonForScript } from './jsonForScript.js';
import type { ContrastPage, ContrastPlotData, SiteContrast } from './types.js';

export interface ContrastPageOptions {
  /** The page's folder name under contrasts/.
   * @default the report's slug */
  slug?: string;
}

const range = (max: number, min: number) =>
  `${formatNumber(max, { decimals: 0 })}–${formatNumber(min, { decimals: 0 })} cm⁻¹`;
/** p- and q-values below 0.0001 print as such (their digits beyond that carry no meaning here). */
const probability = (v: number) => (v < 1e-4 ? '< 0.0001' : formatNumber(v, { significant: 2 }));
const interval = (lower: number, upper: number) => `${formatNumber(lower)} … ${formatNumber(upper)}`;

export function contrastPage(contrast: SiteContrast, options: ContrastPageOptions = {}): ContrastPage {
  const { report } = contrast;
  const slug = options.slug ?? contrast.slug;
  const { a, b } = report.groups;
  const passing = report.bandTests.filter((t) => t.significant);
  const plot: ContrastPlotData = {
    labelA: a.label,
    labelB: b.label,
    x: Array.from(gridAxis(report.grid)),
    meanA: a.mean,
    sdA: a.sd,
    meanB: b.mean,
    sdB: b.sd,
    difference: report.pointwise.difference,
    lower: report.pointwise.lower,
    upper: report.pointwise.upper,
    regions: report.bands.map((band) => ({ min: band.min, max: band.max, sign: band.sign })),
    windows: passing.map((t) => ({ min: t.min, max: t.max })),
  };
  const hitText = (hits: typeof report.search.higher) =>
    hits === null ? '–' : hits.map((h) => `${h.id} (r ${formatNumber(h.score, { decimals: 3 })})`).join(', ');
  return {
    slug,
    path: `contrasts/${slug}/`,
    file: contrast.file,
    title: `Contrast: ${a.label} vs ${b.label}`,
    summary:
      `${a.n} vs ${b.n} spectra; ${report.bands.length} difference band${report.bands.length === 1 ? '' : 's'}, ` +
      `${passing.length} of ${report.bandTests.length} band-level window${report.bandTests.length === 1 ? '' : 's'} at q ≤ ${report.settings.q}`,
    groups: [
      { label: a.label, value: `${a.n} of ${a.read} spectra in the statistics, ${a.outliers} outlier(s)` },
      { label: b.label, value: `${b.n} of ${b.read} spectra in the statistics, ${b.outliers} outlier(s)` },
      { label: 'created', value: report.created },
      {
        label: 'library',
        value:
          report.library === null
            ? 'none'
            : `${report.library.name}${report.library.release ? ` at ${report.library.release}` : ''}`,
      },
      { label: 'grid points tested', value: String(report.tested) },
    ],
    method: [
      { label: 'test', value: report.method.test },
      { label: 'assumptions', value: report.method.assumptions.join('; ') },
      { label: 'false-discovery rate', value: report.method.fdr },
      { label: 'interval', value: report.method.interval },
      { label: 'effect size', value: report.method.effectSize },
      { label: 'band level', value: report.method.bandTest },
      { label: 'outliers', value: report.method.outliers },
      { label: 'library search', value: report.method.search },
    ],
    bands: report.bands.map((band) => ({
      position: formatNumber(band.position, { decimals: 0 }),
      region: range(band.max, band.min),
      sign: `${band.sign} in ${a.label}`,
      difference: formatNumber(band.difference),
      interval: interval(band.lower, band.upper),
      g: formatNumber(band.g, { decimals: 2 }),
      q: probability(band.smallestQ),
      assignment:
        band.assignments[0] === undefined
          ? '–'
          : `${band.assignments[0].label} (${band.assignments[0].class.join(', ')})`,
      candidates: band.candidates.map((c) => c.id).join(', ') || '–',
    })),
    bandTests: report.bandTests.map((t) => ({
      window: range(t.max, t.min),
      centre: formatNumber(t.position, { decimals: 0 }),
      difference: formatNumber(t.difference),
      interval: interval(t.lower, t.upper),
      g: formatNumber(t.g, { decimals: 2 }),
      p: probability(t.p),
      q: probability(t.q),
      verdict: t.significant ? `${t.difference > 0 ? 'higher' : 'lower'} in ${a.label}` : '',
      assignment:
        t.assignments[0] === undefined
          ? '–'
          : `${t.assignments[0].label} (${t.assignments[0].class.join(', ')})`,
    })),
    outliers: report.spectra
      .filter((s) => s.outlier)
      .map(
        (s) =>
          `${s.file} (${s.group === 'a' ? a.label : b.label}, z ${formatNumber(s.robustZ, { decimals: 1 })}${s.dropped ? ', left out' : ''})`,
      ),
    hits: { higher: hitText(report.search.higher), lower: hitText(report.search.lower) },
    caution: report.caution,
    plotJson: jsonForScript(plot),
  };
}
