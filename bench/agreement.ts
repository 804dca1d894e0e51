/**
 * A check that seedsift and the peer did the same job: match their comparisons by (metric,
 * candidate) and report the largest differences in the estimated difference of means and in
 * Welch's p. Both read the final value at the common horizon; seedsift's default summary is
 * `final`, so the two should agree to rounding.
 */
import { readFileSync } from 'node:fs';

/** How closely two results files agree. */
export interface Agreement {
  /** Comparisons found in both files with finite values on both sides. */
  readonly matched: number;
  /** Comparisons of the peer with no finite counterpart in seedsift's file (or the reverse). */
  readonly unmatched: number;
  readonly maxDifferenceGap: number;
  readonly maxWelchPGap: number;
  /** Matched comparisons where either side has no Welch p (e.g. zero variance in both arms). */
  readonly welchUndefined: number;
}

interface PeerComparison {
  readonly metric: string;
  readonly candidate: string;
  readonly difference: number;
  readonly welchP: number | null;
}

interface SeedsiftComparison {
  readonly metric: string;
  readonly candidate: string;
  readonly task: string | null;
  readonly difference: { readonly estimate: number } | null;
  readonly tests: { readonly welch: { readonly p: number | null } | null } | null;
}

/**
 * Compare seedsift's results.json with the peer's JSON output (files). Throws when a file is not
 * JSON or lacks `comparisons`. Example: agreement('s.json', 'p.json') → { matched: 18, ... }.
 */
export function agreement(seedsiftFile: string, peerFile: string): Agreement {
  const ours = comparisonsOf<SeedsiftComparison>(seedsiftFile).filter((c) => c.task === null);
  const theirs = comparisonsOf<PeerComparison>(peerFile);
  const byKey = new Map(ours.map((c) => [`${c.metric}\u0000${c.candidate}`, c]));
  let matched = 0;
  let unmatched = Math.max(0, ours.length - theirs.length);
  let maxDifferenceGap = 0;
  let maxWelchPGap = 0;
  let welchUndefined = 0;
  for (const peer of theirs) {
    const own = byKey.get(`${peer.metric}\u0000${peer.candidate}`);
    const difference = own?.difference?.estimate;
    const p = own?.tests?.welch?.p;
    if (difference === undefined || !Number.isFinite(peer.difference)) {
      unmatched++;
      continue;
    }
    matched++;
    maxDifferenceGap = Math.max(maxDifferenceGap, Math.abs(difference - peer.difference));
    if (
      typeof p === 'number' &&
      Number.isFinite(p) &&
      typeof peer.welchP === 'number' &&
      Number.isFinite(peer.welchP)
    ) {
      maxWelchPGap = Math.max(maxWelchPGap, Math.abs(p - peer.welchP));
    } else welchUndefined++;
  }
  return { matched, unmatched, maxDifferenceGap, maxWelchPGap, welchUndefined };
}

/** Parse a results file; Python's json writes NaN and Infinity bare, which become null here. */
function comparisonsOf<T>(file: string): T[] {
  const text = readFileSync(file, 'utf8').replace(/([:,[]\s*)-?(?:NaN|Infinity)(?=\s*[,\]}])/g, '$1null');
  const parsed = JSON.parse(text) as { comparisons?: T[] };
  if (!Array.isArray(parsed.comparisons)) throw new Error(`${file}: expected a 'comparisons' array`);
  return parsed.comparisons;
}
