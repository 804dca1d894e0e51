/**
 * `{{methods}}`: what ran, in words a reviewer can check: the summary, the primary test and the
 * checks beside it, the correction, the interval rule with its thresholds, bands, effect sizes,
 * seeds, alpha, the diverged-run policy and the random seed, the tick-level definitions, sources;
 * and the caution that a test is evidence, not proof, and that 3-seed verdicts are fragile.
 * Every value comes from `Results.settings`.
 */
import type { Settings } from '../../analysis/results.js';
import { formatLevel } from '../format.js';
import { textHtml } from '../html.js';
import { standardCaution } from '../verdictWords.js';
import type { Cell } from './cell.js';

/**
 * The summary as a sentence: how one run's curve became one number.
 * Cost O(1). Never throws. Example: `summaryWords('last:10%')` → `'the mean of the last 10% of logged steps up to the common horizon'`.
 */
export function summaryWords(summary: string): string {
  const [kind, arg] = summary.split(/:(.*)/s) as [string, string | undefined];
  switch (kind) {
    case 'final':
      return 'the last logged value at or before the common horizon (the last step every compared run reached)';
    case 'last':
      return `the mean of the last ${arg ?? ''} of logged steps up to the common horizon`;
    case 'best':
      return 'the best value up to the common horizon (optimistic: it selects on the evaluation data)';
    case 'auc':
      return 'the area under the curve up to the common horizon, divided by the steps covered';
    case 'reach':
      return `the first step at which the run reaches ${arg ?? ''} (runs that never do are censored and said so)`;
    case 'step':
      return `the value at step ${arg ?? ''}`;
    default:
      return `the summary ${summary}`;
  }
}

/** A paragraph with a bold lead-in: `['Primary test', 'Welch's t-test ...']`. */
const P = ([lead, text]: readonly [string, string]): string =>
  `<p><strong>${textHtml(lead)}.</strong> ${textHtml(text)}</p>`;

function paragraphs(s: Settings): [string, string][] {
  const correction = { holm: 'Holm (1979)', bh: 'Benjamini and Hochberg (1995)', none: 'no' }[s.correction];
  const level = formatLevel(s.level);
  const out: [string, string][] = [
    [
      'Per-run values',
      `Each run's curve becomes one number per metric: ${summaryWords(s.summary)} (--summary ${s.summary}). The tests compare these numbers across seeds, so the seed-to-seed spread is the noise they weigh.`,
    ],
    [
      'Primary test',
      `Welch's t-test, two-sided, on the per-run values (Welch 1947; Satterthwaite 1946)${s.paired ? '; under --paired, the paired t-test and the Wilcoxon signed-rank test on seeds present in both arms' : ''}. Beside it, as robustness checks: an exact permutation test on the difference of means (every split when there are at most 200,000, else 100,000 random relabelings with p = (1 + b)/(1 + M), Phipson and Smyth 2010) and the Mann-Whitney U test (exact without ties for small samples, exact conditional with ties, else the tie-corrected normal approximation). Where they disagree about significance at alpha, a caution says so.`,
    ],
    [
      'Verdicts',
      `p-values are adjusted with ${correction} correction across the comparisons of one metric and one summary${s.baseline === null ? ' (every pair of configs)' : ` (every config against the baseline ${s.baseline})`}. A verdict is better when the adjusted p is below alpha = ${s.alpha} and the difference points in the metric's goal direction, worse when it points the other way, and inconclusive otherwise.${s.margin === null ? '' : ` Non-inferiority: a one-sided Welch test that the candidate is not worse than the baseline by more than ${s.margin}.`}`,
    ],
    [
      'Intervals',
      `The interval of a difference is the Welch t-interval while either arm has fewer than ${s.bootstrapFrom} runs (it matches the test, so "the interval excludes 0" and "p < alpha" agree), and the BCa bootstrap interval (Efron 1987; ${s.resamples} resamples) at ${s.bootstrapFrom} runs or more. No resampling interval is shown for 3 runs or fewer. Learning-curve bands follow the same rule per step (t-interval of the mean across seeds below ${s.bootstrapFrom} runs, BCa bootstrap with ${s.bandResamples} resamples above, the seeds resampled as whole curves) and are labelled with their method. All intervals are ${level}. Bands are for looking; the tests decide.`,
    ],
    [
      'Effect sizes',
      `The difference in the metric's units first; Hedges' g with the exact small-sample factor and a noncentral-t interval (Hedges 1981; Steiger and Fouladi 1997); the probability that a candidate run beats a baseline run, with Cliff's delta and its consistent-variance interval (Cliff 1993; Feng and Cliff 2004).`,
    ],
    [
      'Seeds',
      `From the pooled between-seed standard deviation: the smallest difference detectable with 80% power at the seeds there are, and the seeds per arm needed to detect the observed difference with 80% power (noncentral t; Colas, Sigaud and Oudeyer 2018).`,
    ],
    [
      'Diverged runs',
      `A run whose metric goes non-finite and stays so is marked diverged; ${s.diverged === 'worst' ? 'under --diverged worst it counts as the worst value observed' : 'by default it is left out of the value statistics'}, and it is counted in every table and verdict line.`,
    ],
    [
      'Randomness',
      `Every resampling draws from a seeded generator (--seed ${s.seed}), so the same inputs and seed give the same numbers and the same files.`,
    ],
  ];
  if (s.taskKey !== null) {
    out.push([
      'Tasks',
      `Comparisons run per value of ${s.taskKey}; across tasks, the interquartile mean of all task-by-run scores with a stratified bootstrap interval, the average probability of improvement, and performance profiles (Agarwal et al. 2021).`,
    ]);
  }
  out.push([
    'Ticks',
    'Certainty at a tick is 1 - H(p)/ln(C) for the softmax output p over C classes. Halting: each sample exits at the first tick whose certainty reaches the threshold. Calibration: expected calibration error over equal-width confidence bins (Naeini, Cooper and Hauskrecht 2015; Guo et al. 2017). Bands across seeds show between-seed noise; the between-example spread of one evaluation, sqrt(p(1-p)/m), is a different noise and is labelled where shown.',
  ]);
  return out;
}

export const methods: Cell = {
  name: 'methods',
  usage: '{{methods}}',
  arity: [0, 0],
  options: [],
  render(state, call) {
    const r = state.results;
    const caution =
      `${standardCaution(r.settings.alpha)} With 3 seeds per arm no rank or permutation test can reach p < 0.05 at all (the smallest two-sided p is 2/C(6,3) = 0.1); ` +
      `run more seeds before a claim rests on a verdict (the Seeds rows of each comparison say how many).`;
    const made = `Made by seedsift ${r.tool.version} on ${r.generated.slice(0, 10)} from ${r.inputs.paths.join(', ')} (${r.inputs.mode === 'scores' ? 'a score table' : 'per-step logs'}).`;
    return `<div class="methods">${paragraphs(r.settings).map(P).join('')}<p class="caution">${textHtml(caution)}</p><p class="small">${textHtml(made)}</p></div>`;
  },
};
