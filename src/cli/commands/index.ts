// Every CLI command, in the order `bandshelf --help` lists them. Add one import and one array entry per command.
import type { CommandSpec } from '../command.js';
import { addCommand } from './add.js';
import { initCommand } from './init.js';
import { listCommand } from './list.js';
import { showCommand } from './show.js';

export const commands: CommandSpec[] = [initCommand, addCommand, listCommand, showCommand];
