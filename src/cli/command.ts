// The shape every CLI command file exports: commands compute and return, only the entry point prints or exits.
import type { Command } from 'commander';

export interface CommandResult {
  /** What goes to standard output (with `--json`: exactly one JSON document). */
  stdout: string;
  /** Warnings and notes for standard error. */
  stderr?: string;
  exitCode: number;
}

export interface CommandContext {
  /** True when standard error is a terminal: progress bars only then. */
  stderrIsTTY: boolean;
  /** Report progress of a long job; the entry point draws it (or not). */
  progress: (done: number, total: number, label: string) => void;
  /** The working directory relative paths are read against. */
  cwd: string;
}

export interface CommandSpec {
  name: string;
  /** One line for `bandshelf --help`. */
  summary: string;
  /** A worked example printed by `bandshelf NAME --help`. */
  example: string;
  /** Declare arguments and options on the commander command (name is already set). */
  configure: (command: Command) => void;
  /** `args` are commander's positional arguments, `options` its parsed options. */
  run: (args: unknown[], options: Record<string, unknown>, context: CommandContext) => Promise<CommandResult>;
}
