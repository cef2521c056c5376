// The CLI entry point: the only place that prints, draws progress or decides the exit code.
import { Command, CommanderError } from 'commander';
import { BandshelfError, errorLine } from '../error.js';
import { damagedLibraryAdvice } from '../library/store/damagedLibraryAdvice.js';
import type { CommandContext, CommandResult, CommandSpec } from './command.js';
import { commands } from './commands/index.js';
import { drawProgress } from './drawProgress.js';

const CAUTION =
  'Research use only: matches are candidates, not identifications. Confirm by orthogonal methods; bandshelf is not a diagnostic device.';

function buildProgram(
  specs: CommandSpec[],
  context: CommandContext,
  done: (r: CommandResult) => void,
): Command {
  const program = new Command('bandshelf')
    .description(`Versioned mid-infrared reference library, matcher and static site.\n${CAUTION}`)
    .exitOverride()
    .configureOutput({
      writeOut: (s) => process.stdout.write(s),
      writeErr: (s) => process.stderr.write(s),
      // Usage errors (unknown option, missing argument) get the same one-line shape as every other failure.
      outputError: (s, write) => write(`bandshelf: ${s.replace(/^error: /, '')}`),
    })
    .showHelpAfterError(false);
  for (const spec of specs) {
    const sub = program.command(spec.name).description(spec.summary).exitOverride();
    spec.configure(sub);
    sub.addHelpText('after', `\nExample:\n${spec.example.replace(/^/gm, '  ')}\n`);
    sub.action(async (...received: unknown[]) => {
      // commander passes positional args, then the options object, then the command itself.
      const positional = received.slice(0, -2);
      const options = (received.at(-2) ?? {}) as Record<string, unknown>;
      done(await spec.run(positional, options, context));
    });
  }
  return program;
}

let closedOutputHandled = false;

/**
 * A reader that closed the pipe (`| head`) wants no more output: end quietly with the status the command had. Installed
 * once per process (the demo calls `main` many times in one process).
 */
function quietOnClosedOutput(): void {
  if (closedOutputHandled) return;
  closedOutputHandled = true;
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}

/** Runs the CLI with `argv` (without node and script) and returns the exit code. */
export async function main(argv: string[]): Promise<number> {
  quietOnClosedOutput();
  const progress = drawProgress(process.stderr);
  const context: CommandContext = {
    stderrIsTTY: Boolean(process.stderr.isTTY),
    progress: progress.update,
    cwd: process.cwd(),
  };
  let result: CommandResult | undefined;
  const program = buildProgram(commands, context, (r) => {
    result = r;
  });
  try {
    await program.parseAsync(argv, { from: 'user' });
  } catch (error) {
    progress.stop();
    if (error instanceof CommanderError) {
      // Help and version output are not failures; commander has already printed its message.
      return error.exitCode === 0 || error.code === 'commander.helpDisplayed' ? 0 : 2;
    }
    if (error instanceof BandshelfError) {
      process.stderr.write(`bandshelf: ${error.oneLine()}\n`);
      return error.code === 'BAD_OPTION' ? 2 : 1;
    }
    const message = error instanceof Error ? error.message : String(error);
    const sqlite = String((error as { code?: unknown }).code ?? '');
    // SQLite's own words for a damaged file (bytes flipped on disk, a truncated copy): name the file and the cure.
    if (/^SQLITE_(CORRUPT|NOTADB)/.test(sqlite) || /malformed/i.test(message)) {
      const at = argv.indexOf('--library');
      const file = at >= 0 ? argv[at + 1] : 'bandshelf.sqlite';
      const damaged = new BandshelfError('DAMAGED_LIBRARY', damagedLibraryAdvice(message.split('\n')[0]!), {
        file,
      });
      process.stderr.write(`bandshelf: ${damaged.oneLine()}\n`);
      return 1;
    }
    process.stderr.write(`bandshelf: ${errorLine(error)}\n`);
    if (process.env.BANDSHELF_DEBUG && error instanceof Error) process.stderr.write(`${error.stack}\n`);
    return 70;
  }
  progress.stop();
  if (result === undefined) return 0;
  if (result.stderr)
    process.stderr.write(result.stderr.endsWith('\n') ? result.stderr : `${result.stderr}\n`);
  if (result.stdout) {
    process.exitCode = result.exitCode;
    await new Promise<void>((resolve) => {
      process.stdout.write(result!.stdout.endsWith('\n') ? result!.stdout : `${result!.stdout}\n`, () =>
        resolve(),
      );
    });
  }
  return result.exitCode;
}
