// Every CLI command, in the order `bandshelf --help` lists them. Add one import and one array entry per command.
import type { CommandSpec } from '../command.js';

export const commands: CommandSpec[] = [];
