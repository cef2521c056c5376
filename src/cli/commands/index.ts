// Every CLI command, in the order `bandshelf --help` lists them. Add one import and one array entry per command.
import type { CommandSpec } from '../command.js';
import { addCommand } from './add.js';
import { assignmentsCommand } from './assignments.js';
import { backupCommand } from './backup.js';
import { bandsCommand } from './bands.js';
import { checkCommand } from './check.js';
import { compareCommand } from './compare.js';
import { contrastCommand } from './contrast.js';
import { diffCommand } from './diff.js';
import { editCommand } from './edit.js';
import { exportCommand } from './export.js';
import { historyCommand } from './history.js';
import { identifyCommand } from './identify.js';
import { importCommand } from './import.js';
import { initCommand } from './init.js';
import { listCommand } from './list.js';
import { matchCommand } from './match.js';
import { releaseCommand } from './release.js';
import { retireCommand } from './retire.js';
import { reviewCommand } from './review.js';
import { showCommand } from './show.js';
import { siteCommand } from './site.js';
import { subtractCommand } from './subtract.js';

export const commands: CommandSpec[] = [
  initCommand,
  addCommand,
  listCommand,
  showCommand,
  historyCommand,
  editCommand,
  retireCommand,
  reviewCommand,
  releaseCommand,
  diffCommand,
  checkCommand,
  backupCommand,
  exportCommand,
  importCommand,
  assignmentsCommand,
  matchCommand,
  bandsCommand,
  identifyCommand,
  compareCommand,
  contrastCommand,
  subtractCommand,
  siteCommand,
];
