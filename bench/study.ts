/**
 * `npm run bench:study -- tasks|sweep [--out DIR] [--report]`: write one of the study-scale test
 * studies of `tests/support/studyGenerator.ts` (100 puzzles x 5 methods x 3 seeds, or 168 configs x
 * 10 seeds) and, with `--report`, time `seedsift report` on it under GNU time and print the sizes of
 * report.html, summary.md and results.json.
 */
import { statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { SWEEP_STUDY, TASKS_STUDY, writeStudy, type StudySpec } from '../tests/support/studyGenerator.js';
import { timedRun } from './timedRun.js';

const ROOT = fileURLToPath(new URL('..', import.meta.url));

/** Each study with the report options that fit it. */
export const STUDIES: Readonly<Record<string, { readonly spec: StudySpec; readonly args: readonly string[] }>> = {
  tasks: { spec: TASKS_STUDY, args: ['--baseline', 'method=base', '--task-key', 'task'] },
  sweep: { spec: SWEEP_STUDY, args: ['--baseline', 'ticks=8,memory=4,width=128'] },
};

function main(argv: readonly string[]): void {
  const { values, positionals } = parseArgs({
    args: [...argv],
    allowPositionals: true,
    options: { out: { type: 'string' }, report: { type: 'boolean', default: false } },
  });
  const name = positionals[0] ?? 'tasks';
  const study = STUDIES[name];
  if (study === undefined)
    throw new Error(`unknown study '${name}'; the studies are ${Object.keys(STUDIES).join(', ')}`);
  const dir = resolve(values.out ?? join(ROOT, 'bench', '.data', `study-${name}`));
  const files = writeStudy(dir, study.spec);
  process.stdout.write(`wrote ${files} runs to ${dir}\n`);
  if (!values.report) return;
  const out = (file: string): string => join(dir, '..', `study-${name}.${file}`);
  const m = timedRun(
    process.execPath,
    [
      join(ROOT, 'src', 'cli', 'seedsift.js'),
      'report',
      dir,
      ...study.args,
      '-o',
      out('html'),
      '--json',
      out('json'),
      '--markdown',
      out('md'),
      '--quiet',
    ],
    ROOT,
  );
  const size = (f: string): string => `${(statSync(f).size / 1e6).toFixed(2)} MB`;
  process.stdout.write(
    `report: ${m.wallSeconds.toFixed(1)} s wall, ${m.cpuSeconds.toFixed(1)} s CPU, peak ${m.peakMiB.toFixed(0)} MiB\n` +
      `report.html ${size(out('html'))}, summary.md ${size(out('md'))}, results.json ${size(out('json'))}\n`,
  );
}

main(process.argv.slice(2));
