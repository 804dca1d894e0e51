/**
 * The table of problem codes (see problems.ts): each code's severity, what it means and what to
 * do about it. README's problem table lists every code (a test holds it to this table).
 */

export type Severity = 'error' | 'warning' | 'note';

export const PROBLEM_CODES = {
  'file-unreadable': {
    severity: 'error',
    means: 'A file could not be opened or parsed at all; none of its rows were used.',
    action: 'Check the file (permissions, truncated download, wrong format); the report is still written without it.',
  },
  'file-empty': {
    severity: 'warning',
    means: 'A file has no data rows (empty, or a header only).',
    action: 'Remove it or re-run the logging; no run is built from it.',
  },
  'file-skipped': {
    severity: 'note',
    means:
      'A file or folder found under a PATH was not read as a log: its name has no log extension, it is hidden, ' +
      'it is not listed in the manifest, or it is a second path (a symbolic link loop or alias) to something ' +
      'read once already.',
    action:
      'Nothing, if it is not a log; otherwise rename it (.csv, .tsv, .txt, .parquet, optionally .gz) or list it ' +
      'in the manifest.',
  },
  'no-logs': {
    severity: 'error',
    means: 'A path given on the command line holds no log files seedsift can read.',
    action: 'Check the path and the file extensions (.csv, .tsv, .txt, .parquet, optionally .gz).',
  },
  'layout-unmatched': {
    severity: 'warning',
    means: 'A file does not match the --layout template, so its config and seed are unknown; it was skipped.',
    action: 'Fix the template or move the file.',
  },
  'seed-missing': {
    severity: 'warning',
    means:
      'No seed could be found for a file (no seed= segment, layout field, seed column or manifest row); it was ' +
      'given a seed of its own.',
    action: 'Name the seed with a seed=N folder, --layout, --seed-column or --manifest.',
  },
  'run-duplicate': {
    severity: 'warning',
    means:
      'Two sources claim the same config and seed; their rows were merged in file order (later rows win on ' +
      'repeated steps).',
    action: 'Check for a copied folder or a mislabelled seed.',
  },
  'goal-conflict': {
    severity: 'warning',
    means:
      'Digests read together (or a digest and the logs read beside it) give a metric different goals (from ' +
      '--metric when each was made); the goal of the first was kept.',
    action: 'Say --metric NAME:max or NAME:min when reading them; it decides for all.',
  },
  'params-mismatch': {
    severity: 'warning',
    means: 'A params.json beside a run disagrees with a value taken from its path.',
    action: 'A mislabelled folder is a real hazard: check which is right; the path value was kept.',
  },
  'manifest-file-missing': {
    severity: 'error',
    means: 'A manifest row names a file that does not exist.',
    action: 'Fix the path in the manifest; the other rows are still read.',
  },
  'manifest-invalid': {
    severity: 'error',
    means: 'The manifest has no file column or cannot be read.',
    action: 'The manifest needs a header with a file column and a seed column.',
  },
  'step-column-missing': {
    severity: 'error',
    means: 'No step column was found (none of step, global_step, iteration, iter, epoch, timestep, frame, nor --step).',
    action: 'Name it with --step NAME, or give headerless files --columns.',
  },
  'step-invalid': {
    severity: 'warning',
    means: 'Step cells that are empty, not numbers, or not finite; those rows were dropped.',
    action: 'Check the logging code for the rows listed.',
  },
  'steps-duplicated': {
    severity: 'note',
    means:
      'A run logs the same step more than once (a resumed run); the last row in file order was kept for each step.',
    action: 'Nothing, if the run was resumed from a checkpoint; otherwise check for two runs writing one file.',
  },
  'steps-unsorted': {
    severity: 'note',
    means: 'Steps were not in increasing order; they were sorted.',
    action: 'Nothing; said so that you know.',
  },
  'cells-missing': {
    severity: 'note',
    means:
      'Cells that are empty, nan, inf or not numbers were treated as missing; each metric keeps its own ' +
      'non-missing rows.',
    action: 'Expected when train and eval rows share a file; otherwise check the logging.',
  },
  'row-malformed': {
    severity: 'warning',
    means:
      'A row could not be parsed (wrong number of fields, unterminated quote); it was rejected and the run ' +
      'keeps its other rows.',
    action: 'Check the line named.',
  },
  'header-drift': {
    severity: 'note',
    means: 'Files of one study have different columns (a renamed or extra column); columns were matched by name.',
    action: 'Check that a renamed column is not the same metric under two names.',
  },
  'column-duplicated': {
    severity: 'warning',
    means: 'A file has two columns with the same name; the later ones were renamed with a suffix.',
    action: 'Fix the logging code.',
  },
  'column-not-numeric': {
    severity: 'note',
    means: 'A column holds no numbers and was not used as a metric.',
    action: 'Nothing, if it is a label column.',
  },
  'aggregate-columns-ignored': {
    severity: 'note',
    means:
      'In a wide file with one column per seed, columns that look like aggregates (mean, sd, std, min, max) ' +
      'were ignored.',
    action: 'Nothing; seedsift computes its own aggregates from the seeds.',
  },
  'column-unused': {
    severity: 'note',
    means:
      'In a wide file with one column per seed (--seed-columns), a column matches no pattern and does not look ' +
      'like an aggregate; it was not used.',
    action: 'Add a NAME:PATTERN for it to --seed-columns if it holds one seed per column.',
  },
  'metric-empty': {
    severity: 'warning',
    means: 'A metric has no finite value in a run.',
    action: 'Check the logging of that metric.',
  },
  'goal-inferred': {
    severity: 'note',
    means: 'Whether higher or lower is better was guessed from the metric name.',
    action: 'If the guess is wrong, say --metric NAME:max or NAME:min.',
  },
  'goal-unknown': {
    severity: 'note',
    means:
      'No name rule says whether higher or lower is better for this metric, and no --metric option names it; ' +
      'its comparisons say only which way the difference goes (higher, lower), never better or worse.',
    action: 'Say --metric NAME:max or NAME:min (or metrics: in the notebook front matter).',
  },
  'run-diverged': {
    severity: 'warning',
    means:
      'A metric went non-finite and stayed so; the run is marked diverged at that step and, by default, ' +
      'excluded from value statistics (counted in every table).',
    action: 'Use --diverged worst to count diverged runs as the worst value instead.',
  },
  'run-short': {
    severity: 'warning',
    means: 'A run stopped well before the other runs of its config (below 90% of their last step).',
    action:
      "Check whether the run crashed; it is a failure of its arm (counted, compared with Fisher's exact test, " +
      "and excluded or scored worst by --failed) and never moves any comparison's step.",
  },
  'tick-dump-invalid': {
    severity: 'warning',
    means: 'A per-sample tick dump lacks a required column or has inconsistent ticks.',
    action: 'A dump needs columns sample, tick, correct, certainty (optional confidence, step).',
  },
  'score-missing': {
    severity: 'note',
    means: 'A score table cell is empty: that run has no value for that metric.',
    action: 'Nothing, if the evaluation was not run.',
  },
  'counterpart-missing': {
    severity: 'warning',
    means: 'A config has no counterpart for the --baseline selector, so it is not compared.',
    action: 'Check the selector, or run the missing config.',
  },
  'few-seeds': {
    severity: 'warning',
    means: 'A comparison rests on very few seeds; rank and permutation tests cannot reach the significance level.',
    action: 'Run more seeds (see seedsift seeds).',
  },
  'summary-censored': {
    severity: 'warning',
    means: 'For --summary reach:VALUE, some runs never reached the value and are censored.',
    action: 'Read the verdict with that in mind, or choose a reachable value.',
  },
  'summary-optimistic': {
    severity: 'warning',
    means: 'The best checkpoint summary is optimistic (selection on the evaluation data).',
    action: 'Prefer final or last:P% for claims.',
  },
  'skewed-values': {
    severity: 'warning',
    means: 'Per-run values are strongly skewed at a small number of seeds; t-based intervals may under-cover.',
    action: 'Read the rank and permutation tests beside Welch, or run more seeds.',
  },
  'unequal-seeds': {
    severity: 'note',
    means: 'The two arms of a comparison have different numbers of seeds.',
    action: 'Nothing; Welch does not assume equal sizes.',
  },
  'step-early': {
    severity: 'warning',
    means:
      'A comparison is made at a step well before the end of some of its runs (below 90% of the longest ' +
      "non-failed run of the two arms), because every run of one arm stops early; only this comparison's step " +
      'is set by them.',
    action: 'Check why those runs stop early; the verdict answers a question about that early step.',
  },
  'value-stale': {
    severity: 'note',
    means:
      "A run's value for a comparison was logged more than one of its typical logging intervals before the " +
      "comparison's step.",
    action: 'Nothing, if the metric is logged rarely; otherwise check for a gap in the log.',
  },
  'step-beyond-run': {
    severity: 'warning',
    means: 'For --summary step:N, a run ends before step N: it has no value and is short for that comparison.',
    action: 'Choose a step every run reached, or read the failure counts beside the verdict.',
  },
  'zero-spread': {
    severity: 'warning',
    means:
      "Every run of both arms gave the same value within its arm, and the arms differ: Welch's test is " +
      'undefined, so the exact permutation test decides.',
    action: 'Check that the metric varies between seeds at all (a constant, a saturated score, a copied log).',
  },
  'tests-disagree': {
    severity: 'note',
    means: 'Welch, permutation and Mann-Whitney disagree about significance at alpha.',
    action: 'Treat the verdict as fragile.',
  },
  'column-set-aside': {
    severity: 'note',
    means:
      'A numeric column looks like bookkeeping, not a result: its name marks time, epochs, counts or a schedule ' +
      '(wall time, timestamp, elapsed, epoch, preemptions, lr), or its values never decrease (or never change) ' +
      'within a run while no name rule gives it a goal. It is not compared.',
    action:
      'To compare it anyway, name it: --as-metric NAME, or --metrics NAME, or give its goal with --metric ' +
      'NAME:max or NAME:min.',
  },
  'seed-repeated': {
    severity: 'warning',
    means:
      'After --drop-keys or --keep-keys, two runs from different files share a config and a seed; both are kept ' +
      'as separate runs (the second id ends in #2).',
    action:
      'Check whether the ignored key told real replicates apart (a machine flag) or whether one run is a copy; ' +
      'give distinct seeds if they are replicates.',
  },
  'arm-keys': {
    severity: 'note',
    means:
      'For --baseline KEY=VALUE, some config keys take values that change only together with KEY (attributes of ' +
      "the arm, such as one algorithm's own hyperparameters); counterparts were matched ignoring them.",
    action:
      'Nothing, if those keys belong to the arms; otherwise run the missing configs, or drop the keys with ' +
      '--drop-keys.',
  },
  'series-identical': {
    severity: 'warning',
    means:
      'Two runs logged identical series (every step and value of every metric the same), within one config or ' +
      "across configs: most likely one run's files were copied for another.",
    action: 'Check the files named; remove the copy or re-run it. Comparisons that use a copied run are not evidence.',
  },
  'run-single-step': {
    severity: 'warning',
    means: 'A run logged a single step: a crash at start, or an evaluation-only file; its value is a single point.',
    action: 'Check whether the run failed; it is kept, and counted in its config.',
  },
  'config-all-failed': {
    severity: 'warning',
    means:
      'Every run of a config failed (diverged, short, rejected or a single logged step): that config has no ' +
      'usable value, and its comparisons rest on failures.',
    action: "Check the config's runs; fix and re-run before reading its comparisons.",
  },
  'path-key': {
    severity: 'note',
    means:
      'Two PATHs given on the command line hold runs with the same config and seed (two method folders with ' +
      "nothing in their names that reads as a config); so that they do not merge into one run, each PATH's runs " +
      'got the config key path=PATH.',
    action:
      'Nothing, if the PATHs are different methods; name the config in the folders (method=ours) or with ' +
      '--layout to give the key a better name.',
  },
} as const satisfies Record<string, { severity: Severity; means: string; action: string }>;
