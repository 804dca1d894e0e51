/**
 * The selection options of `report` (README "Choosing what is compared"): which metrics, which
 * configs, which candidates, which config keys. Entries of the analysis options table (spread into
 * `ANALYSIS_OPTIONS`, in this order); used by `chooseMetrics.ts`, `selectRuns.ts`, `pairing.ts`
 * and checked against the runs read by `checkOptions.ts`.
 */
import { type CommandName, names, option, selectors, text } from './optionSpec.js';
import type { Selector } from './selectors.js';

const REPORT: readonly CommandName[] = ['report'];

export const SELECTION_OPTIONS = {
  metrics: option({
    flag: '--metrics <names>',
    help:
      'compare only these metrics, in this order (e.g. --metrics val_acc,val_loss); a bookkeeping column ' +
      'named here is compared too',
    commands: REPORT,
    front: 'metrics',
    shape: 'csv',
    fallback: null as readonly string[] | null,
    parse: names(),
    setting: (v) => v,
  }),
  primary: option({
    flag: '--primary <name>',
    help:
      'the metric that leads every output: first section, first verdicts (e.g. --primary val_acc; default ' +
      'the first of --metrics)',
    commands: REPORT,
    front: 'primary',
    shape: 'text',
    fallback: null as string | null,
    parse: text(),
    setting: (v) => v,
  }),
  asMetric: option({
    flag: '--as-metric <names>',
    help: 'compare these columns although they look like bookkeeping (e.g. --as-metric epoch_time)',
    commands: REPORT,
    front: 'as-metric',
    shape: 'csv',
    fallback: [] as readonly string[],
    parse: names(),
    setting: (v) => v,
  }),
  includeConfigs: option({
    flag: '--include-configs <selector>',
    help:
      'compare only the configs that match, repeatable (e.g. --include-configs algo=ppo --include-configs ' +
      'algo=a2c)',
    commands: REPORT,
    front: 'include-configs',
    shape: 'list',
    repeatable: true,
    fallback: [] as readonly Selector[],
    parse: selectors(),
    setting: (v) => v.map((s) => s.text),
  }),
  excludeConfigs: option({
    flag: '--exclude-configs <selector>',
    help: 'leave out the configs that match, repeatable (e.g. --exclude-configs ticks=32)',
    commands: REPORT,
    front: 'exclude-configs',
    shape: 'list',
    repeatable: true,
    fallback: [] as readonly Selector[],
    parse: selectors(),
    setting: (v) => v.map((s) => s.text),
  }),
  candidates: option({
    flag: '--candidate <selector>',
    help: 'compare only these configs with the baseline, repeatable (e.g. --baseline algo=dqn --candidate algo=ppo)',
    commands: REPORT,
    front: 'candidate',
    shape: 'list',
    repeatable: true,
    fallback: [] as readonly Selector[],
    parse: selectors(),
    setting: (v) => v.map((s) => s.text),
  }),
  dropKeys: option({
    flag: '--drop-keys <keys>',
    help: 'config keys to ignore, so runs that differ only in them form one config (e.g. --drop-keys gpu,host)',
    commands: REPORT,
    front: 'drop-keys',
    shape: 'csv',
    fallback: [] as readonly string[],
    parse: names(),
    setting: (v) => v,
  }),
  keepKeys: option({
    flag: '--keep-keys <keys>',
    help: 'the config keys to keep, every other key is ignored (e.g. --keep-keys algo,env)',
    commands: REPORT,
    front: 'keep-keys',
    shape: 'csv',
    fallback: null as readonly string[] | null,
    parse: names(),
    setting: (v) => v,
  }),
};
