// Types of the WAT compiler script, for the test that checks the committed module bytes are current.

export interface ScoreKernelVariants {
  plain: string;
  shared: string;
}

export function compileScoreKernels(): Promise<ScoreKernelVariants>;
export function scoreKernelsModuleText(variants: ScoreKernelVariants): string;
