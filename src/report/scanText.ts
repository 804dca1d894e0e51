/**
 * The readable summary printed by `seedsift scan`: a configs x seeds grid, metrics with their goals
 * and step ranges, tick metrics, runs that are not ok, and problems grouped by code with counts
 * and the first few places. Plain text, fixed-width, no colour (it goes to logs as often as to
 * terminals).
 */
import type { Inventory } from '../analysis/inventory.js';
import { naturalCompare } from '../analysis/inventory.js';
import type { FileRecord, RunSet, TickDump } from '../ingest/types.js';
import type { Problem } from '../problems.js';

const STATUS_MARK = { ok: 'o', diverged: 'D', short: 'S', rejected: 'x' } as const;
const PLACES_SHOWN = 3;

/** Render the scan summary. */
export function scanText(runSet: RunSet, inv: Inventory): string {
  const out: string[] = [];
  const read = runSet.files.filter((f) => f.status === 'read').length;
  out.push(
    `${inv.runs.length} runs in ${inv.configs.length} configs (keys: ${runSet.keys.join(', ') || 'none'}); ${read} of ${runSet.files.length} files read`,
  );
  out.push(
    '',
    ...grid(inv),
    '',
    ...metricLines(inv),
    ...tickDumpLines(runSet.tickDumps),
    ...runLines(inv),
    ...fileLines(runSet.files),
    '',
    ...problemLines(runSet.problems),
  );
  return `${out.join('\n')}\n`;
}

function table(rows: readonly (readonly string[])[]): string[] {
  const widths: number[] = [];
  for (const row of rows) row.forEach((cell, i) => (widths[i] = Math.max(widths[i] ?? 0, cell.length)));
  return rows.map(
    (row) =>
      '  ' +
      row
        .map((cell, i) => (i === row.length - 1 ? cell : cell.padEnd(widths[i] ?? 0)))
        .join('  ')
        .trimEnd(),
  );
}

function grid(inv: Inventory): string[] {
  const seeds = [...new Set(inv.runs.map((r) => r.seed))].sort(naturalCompare);
  const status = new Map(inv.runs.map((r) => [`${r.config}\u0000${r.seed}`, r.status]));
  const rows = [['config', ...seeds.map((s) => `seed ${s}`)]];
  for (const c of inv.configs) {
    rows.push([
      c.id || '(no config keys)',
      ...seeds.map((s) => {
        const st = status.get(`${c.id}\u0000${s}`);
        return st === undefined ? '.' : STATUS_MARK[st];
      }),
    ]);
  }
  return [`Configs x seeds (o ok, D diverged, S short, x rejected, . none):`, ...table(rows)];
}

function metricLines(inv: Inventory): string[] {
  const range = (a: number | null, b: number | null): string => (a === null || b === null ? '-' : `${a}..${b}`);
  const scalar = inv.metrics.filter((m) => m.kind === 'scalar');
  const ticked = inv.metrics.filter((m) => m.kind === 'tick');
  const out = ['Metrics (goal: max = higher is better):'];
  out.push(
    ...table([
      ['name', 'goal', 'steps'],
      ...scalar.map((m) => [
        m.name,
        m.goal === null
          ? 'unknown (say --metric)'
          : `${m.goal}${m.goalSource === 'inferred' ? ' (guessed from the name)' : ''}`,
        range(m.firstStep, m.lastStep),
      ]),
    ]),
  );
  if (ticked.length > 0) {
    out.push('', 'Tick metrics (one value per internal tick):');
    out.push(
      ...table([
        ['name', 'ticks', 'goal', 'steps'],
        ...ticked.map((m) => [m.name, String(m.ticks), m.goal ?? 'unknown', range(m.firstStep, m.lastStep)]),
      ]),
    );
  }
  return out;
}

function tickDumpLines(dumps: readonly TickDump[]): string[] {
  if (dumps.length === 0) return [];
  const byConfig = new Map<string, TickDump[]>();
  for (const d of dumps) byConfig.set(d.config, [...(byConfig.get(d.config) ?? []), d]);
  return [
    '',
    'Per-sample tick dumps:',
    ...table([
      ['config', 'runs', 'samples', 'ticks'],
      ...[...byConfig].map(([c, ds]) => [c, String(ds.length), String(ds[0]?.samples ?? 0), String(ds[0]?.ticks ?? 0)]),
    ]),
  ];
}

function runLines(inv: Inventory): string[] {
  const odd = inv.runs.filter((r) => r.status !== 'ok');
  if (odd.length === 0) return [];
  return [
    '',
    'Runs not ok:',
    ...table(
      odd.map((r) => [
        r.id,
        r.status === 'diverged' ? `diverged at step ${r.divergedAt}` : `${r.status}, last step ${r.lastStep}`,
      ]),
    ),
  ];
}

function fileLines(files: readonly FileRecord[]): string[] {
  const notRead = files.filter((f) => f.status !== 'read');
  if (notRead.length === 0) return [];
  return ['', 'Files not used:', ...table(notRead.map((f) => [f.file, f.status]))];
}

function place(p: Problem): string {
  const where = p.file === undefined ? (p.run ?? '') : `${p.file}${p.line === undefined ? '' : `:${p.line}`}`;
  return where === '' ? p.message : `${where}: ${p.message}`;
}

function problemLines(problems: readonly Problem[]): string[] {
  if (problems.length === 0) return ['No problems found.'];
  const byCode = new Map<string, Problem[]>();
  for (const p of problems) byCode.set(p.code, [...(byCode.get(p.code) ?? []), p]);
  const order = { error: 0, warning: 1, note: 2 } as const;
  const groups = [...byCode.values()].sort((a, b) => order[a[0]!.severity] - order[b[0]!.severity]);
  const out = [`Problems (${problems.length}):`];
  for (const group of groups) {
    const first = group[0]!;
    out.push(`  ${first.severity} ${first.code} x${group.length}`);
    for (const p of group.slice(0, PLACES_SHOWN)) out.push(`    ${place(p)}`);
    if (group.length > PLACES_SHOWN) out.push(`    ... and ${group.length - PLACES_SHOWN} more (see --json)`);
  }
  return out;
}
