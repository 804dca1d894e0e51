/**
 * The readable summary printed by `seedsift scan`: a configs x seeds grid, metrics with their goals
 * and step ranges, tick metrics, runs that are not ok, and problems grouped by code with counts
 * and the first few places. Plain text, fixed-width, no colour (it goes to logs as often as to
 * terminals). At scale it stays short: with more than `GRID_SEEDS` seed columns, or seeds read from
 * inside files, the grid becomes one line per config with counts by status (and at most
 * `GRID_CONFIGS` configs); files not used are grouped by status, reason and extension; and a
 * config key that looks like a task or evaluation set is pointed out for `--task-key`.
 */
import type { Inventory } from '../analysis/inventory.js';
import { naturalCompare } from '../analysis/inventory.js';
import type { FileRecord, RunSet, TickDump } from '../ingest/types.js';
import type { Problem } from '../problems.js';

const STATUS_MARK = { ok: 'o', diverged: 'D', short: 'S', rejected: 'x' } as const;
const PLACES_SHOWN = 3;
/** More seed columns than this (or seeds from inside files) collapse the grid. */
export const GRID_SEEDS = 20;
/** Configs listed in a collapsed grid before the rest are counted. */
export const GRID_CONFIGS = 40;
/** Key names that usually hold tasks or evaluation sets. */
const TASK_LIKE =
  /^(task|tasks|env|environment|game|dataset|data|benchmark|suite|problem|level|split|eval|domain)(_?name|_?id)?$/i;

/** Render the scan summary. */
export function scanText(runSet: RunSet, inv: Inventory): string {
  const out: string[] = [];
  const read = runSet.files.filter((f) => f.status === 'read').length;
  out.push(
    `${inv.runs.length} runs in ${inv.configs.length} configs ` +
      `(keys: ${runSet.keys.join(', ') || 'none'}); ${read} of ${runSet.files.length} files read`,
  );
  out.push(
    '',
    ...grid(inv, runSet),
    '',
    ...metricLines(inv),
    ...tickDumpLines(runSet.tickDumps),
    ...runLines(inv),
    ...fileLines(runSet.files, runSet.problems),
    ...taskKeyHint(runSet, inv),
    '',
    ...problemLines(runSet.problems),
  );
  return `${out.join('\n')}\n`;
}

function table(rows: readonly (readonly string[])[]): string[] {
  const widths: number[] = [];
  for (const row of rows) {
    for (const [i, cell] of row.entries()) widths[i] = Math.max(widths[i] ?? 0, cell.length);
  }
  return rows.map(
    (row) =>
      '  ' +
      row
        .map((cell, i) => (i === row.length - 1 ? cell : cell.padEnd(widths[i] ?? 0)))
        .join('  ')
        .trimEnd(),
  );
}

function grid(inv: Inventory, runSet: RunSet): string[] {
  const seeds = [...new Set(inv.runs.map((r) => r.seed))].sort(naturalCompare);
  const inside = runSet.runs.some((r) => r.identity === 'seed-column' || r.identity === 'seed-columns');
  if (seeds.length > GRID_SEEDS || inside) return collapsedGrid(inv, seeds.length, inside);
  const status = new Map(inv.runs.map((r) => [`${r.config}\u0000${r.seed}`, r.status]));
  const rows = [['config', ...seeds.map((s) => `seed ${s}`)]];
  const more = inv.configs.length - GRID_CONFIGS;
  for (const c of inv.configs.slice(0, GRID_CONFIGS)) {
    rows.push([
      c.id || '(no config keys)',
      ...seeds.map((s) => {
        const st = status.get(`${c.id}\u0000${s}`);
        return st === undefined ? '.' : STATUS_MARK[st];
      }),
    ]);
  }
  return [
    `Configs x seeds (o ok, D diverged, S short, x rejected, . none):`,
    ...table(rows),
    ...(more > 0 ? [`  ... and ${more} more configs (runs not ok are listed below; all in --json)`] : []),
  ];
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
  const shown = odd.slice(0, GRID_CONFIGS);
  return [
    '',
    `Runs not ok (${odd.length}):`,
    ...(odd.length > shown.length ? [`  (the first ${shown.length}; all in --json)`] : []),
    ...table(
      shown.map((r) => [
        r.id,
        r.status === 'diverged' ? `diverged at step ${r.divergedAt}` : `${r.status}, last step ${r.lastStep}`,
      ]),
    ),
  ];
}

/** One line per config: its runs counted by status. */
function collapsedGrid(inv: Inventory, seedCount: number, inside: boolean): string[] {
  const byConfig = new Map<string, Map<string, number>>();
  for (const r of inv.runs) {
    const counts = byConfig.get(r.config) ?? new Map<string, number>();
    counts.set(r.status, (counts.get(r.status) ?? 0) + 1);
    byConfig.set(r.config, counts);
  }
  const shown = inv.configs.slice(0, GRID_CONFIGS);
  const rows = [['config', 'runs', 'by status']];
  for (const c of shown) {
    const counts = byConfig.get(c.id) ?? new Map<string, number>();
    const total = [...counts.values()].reduce((a, b) => a + b, 0);
    rows.push([c.id || '(no config keys)', String(total), [...counts].map(([st, n]) => `${n} ${st}`).join(', ')]);
  }
  const why = inside ? 'seeds read from inside files' : `${seedCount} seeds`;
  const more = inv.configs.length - shown.length;
  return [
    `Configs (${why}; one line per config):`,
    ...table(rows),
    ...(more > 0 ? [`  ... and ${more} more configs (see --json)`] : []),
  ];
}

function extension(file: string): string {
  const base = file.slice(file.lastIndexOf('/') + 1);
  const m = /(\.[A-Za-z0-9]+(\.gz)?)$/.exec(base);
  return m?.[1] ?? '(none)';
}

/** Files not read, grouped by status and reason, then by extension, with a few examples each. */
function fileLines(files: readonly FileRecord[], problems: readonly Problem[]): string[] {
  const notRead = files.filter((f) => f.status !== 'read');
  if (notRead.length === 0) return [];
  const reasons = new Map<string, string>();
  for (const p of problems) if (p.file !== undefined && !reasons.has(p.file)) reasons.set(p.file, p.message);
  const groups = new Map<string, FileRecord[]>();
  for (const f of notRead) {
    const key = `${f.status}: ${reasons.get(f.file) ?? 'no reason recorded'}`;
    groups.set(key, [...(groups.get(key) ?? []), f]);
  }
  const out = ['', `Files not used (${notRead.length}):`];
  for (const [key, list] of groups) {
    const byExt = new Map<string, number>();
    for (const f of list) byExt.set(extension(f.file), (byExt.get(extension(f.file)) ?? 0) + 1);
    const exts = [...byExt].sort((a, b) => b[1] - a[1]).map(([e, n]) => `${e} ${n}`);
    out.push(`  ${key} x${list.length} (${exts.slice(0, 6).join(', ')}${exts.length > 6 ? ', ...' : ''})`);
    for (const f of list.slice(0, PLACES_SHOWN)) out.push(`    ${f.file}`);
    if (list.length > PLACES_SHOWN) out.push(`    ... and ${list.length - PLACES_SHOWN} more (see --json)`);
  }
  return out;
}

/** Keys whose name and values look like tasks or evaluation sets: a hint to report with --task-key. */
function taskKeyHint(runSet: RunSet, inv: Inventory): string[] {
  const out: string[] = [];
  for (const key of runSet.keys) {
    const values = new Set(inv.configs.map((c) => c.params[key]).filter((v) => v !== undefined));
    if (!TASK_LIKE.test(key) || values.size < 2) continue;
    out.push(
      `Key '${key}' (${values.size} values) looks like tasks or evaluation sets: report with --task-key ${key} ` +
        `to compare within each and aggregate across them.`,
    );
  }
  return out.length === 0 ? [] : ['', ...out];
}

function place(p: Problem): string {
  const where = p.file === undefined ? (p.run ?? '') : `${p.file}${p.line === undefined ? '' : `:${p.line}`}`;
  return where === '' ? p.message : `${where}: ${p.message}`;
}

function problemLines(problems: readonly Problem[]): string[] {
  if (problems.length === 0) return ['No problems found.'];
  const byCode = new Map<string, { first: Problem; members: Problem[] }>();
  for (const p of problems) {
    const group = byCode.get(p.code);
    if (group === undefined) byCode.set(p.code, { first: p, members: [p] });
    else group.members.push(p);
  }
  const order = { error: 0, warning: 1, note: 2 } as const;
  const groups = [...byCode.values()].sort((a, b) => order[a.first.severity] - order[b.first.severity]);
  const out = [`Problems (${problems.length}):`];
  for (const { first, members } of groups) {
    out.push(`  ${first.severity} ${first.code} x${members.length}`);
    for (const p of members.slice(0, PLACES_SHOWN)) out.push(`    ${place(p)}`);
    if (members.length > PLACES_SHOWN) out.push(`    ... and ${members.length - PLACES_SHOWN} more (see --json)`);
  }
  return out;
}
