// The package's public API: the functions and schemas a script may build on; the CLI is a thin shell over these.

export { BandshelfError, type BandshelfErrorDetails, type ErrorCode } from './error.js';
export { readDelimited } from './formats/readDelimited.js';
export { readJcampDx } from './formats/readJcampDx.js';
export { readManifest } from './formats/readManifest.js';
export { readSidecar } from './formats/readSidecar.js';
export { readSpectrumFile } from './formats/readSpectrumFile.js';
export { readTimeTrace } from './formats/readTimeTrace.js';
export { sidecarNameFor } from './formats/sidecarNameFor.js';
export type * from './formats/types.js';
export { writeCsv } from './formats/writeCsv.js';
export { writeJcampDx } from './formats/writeJcampDx.js';
export { type IngestOptions, type IngestOutcome, ingest } from './library/ingest/ingest.js';
export { addAssignments } from './library/store/addAssignments.js';
export { checkLibrary } from './library/store/checkLibrary.js';
export { closeLibrary } from './library/store/closeLibrary.js';
export { createRelease } from './library/store/createRelease.js';
export { diffStates } from './library/store/diffStates.js';
export { editEntry } from './library/store/editEntry.js';
export { entryHistory } from './library/store/entryHistory.js';
export { exportAll } from './library/store/exportAll.js';
export { exportBundle } from './library/store/exportBundle.js';
export { importBundle } from './library/store/importBundle.js';
export { importBundleFile } from './library/store/importBundleFile.js';
export { initLibrary } from './library/store/initLibrary.js';
export { listAssignments } from './library/store/listAssignments.js';
export { listEntries } from './library/store/listEntries.js';
export { listReleases } from './library/store/listReleases.js';
export { openLibrary } from './library/store/openLibrary.js';
export { readBundleFile } from './library/store/readBundleFile.js';
export { readEntry } from './library/store/readEntry.js';
export { readRelease } from './library/store/readRelease.js';
export { readSearchSet } from './library/store/readSearchSet.js';
export { retireEntry } from './library/store/retireEntry.js';
export { reviewRevision } from './library/store/reviewRevision.js';
export { writeBundleFile } from './library/store/writeBundleFile.js';
export type * from './library/types.js';
export { buildBandIndex } from './match/buildBandIndex.js';
export { buildMatchReport } from './match/buildMatchReport.js';
export {
  type ContrastGroup,
  type ContrastGroupsOptions,
  type ContrastInput,
  type ContrastSpectrum,
  contrastGroups,
} from './match/contrast/contrastGroups.js';
export { cosineScores } from './match/cosineScores.js';
export { euclideanScores } from './match/euclideanScores.js';
export { fitMixture } from './match/fitMixture.js';
export { identifyBands } from './match/identifyBands.js';
export { libraryMatchSource } from './match/libraryMatchSource.js';
export { libraryNearDuplicateIndex } from './match/libraryNearDuplicateIndex.js';
export { nnls } from './match/nnls.js';
export { pearsonScores } from './match/pearsonScores.js';
export { type RunMatchPipelineOptions, runMatchPipeline } from './match/pipeline/runMatchPipeline.js';
export type {
  EntryOriginal,
  MatchPipelineInput,
  MatchScorer,
  MatchSource,
  MatchUnknown,
} from './match/pipeline/types.js';
export { searchBands } from './match/searchBands.js';
export { searchBandsOfSpectrum } from './match/searchBandsOfSpectrum.js';
export { searchLibrary } from './match/searchLibrary.js';
export { searchSpectra } from './match/searchSpectra.js';
export { shippedAssignments } from './match/shippedAssignments.js';
export { topK } from './match/topK.js';
export { type BandAssignment, bandAssignmentSchema } from './schema/bandAssignment.js';
export { type Bundle, bundleSchema } from './schema/bundle.js';
export { casCheckDigitValid } from './schema/casCheckDigitValid.js';
export { CONTRAST_CAUTION, type ContrastReport, contrastReportSchema } from './schema/contrastReport.js';
export { MATCH_CAUTION, type MatchReport, matchReportSchema } from './schema/matchReport.js';
export { type EntryMeta, type EntryMetaInput, entryMetaPatchSchema, entryMetaSchema } from './schema/meta.js';
export { type Grid, gridSchema, type Recipe, type RecipeInput, recipeSchema } from './schema/recipe.js';
export { buildSite } from './site/buildSite.js';
export { airplsBaseline } from './spectrum/airplsBaseline.js';
export { alsBaseline } from './spectrum/alsBaseline.js';
export { correlation } from './spectrum/correlation.js';
export { cropToWindow } from './spectrum/cropToWindow.js';
export { emscCorrect } from './spectrum/emscCorrect.js';
export { excludeWindows } from './spectrum/excludeWindows.js';
export { findPeaks } from './spectrum/findPeaks.js';
export { findShoulders } from './spectrum/findShoulders.js';
export { gridAxis } from './spectrum/gridAxis.js';
export { gridLength } from './spectrum/gridLength.js';
export { noiseLevel } from './spectrum/noiseLevel.js';
export { normaliseVector } from './spectrum/normaliseVector.js';
export { processSpectrum } from './spectrum/processSpectrum.js';
export { qcFlags } from './spectrum/qcFlags.js';
export { resampleToGrid } from './spectrum/resampleToGrid.js';
export { rubberbandBaseline } from './spectrum/rubberbandBaseline.js';
export { savitzkyGolay } from './spectrum/savitzkyGolay.js';
export { savitzkyGolayCoefficients } from './spectrum/savitzkyGolayCoefficients.js';
export { sortAndMerge } from './spectrum/sortAndMerge.js';
export { subtractBaseline } from './spectrum/subtractBaseline.js';
export { subtractReference } from './spectrum/subtractReference.js';
export { alignTraces } from './spectrum/trace/alignTraces.js';
export { averageTraces } from './spectrum/trace/averageTraces.js';
export { traceToSpectrum } from './spectrum/trace/traceToSpectrum.js';
export type * from './spectrum/trace/types.js';
export { wavenumberFromTerahertz } from './spectrum/trace/wavenumberFromTerahertz.js';
export type * from './spectrum/types.js';
export { absorbanceFromPercentTransmittance } from './spectrum/units/absorbanceFromPercentTransmittance.js';
export { absorbanceFromTransmittance } from './spectrum/units/absorbanceFromTransmittance.js';
export { wavenumberFromMicrometres } from './spectrum/units/wavenumberFromMicrometres.js';
export { wavenumberFromNanometres } from './spectrum/units/wavenumberFromNanometres.js';
