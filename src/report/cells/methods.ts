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

/** A paragraph with a bold lead-in: `['Primary test', 'Welch's t-test ...']`. */
const P = ([lead, text]: readonly [string, string]): string =>
  `<p><strong>${textHtml(lead)}.</strong> ${textHtml(text)}</p>`;

function paragraphs(s: Settings): [string, string][] {
  const correction = { holm: 'Holm (1979)', bh: 'Benjamini and Hochberg (1995)', none: 'no' }[s.correction];
  const level = formatLevel(s.level);
  const family =
    s.family === 'study'
      ? `across the comparisons of one metric and one summary over all ` +
        `tasks` +
        (s.baseline === null ? ' (every pair of configs)' : ` (every config against its baseline, ${s.baseline})`)
      : `within each task alone (--family task: the family is smaller, so more false calls across tasks)`;
  const out: [string, string][] = [
    [
      'Per-run values',
      `Each run's curve becomes one number per metric: ${s.summaryDescription} (--summary ${s.summary}). The ` +
        `tests compare these numbers across seeds, so the seed-to-seed spread is the noise they weigh.`,
    ],
    [
      'The step of each comparison',
      `Each comparison has its own step, stated beside its verdict: the last step that every run of both arms ` +
        `reached in that task, counting only runs that neither diverged nor stopped short; a crashed run ` +
        `elsewhere never moves it. A run's value at the step is its last value logged at or before it; a value ` +
        `logged more than one of the run's typical logging intervals earlier is flagged, and so is a comparison ` +
        `whose step lies well before the end of the longer arm's runs.`,
    ],
    [
      'Primary test',
      `Welch's t-test, two-sided, on the per-run values (Welch 1947; Satterthwaite ` +
        `1946)` +
        (s.paired
          ? '; under --paired the paired t-test on the seeds present in both arms decides instead (the Wilcoxon ' +
            'signed-rank test beside it), and the rows say so'
          : '') +
        `. When both arms have zero spread and differ, Welch's test is undefined and the exact permutation test ` +
        `decides, with a caution. For reach:VALUE, the log-rank test (exact permutation p at small n) with ` +
        `Kaplan-Meier medians and the fraction that reached. Beside the primary test, as robustness checks: an ` +
        `exact permutation test on the difference of means (every split when there are at most 200,000, else ` +
        `100,000 random relabelings with p = (1 + b)/(1 + M), Phipson and Smyth 2010) and the Mann-Whitney U ` +
        `test. Where they disagree about significance at alpha, a caution says so.`,
    ],
    [
      'Verdicts',
      `p-values are adjusted with ${correction} correction ${family}; each table gives the family's size. A ` +
        `verdict is better when the adjusted p is below alpha = ${s.alpha} and the difference points in the ` +
        `metric's goal direction, worse when it points the other way, and inconclusive ` +
        `otherwise.` +
        (s.margin === null
          ? ''
          : ' Non-inferiority: a one-sided ' +
            `${s.paired ? 'paired t-test on the seeds present in both arms' : 'Welch test'} ` +
            `at alpha/2 that the candidate is not worse than the baseline by more than ${s.margin}: it holds exactly ` +
            `when the two-sided 1 - alpha t-interval of the difference lies above -${s.margin} (goal max) or below ` +
            `+${s.margin} (goal min).`),
    ],
    [
      'Intervals',
      (s.interval === 'welch'
        ? 'The interval of a difference is the Welch t-interval at every number of seeds'
        : 'The interval of a difference is the BCa bootstrap interval (Efron 1987) from 4 runs per arm ' +
          '(--interval bca), the Welch t-interval below') +
        `, at ${level} (1 - alpha). It is unadjusted: it does not account for the other comparisons of the ` +
        `family, so an interval that excludes 0 can stand beside an inconclusive verdict, and the verdict is ` +
        `the one to read. results.json also carries the simultaneous (Bonferroni, 1 - alpha/m for a family of ` +
        `m) bounds, shown in the detail tables. From ${s.bootstrapFrom} runs per arm the BCa bootstrap interval ` +
        `(${s.resamples} resamples) is shown beside Welch's in the detail table, labelled; it never decides ` +
        `(measured coverage of a nominal 95% interval for a difference on normal data, npm run calibrate, 4,000 ` +
        `replications: BCa .914 at 10 v 10, .936 at 20 v 20 and 30 v 30; Welch .946, .952 and .948). ` +
        'Learning-curve bands and per-config means use the t-interval of the mean across seeds' +
        (s.interval === 'bca' ? ' (BCa from 4 runs under --interval bca)' : '') +
        ', labelled with their method. Bands are for looking; the tests decide.',
    ],
    [
      'Effect sizes',
      `Every signed effect is candidate minus baseline in the metric's own units and direction (positive: the ` +
        `candidate's value is higher, whatever the goal): the difference first; Hedges' g with the exact ` +
        `small-sample factor and a noncentral-t interval (Hedges 1981; Steiger and Fouladi 1997); Cliff's delta ` +
        `with its consistent-variance interval (Cliff 1993; Feng and Cliff 2004). P(candidate better) is ` +
        `oriented to the goal.`,
    ],
    [
      'Seeds',
      `From the between-seed standard deviation pooled within the two configs: the smallest difference ` +
        `detectable with 80% power at the seeds there are and alpha (noncentral t). The report never gives ` +
        `seeds "to detect the observed difference" (post-hoc power; Hoenig and Heisey 2001); seedsift seeds ` +
        `--effect plans for a difference you name.`,
    ],
    [
      'Failed runs',
      `A run that diverged (its metric went non-finite and stayed so) or stopped short is a failure of its ` +
        `arm: ` +
        (s.failed === 'worst'
          ? 'under --failed worst it is scored as the worst value observed in its comparison'
          : 'by default it is left out of the values') +
        `, counted in every table, and when any arm has failed runs the failure counts are compared with ` +
        `Fisher's exact test beside the verdict.`,
    ],
    [
      'Randomness',
      `Every resampling draws from a seeded generator (--seed ${s.seed}), so the same inputs and seed give the ` +
        `same numbers and the same files.`,
    ],
  ];
  if (s.taskKey !== null) {
    out.push([
      'Tasks',
      `Comparisons run per value of ${s.taskKey}, each at its own step; across tasks, the interquartile mean of ` +
        `all task-by-run scores with a stratified bootstrap interval, the average probability of improvement, ` +
        `and performance profiles (Agarwal et al. 2021).`,
    ]);
  }
  out.push([
    'Ticks',
    'Certainty at a tick is 1 - H(p)/ln(C) for the softmax output p over C classes. Halting: each sample exits ' +
      'at the first tick whose certainty reaches the threshold. Calibration: expected calibration error over ' +
      'equal-width confidence bins (Naeini, Cooper and Hauskrecht 2015; Guo et al. 2017). Bands across seeds ' +
      'show between-seed noise; the between-example spread of one evaluation, sqrt(p(1-p)/m), is a different ' +
      'noise and is labelled where shown.',
  ]);
  return out;
}

export const methods: Cell = {
  name: 'methods',
  usage: '{{methods}}',
  arity: [0, 0],
  options: [],
  render(state) {
    const r = state.results;
    const caution =
      `${standardCaution(r.settings.alpha)} With 3 seeds per arm no rank or permutation test can reach p < 0.05 ` +
      `at all (the smallest two-sided p is 2/C(6,3) = 0.1); ` +
      `run more seeds before a claim rests on a verdict (seedsift seeds plans how many for a difference you name).`;
    const made =
      `Made by seedsift ${r.tool.version} on ${r.generated.slice(0, 10)} ` +
      `from ${r.inputs.paths.join(', ')} (${r.inputs.mode === 'scores' ? 'a score table' : 'per-step logs'}).`;
    return (
      `<div class="methods">${paragraphs(r.settings).map(P).join('')}<p ` +
      `class="caution">${textHtml(caution)}</p><p class="small">${textHtml(made)}</p></div>`
    );
  },
};
