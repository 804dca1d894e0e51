/** `seedsift notebook new FILE`: copy the default notebook for editing. */
import { existsSync, readFileSync } from 'node:fs';
import { Command } from 'commander';
import { SeedsiftError } from '../problems.js';
import { DEFAULT_NOTEBOOK } from '../report/templatePaths.js';
import type { Io } from './io.js';
import { writeOutput } from './writeOutput.js';

export function notebookCommand(io: Io, done: (code: number) => void): Command {
  const notebook = new Command('notebook').description('work with report notebooks (Markdown with Handlebars cells)');
  notebook
    .command('new')
    .description('copy the default notebook to FILE, to edit and render with seedsift report --notebook FILE')
    .argument('<file>', 'where to write the notebook')
    .option('--force', 'overwrite FILE if it exists')
    .action((file: string, opts: { force?: boolean }) => {
      if (existsSync(file) && opts.force !== true) {
        throw new SeedsiftError('usage', `notebook new: ${file} exists; choose another name or add --force`);
      }
      writeOutput(file, readFileSync(DEFAULT_NOTEBOOK, 'utf8'), []);
      io.stdout(`wrote ${file}; render it with: seedsift report PATH... --notebook ${file}\n`);
      done(0);
    });
  return notebook;
}
