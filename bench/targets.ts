/**
 * The targets of the "Scale and speed" issue, checked against what `npm run bench` measured.
 * A target whose data set was not run says so instead of passing.
 */
import { summarize, type SizeResult } from './benchTable.js';

/** 1.5 GB as 1.5e9 bytes, in MiB (1,430.5). */
export const LARGE_PEAK_LIMIT_MiB = 1.5e9 / 2 ** 20;

/** One target: what it asks, what was measured, and whether it is met (null: not measured). */
export interface TargetCheck {
  readonly target: string;
  readonly measured: string;
  readonly met: boolean | null;
}

/**
 * The four targets: medium at least 3x faster than the peer (median wall seconds); peak memory
 * at most half the peer's (medium); 4x runs within 4.4x the time of 1x (seedsift median wall);
 * large under 1.5 GB peak (every seedsift run on it, the HTML one included: report.html is
 * `seedsift report`'s default output; not measured when the HTML run failed).
 */
export function checkTargets(results: readonly SizeResult[]): TargetCheck[] {
  const find = (name: string): SizeResult | undefined => results.find((r) => r.size.name === name);
  const checks: TargetCheck[] = [];

  const medium = find('medium');
  if (medium?.peer) {
    const own = summarize(medium.seedsift);
    const peer = summarize(medium.peer);
    const speedUp = peer.wall / own.wall;
    checks.push({
      target: 'medium: seedsift at least 3x faster than the peer',
      measured: `${speedUp.toFixed(2)}x (${own.wall.toFixed(2)} s vs ${peer.wall.toFixed(2)} s median wall)`,
      met: speedUp >= 3,
    });
    const ratio = own.peak / peer.peak;
    checks.push({
      target: "medium: seedsift peak memory at most half of the peer's",
      measured: `${ratio.toFixed(2)} of the peer's (${own.peak.toFixed(0)} MiB vs ${peer.peak.toFixed(0)} MiB)`,
      met: ratio <= 0.5,
    });
  } else {
    checks.push({
      target: 'medium: seedsift at least 3x faster than the peer',
      measured: 'not run (--sizes medium)',
      met: null,
    });
    checks.push({
      target: "medium: seedsift peak memory at most half of the peer's",
      measured: 'not run (--sizes medium)',
      met: null,
    });
  }

  const one = find('scaling-1x');
  const four = find('scaling-4x');
  if (one && four) {
    const ratio = summarize(four.seedsift).wall / summarize(one.seedsift).wall;
    const cpu = summarize(four.seedsift).cpu / summarize(one.seedsift).cpu;
    checks.push({
      target: 'scaling: 4x runs within 4.4x the time',
      measured: `${ratio.toFixed(2)}x wall (${cpu.toFixed(2)}x CPU)`,
      met: ratio <= 4.4,
    });
  } else {
    checks.push({ target: 'scaling: 4x runs within 4.4x the time', measured: 'not run (--sizes scaling)', met: null });
  }

  const large = find('large');
  const limit =
    `large: seedsift peak under 1.5 GB (${LARGE_PEAK_LIMIT_MiB.toFixed(0)} MiB), ` +
    'the HTML report (the default output) included';
  if (large) {
    const json = summarize(large.seedsift).peak;
    const html = large.html === null || typeof large.html === 'string' ? null : large.html.measurement.peakMiB;
    const peak = Math.max(json, html ?? 0);
    const measured =
      `${json.toFixed(0)} MiB with --json only; ` +
      `${html === null ? 'HTML run not measured' : `${html.toFixed(0)} MiB with the HTML report`}`;
    checks.push({ target: limit, measured, met: html === null ? null : peak < LARGE_PEAK_LIMIT_MiB });
  } else {
    checks.push({ target: limit, measured: 'not run (--large)', met: null });
  }
  return checks;
}

/** The checks as lines: "MET", "NOT MET" or "not measured", the target, the measurement. */
export function formatTargets(checks: readonly TargetCheck[]): string {
  return checks
    .map(
      (c) => `${(c.met === null ? 'not measured' : c.met ? 'MET' : 'NOT MET').padEnd(12)}  ${c.target}: ${c.measured}`,
    )
    .join('\n');
}
