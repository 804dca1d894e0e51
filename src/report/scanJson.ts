/** The machine-readable scan: `{ format, version, runs[], configs[], metrics[], setAside[], files[], problems[] }`. */
import type { Inventory } from '../analysis/inventory.js';
import type { SetAsideColumn } from '../analysis/setAside.js';
import type { RunSet } from '../ingest/types.js';

export function scanJson(runSet: RunSet, inv: Inventory, setAside: readonly SetAsideColumn[] = []): string {
  const value = {
    format: 'seedsift-scan',
    version: 1,
    mode: runSet.mode,
    keys: runSet.keys,
    configs: inv.configs,
    runs: inv.runs,
    metrics: inv.metrics.map(({ horizon: _horizon, ...m }) => m),
    setAside: setAside.map(({ name, reason }) => ({ name, reason })),
    tickDumps: runSet.tickDumps.map((d) => ({
      run: d.run,
      config: d.config,
      seed: d.seed,
      file: d.file,
      step: d.step,
      samples: d.samples,
      ticks: d.ticks,
    })),
    files: runSet.files,
    problems: runSet.problems,
  };
  return `${JSON.stringify(value, null, 2)}\n`;
}
