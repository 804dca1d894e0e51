/**
 * `seedsift seeds`: how many seeds per arm a decision needs, from given figures (--sd, --effect)
 * or from pilot runs (PATH... with --for METRIC and --baseline / --candidate selectors).
 */
import { Command } from 'commander';
import { resolveOptions } from '../analysis/options.js';
import { matchesSelector, parseSelector } from '../analysis/selectors.js';
import { seedsNeeded, type SeedsAnswer, type SeedsQuestion } from '../analysis/seedsNeeded.js';
import { SeedsiftError } from '../problems.js';
import { addIngestOptions, rawIngestOptions, resolveIngestOptions } from './ingestOptions.js';
import type { Io } from './io.js';
import { version } from './version.js';

interface RawSeedsOptions extends Record<string, unknown> {
  sd?: string;
  effect?: string;
  alpha?: string;
  power?: string;
  for?: string;
  baseline?: string;
  candidate?: string;
  summary?: string;
  json?: boolean;
  comparisons?: string;
}

const number = (text: string | undefined, option: string, fallback: number | null): number | null => {
  if (text === undefined) return fallback;
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value))
    throw new SeedsiftError('usage', `${option}: expected a number, got '${text}'`);
  return value;
};

export function seedsCommand(io: Io, done: (code: number) => void): Command {
  const command = new Command('seeds')
    .description('seeds per arm needed to detect a difference with the given power (noncentral t)')
    .argument('[paths...]', 'pilot runs (with --for, --baseline and --candidate or --effect)')
    .option('--sd <x>', 'between-seed standard deviation of the metric (metric units)')
    .option('--effect <x>', 'difference to detect (metric units)')
    .option('--alpha <a>', 'two-sided significance level (default 0.05)')
    .option('--power <p>', 'power wanted (default 0.8)')
    .option('--for <metric>', 'the metric of the pilot runs')
    .option('--baseline <selector>', 'pilot baseline config (key=value,...)')
    .option('--candidate <selector>', 'another pilot config whose runs also give the sd (pooled within configs)')
    .option('--comparisons <m>', 'comparisons in the family the plan is for: plan at alpha / m (default 1)')
    .option('--summary <how>', 'per-run value of the pilot runs (as in report; default final)')
    .option('--json', 'print the answer as JSON');
  addIngestOptions(command, 'seeds');
  command.action(async (paths: string[], raw: RawSeedsOptions) => {
    const alpha = number(raw.alpha, '--alpha', 0.05) as number;
    const power = number(raw.power, '--power', 0.8) as number;
    const question: SeedsQuestion =
      paths.length === 0 ? figures(raw, alpha, power) : await pilot(paths, raw, alpha, power);
    const answer = seedsNeeded(question);
    io.stdout(raw.json === true ? `${JSON.stringify(answer, null, 2)}\n` : seedsText(answer));
    done(0);
  });
  return command;
}

function figures(raw: RawSeedsOptions, alpha: number, power: number): SeedsQuestion {
  const sd = number(raw.sd, '--sd', null);
  const effect = number(raw.effect, '--effect', null);
  if (sd === null || effect === null) {
    throw new SeedsiftError(
      'usage',
      'seeds: expected --sd and --effect, or pilot runs (PATH... --for METRIC --baseline SEL [--candidate SEL | ' +
        '--effect X])',
    );
  }
  return {
    kind: 'figures',
    sd,
    effect,
    alpha,
    power,
    comparisons: number(raw.comparisons, '--comparisons', 1) as number,
  };
}

async function pilot(
  paths: readonly string[],
  raw: RawSeedsOptions,
  alpha: number,
  power: number,
): Promise<SeedsQuestion> {
  if (raw.for === undefined || raw.baseline === undefined) {
    throw new SeedsiftError('usage', 'seeds: with pilot runs, expected --for METRIC and --baseline SELECTOR');
  }
  const [{ ingest }, { analyze }] = await Promise.all([
    import('../ingest/ingest.js'),
    import('../analysis/analyze.js'),
  ]);
  const runSet = await ingest(paths, resolveIngestOptions(rawIngestOptions(raw)));
  if (!runSet.metrics.some((m) => m.name === raw.for && m.kind === 'scalar')) {
    throw new SeedsiftError(
      'usage',
      `--for: expected one of the metrics (${runSet.metrics
        .filter((m) => m.kind === 'scalar')
        .map((m) => m.name)
        .join(', ')}), got '${raw.for}'`,
    );
  }
  const options = resolveOptions({ summary: raw.summary, seed: 1, asMetric: raw.for }, runSet);
  const comparisons = number(raw.comparisons, '--comparisons', 1) as number;
  const results = analyze(runSet, options, { paths, generated: new Date(0).toISOString(), version: version() });
  const paramsOf = new Map(results.configs.map((c) => [c.id, c.params]));
  // Values per config: the sd is pooled within configs, never across them (a selector naming
  // fewer keys, --baseline memory=4, matches several configs, whose differences are not seed noise).
  const armGroups = (selectorText: string, option: string): number[][] => {
    const selector = parseSelector(selectorText, option);
    const byConfig = new Map<string, number[]>();
    for (const v of results.values) {
      if (v.metric !== raw.for || v.value === null || !matchesSelector(paramsOf.get(v.config) ?? {}, selector))
        continue;
      byConfig.set(v.config, [...(byConfig.get(v.config) ?? []), v.value]);
    }
    if (byConfig.size === 0)
      throw new SeedsiftError('usage', `${option}: no run with a value of ${raw.for} matches '${selectorText}'`);
    return [...byConfig.values()];
  };
  const groups = armGroups(raw.baseline, '--baseline');
  if (raw.candidate !== undefined) groups.push(...armGroups(raw.candidate, '--candidate'));
  const effect = number(raw.effect, '--effect', null);
  if (effect === null)
    throw new SeedsiftError(
      'usage',
      'seeds: expected --effect X (the difference to detect, in metric units); seedsift never plans for the ' +
        'observed pilot difference (post-hoc power)',
    );
  return { kind: 'pilot', groups, effect, alpha, power, comparisons };
}

function seedsText(a: SeedsAnswer): string {
  const fmt = (x: number): string => Number(x.toPrecision(4)).toString();
  const lines = [
    a.seedsPerArm === null
      ? `No finite number of seeds detects a difference of ${fmt(a.effect)}.`
      : `${a.seedsPerArm} seeds per arm detect a difference of ${fmt(a.effect)} (${a.effectFrom}) ` +
        `with ${Math.round(a.power * 100)}% power at ` +
        `alpha ${a.alpha}${a.comparisons > 1 ? ` / ${a.comparisons} comparisons` : ''}, two-sided.`,
    `  sd between seeds ${fmt(a.sd)} (${a.sdFrom}); standardized difference d = ${fmt(a.standardized)}; ` +
      `method: ${a.method}`,
    `  power with this difference at n seeds per ` +
      `arm: ${a.powerAt.map((p) => `${p.seeds}: ${p.power.toFixed(2)}`).join(', ')}`,
    ...a.notes.map((n) => `  note: ${n}`),
  ];
  return `${lines.join('\n')}\n`;
}
