/**
 * The plain-text tables `npm run bench` prints at the end: one row per tool and data set, one row
 * per data set comparing seedsift with the peer, the scaling series, and the targets.
 */
import type { Agreement } from './agreement.js';
import type { BenchSize } from './sizes.js';
import { runCount } from './sizes.js';
import type { Measurement } from './timedRun.js';

/** One timed measurement and the 1-minute load average just before it started. */
export interface Sample {
  readonly measurement: Measurement;
  readonly loadBefore: number;
}

/** Everything measured on one data set. */
export interface SizeResult {
  readonly size: BenchSize;
  readonly baseline: string;
  readonly dataMiB: number;
  readonly seedsift: readonly Sample[];
  /** Null when the peer was not run (size.peerSkipped says why). */
  readonly peer: readonly Sample[] | null;
  /** The one seedsift run that also wrote the HTML report, its error message when it failed, or null. */
  readonly html: Sample | string | null;
  readonly agreement: Agreement | null;
}

/** Median of a non-empty list (mean of the two middle values for an even count). */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('median: expected at least one value');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1
    ? (sorted[mid] as number)
    : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

/** Median wall seconds, median CPU seconds and the largest peak of some samples. */
export function summarize(samples: readonly Sample[]): { wall: number; cpu: number; peak: number } {
  return {
    wall: median(samples.map((s) => s.measurement.wallSeconds)),
    cpu: median(samples.map((s) => s.measurement.cpuSeconds)),
    peak: Math.max(...samples.map((s) => s.measurement.peakMiB)),
  };
}

/** Left-aligned first column, right-aligned others, two spaces between columns. */
export function formatColumns(rows: readonly (readonly string[])[], leftColumns = 1): string {
  const widths: number[] = [];
  for (const row of rows)
    row.forEach((cell, i) => {
      widths[i] = Math.max(widths[i] ?? 0, cell.length);
    });
  return rows
    .map((row) =>
      row
        .map((cell, i) => (i < leftColumns ? cell.padEnd(widths[i] ?? 0) : cell.padStart(widths[i] ?? 0)))
        .join('  ')
        .trimEnd(),
    )
    .join('\n');
}

const s2 = (v: number): string => v.toFixed(2);
const mib = (v: number): string => v.toFixed(0);
const loads = (samples: readonly Sample[]): string => {
  const l = samples.map((s) => s.loadBefore);
  return `${Math.min(...l).toFixed(2)}-${Math.max(...l).toFixed(2)}`;
};

/** The per-tool table: median (min-max) wall seconds, median CPU seconds, peak MiB, load range. */
export function timingTable(results: readonly SizeResult[]): string {
  const rows: string[][] = [
    [
      'data set',
      'runs',
      'steps',
      'MiB on disk',
      'tool',
      'n',
      'wall s median',
      'min-max',
      'CPU s',
      'peak MiB',
      'load 1m',
    ],
  ];
  for (const r of results) {
    const head = [r.size.name, String(runCount(r.size.spec)), r.size.spec.steps.toLocaleString('en'), mib(r.dataMiB)];
    const line = (tool: string, samples: readonly Sample[], first: boolean): string[] => {
      const t = summarize(samples);
      const walls = samples.map((s) => s.measurement.wallSeconds);
      return [
        ...(first ? head : ['', '', '', '']),
        tool,
        String(samples.length),
        s2(t.wall),
        `${s2(Math.min(...walls))}-${s2(Math.max(...walls))}`,
        s2(t.cpu),
        mib(t.peak),
        loads(samples),
      ];
    };
    rows.push(line('seedsift (JSON)', r.seedsift, true));
    if (r.peer !== null) rows.push(line('peer (pandas/scipy)', r.peer, false));
    else rows.push(['', '', '', '', 'peer', '-', 'not run', '', '', '', '']);
    if (typeof r.html === 'string')
      rows.push(['', '', '', '', 'seedsift (JSON + HTML)', '-', 'failed', '', '', '', '']);
    else if (r.html !== null) rows.push(line('seedsift (JSON + HTML)', [r.html], false));
  }
  return formatColumns(rows, 1);
}

/** Per data set: speed-up, memory ratio, the HTML report's extra cost, and the agreement check. */
export function ratioTable(results: readonly SizeResult[]): string {
  const rows: string[][] = [
    [
      'data set',
      'speed-up (peer/seedsift wall)',
      'CPU ratio',
      'memory (seedsift/peer)',
      'HTML extra s',
      'HTML extra MiB',
      'agreement with peer',
    ],
  ];
  for (const r of results) {
    const own = summarize(r.seedsift);
    const peer = r.peer === null ? null : summarize(r.peer);
    const html = r.html === null || typeof r.html === 'string' ? null : r.html.measurement;
    const a = r.agreement;
    rows.push([
      r.size.name,
      peer === null ? '-' : `${s2(peer.wall / own.wall)}x`,
      peer === null ? '-' : `${s2(peer.cpu / own.cpu)}x`,
      peer === null ? '-' : s2(own.peak / peer.peak),
      html === null ? '-' : `${html.wallSeconds - own.wall >= 0 ? '+' : ''}${s2(html.wallSeconds - own.wall)}`,
      html === null ? '-' : `${html.peakMiB - own.peak >= 0 ? '+' : ''}${mib(html.peakMiB - own.peak)}`,
      a === null
        ? '-'
        : `${a.matched} matched, ${a.unmatched} not; max |diff gap| ${a.maxDifferenceGap.toExponential(1)}, ` +
          `max |Welch p gap| ${a.maxWelchPGap.toExponential(1)} (${a.welchUndefined} without a Welch p on one side)`,
    ]);
  }
  return formatColumns(rows, 1);
}

/** The scaling series: median wall and CPU seconds of each tool relative to the 1x data set. */
export function scalingTable(results: readonly SizeResult[]): string {
  const series = results.filter((r) => r.size.group === 'scaling');
  const first = series[0];
  if (first === undefined) return '(scaling series not run)';
  const base = summarize(first.seedsift);
  const peerBase = first.peer === null ? null : summarize(first.peer);
  const rows: string[][] = [
    ['data set', 'runs', 'comparisons', 'seedsift wall s', 'x 1x', 'seedsift CPU s', 'x 1x', 'peer wall s', 'x 1x'],
  ];
  for (const r of series) {
    const own = summarize(r.seedsift);
    const peer = r.peer === null ? null : summarize(r.peer);
    rows.push([
      r.size.name,
      String(runCount(r.size.spec)),
      String(r.size.spec.metrics * (r.size.spec.configs - 1)),
      s2(own.wall),
      s2(own.wall / base.wall),
      s2(own.cpu),
      s2(own.cpu / base.cpu),
      peer === null ? '-' : s2(peer.wall),
      peer === null || peerBase === null ? '-' : s2(peer.wall / peerBase.wall),
    ]);
  }
  return formatColumns(rows, 1);
}
