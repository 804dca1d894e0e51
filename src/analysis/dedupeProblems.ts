/** Problems of one analysis without repeats, in first-seen order. */
import type { RunSet } from '../ingest/types.js';
import type { Problem } from '../problems.js';

/** Analysis 'goal-inferred' problems for metrics that ingest already reported as guessed are dropped. */
export function withoutRepeatedGoals(problems: readonly Problem[], runSet: RunSet): Problem[] {
  const told = runSet.problems.filter((p) => p.code === 'goal-inferred');
  if (told.length === 0) return [...problems];
  const metricOf = (p: Problem): string => p.message.slice(0, p.message.indexOf(':'));
  return problems.filter((p) => p.code !== 'goal-inferred' || !told.some((t) => t.message.includes(metricOf(p))));
}

/** Problems without repeats (same code, message and place), in first-seen order. */
export function dedupeProblems(problems: readonly Problem[]): Problem[] {
  const seen = new Set<string>();
  const out: Problem[] = [];
  for (const p of problems) {
    const key = JSON.stringify([p.code, p.message, p.file ?? null, p.line ?? null, p.run ?? null]);
    if (seen.has(key)) continue;
    seen.add(key);
    out.push(p);
  }
  return out;
}
