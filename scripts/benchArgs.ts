// The flags the scale benchmarks share: `--entries N`, `--batch N` and `--quiet`.

export interface BenchArgs {
  entries: number;
  batch: number;
  quiet: boolean;
}

export function benchArgs(argv: readonly string[], defaults: { entries: number; batch: number }): BenchArgs {
  const out: BenchArgs = { ...defaults, quiet: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const [flag, inline] = a.includes('=') ? a.split('=', 2) : [a, undefined];
    if (flag === '--quiet') out.quiet = true;
    else if (flag === '--entries' || flag === '--batch') {
      const value = Number(inline ?? argv[++i]);
      if (!Number.isInteger(value) || value < 1) {
        process.stderr.write(`bench: ${flag} must be a whole number ≥ 1\n`);
        process.exit(2);
      }
      out[flag === '--entries' ? 'entries' : 'batch'] = value;
    } else {
      process.stderr.write(`bench: unknown argument ${a}\n`);
      process.exit(2);
    }
  }
  return out;
}
