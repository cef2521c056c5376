// `npm run demo`: builds a library from the synthetic demo collection, matches the demo unknowns and builds the site.
import { existsSync, mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { main } from '../src/cli/main.js';
import { demoCohortFiles } from '../src/demo/demoCohortFiles.js';

const OUT = resolve('demo-out');
const LIBRARY = join(OUT, 'bandshelf.sqlite');
const REPORTS = join(OUT, 'reports');
const SITE = join(OUT, 'site');
const COHORT = join(OUT, 'cohort');

async function step(title: string, argv: string[]): Promise<void> {
  process.stdout.write(`\n== ${title}\n$ bandshelf ${argv.join(' ')}\n`);
  const code = await main(argv);
  if (code !== 0) {
    process.stderr.write(`demo: step "${title}" failed with exit code ${code}\n`);
    process.exit(code);
  }
}

async function runDemo(): Promise<void> {
  // demo-out/ is the demo's own folder: it is rebuilt from scratch on every run.
  rmSync(OUT, { recursive: true, force: true });
  mkdirSync(REPORTS, { recursive: true });
  const lib = ['--library', LIBRARY];
  await step('Create the library (grid 4000–600 cm⁻¹ at 2 cm⁻¹)', ['init', ...lib]);
  await step('Ingest the synthetic demo collection', [
    'add',
    'library',
    ...lib,
    '--message',
    'demo collection',
  ]);
  await step('Freeze a release', ['release', 'demo-2026.12', ...lib, '--message', 'first demo release']);
  await step('Check the library of record', ['check', ...lib]);
  const unknowns = readdirSync('library/unknowns')
    .filter((f) => /\.(csv|jdx)$/.test(f))
    .sort();
  for (const file of unknowns) {
    await step(`Match ${file}`, [
      'match',
      join('library/unknowns', file),
      ...lib,
      '--mixture',
      '--report',
      REPORTS,
    ]);
  }
  await step('Identify the bands of the serum film', [
    'identify',
    'library/unknowns/u03-serum-film.csv',
    ...lib,
    '--report',
    REPORTS,
  ]);
  await step('Band-position search: amide I, amide II, PO₂⁻ asymmetric', [
    'bands',
    '1652',
    '1545',
    '1240',
    ...lib,
  ]);
  await step('Compare two entries: the correlation matrix and an overlay plot', [
    'compare',
    'albumin-human',
    'igg-human',
    ...lib,
    '--plot',
    join(OUT, 'albumin-vs-igg.svg'),
  ]);
  for (const [name, text] of demoCohortFiles()) {
    mkdirSync(dirname(join(COHORT, name)), { recursive: true });
    writeFileSync(join(COHORT, name), text);
  }
  await step('Contrast a synthetic cohort: 20 serum films with more lipid against 20 without', [
    'contrast',
    '--group-a',
    join(COHORT, 'cases'),
    '--group-b',
    join(COHORT, 'controls'),
    ...lib,
    '--report',
    REPORTS,
  ]);
  await step('Share the library with its history: a bundle, imported into a new library, then checked', [
    'export',
    '--bundle',
    join(OUT, 'demo.bundle'),
    ...lib,
    '--force',
  ]);
  await step('Import the bundle into a new library', [
    'import',
    join(OUT, 'demo.bundle'),
    '--library',
    join(OUT, 'imported.sqlite'),
  ]);
  await step('Check the imported library', ['check', '--library', join(OUT, 'imported.sqlite')]);
  await step('Build the static site', ['site', ...lib, '--reports', REPORTS, '--out', SITE, '--clean']);
  if (existsSync(SITE)) {
    process.stdout.write(
      `\nThe site is in ${SITE}. Serve it on this machine only, e.g.\n` +
        `  npx @11ty/eleventy-dev-server --dir=${SITE} --port=8080   (then open http://127.0.0.1:8080/)\n` +
        `  python3 -m http.server --directory ${SITE} --bind 127.0.0.1 8080\n`,
    );
  }
  process.stdout.write(
    '\nResearch use only: matches are candidates, not identifications. Confirm by orthogonal methods and defer to local regulations and licensed clinical practice.\n',
  );
}

await runDemo();
