/**
 * Study-scale test data of our own: many tasks x configs x seeds as per-step CSV logs in Hive-style
 * folders (`task=<t>/<key>=<v>/.../seed=<s>/log.csv`), for tests of how the report scales and for
 * `npm run bench -- --study` (through `bench/study.ts`).
 *
 * The scenario (invented): a lab trains a tick-based recurrent solver on a family of procedurally
 * generated "lantern puzzles" (light a grid of lanterns under rules that vary by puzzle). Each
 * puzzle is a task with its own score scale (some score a fraction solved in [0, 1], others a
 * points total in the hundreds) and its own training length. Configs are the cross product of
 * the spec's keys; a key whose values are all numbers is a sweep key.
 *
 * What is planted, deterministic for a given `seed`:
 * - a run's final level is the task's base level plus the config's effect (`effect`, in units of
 *   the task's between-seed spread) plus seed noise; the learning curve rises as 1 - exp(-4 t);
 * - every `crashEvery`-th run diverges (its loss and score become `nan` from 60% of its steps on);
 * - every `shortEvery`-th run stops early (at 45% of its task's steps);
 * - bookkeeping columns a real log carries (`wall_seconds`, `lr`) beside the metrics `score`
 *   (higher is better) and `train_loss` (lower is better).
 * Pure apart from `writeStudy`. Cost O(runs x rows).
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { createRandom, deriveSeed, type Random } from '../../src/stats/random.js';

export interface StudySpec {
  /** Config keys and their values, in folder order; the configs are their cross product. */
  readonly keys: Readonly<Record<string, readonly string[]>>;
  /** Number of tasks; 0 writes no task level (one implicit task). */
  readonly tasks: number;
  readonly seeds: number;
  /** Rows logged per run (before a short run stops). */
  readonly rows: number;
  /** Every n-th run diverges (0: none). */
  readonly crashEvery: number;
  /** Every n-th run stops early (0: none). */
  readonly shortEvery: number;
  /** Seed of every random draw. */
  readonly seed: number;
  /** The config's effect on its final level, in units of the between-seed sd (0 = no effect). */
  readonly effect: (params: Readonly<Record<string, string>>) => number;
}

/** One planned run: its folder values and what was planted. */
export interface StudyRun {
  readonly task: string | null;
  readonly params: Readonly<Record<string, string>>;
  readonly seed: number;
  readonly path: string;
  readonly lastStep: number;
  readonly diverges: boolean;
  readonly short: boolean;
}

export interface StudyFile {
  readonly path: string;
  readonly text: string;
}

/** A task's scale and length: the lantern puzzles differ in both. */
export interface StudyTask {
  readonly name: string;
  /** Final score of an untreated run, and its between-seed sd. */
  readonly level: number;
  readonly sd: number;
  /** Score of an untrained model. */
  readonly floor: number;
  readonly lastStep: number;
}

/** Task i of a study: every third puzzle scores points (in the hundreds), the rest a fraction solved. */
export function studyTask(i: number): StudyTask {
  const name = `lantern-${String(i + 1).padStart(3, '0')}`;
  const lastStep = 400 + 200 * (i % 4);
  if (i % 3 === 2) return { name, level: 300 + 10 * (i % 7), sd: 12, floor: 20, lastStep };
  return { name, level: 0.55 + 0.04 * (i % 8), sd: 0.015, floor: 0.05, lastStep };
}

function gauss(random: Random): number {
  const u = 1 - random.next();
  const v = random.next();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

const fmt = (x: number): string => (Number.isFinite(x) ? Number(x.toPrecision(6)).toString() : 'nan');

function crossProduct(keys: StudySpec['keys']): Record<string, string>[] {
  let out: Record<string, string>[] = [{}];
  for (const [key, values] of Object.entries(keys)) {
    out = out.flatMap((p) => values.map((v) => ({ ...p, [key]: v })));
  }
  return out;
}

/** Every run of the study in folder order (tasks, then configs, then seeds). */
export function studyRuns(spec: StudySpec): StudyRun[] {
  const tasks = spec.tasks === 0 ? [null] : Array.from({ length: spec.tasks }, (_, i) => studyTask(i));
  const out: StudyRun[] = [];
  let index = 0;
  for (const task of tasks) {
    for (const params of crossProduct(spec.keys)) {
      for (let seed = 0; seed < spec.seeds; seed++) {
        index += 1;
        const folders = [
          ...(task === null ? [] : [`task=${task.name}`]),
          ...Object.entries(params).map(([k, v]) => `${k}=${v}`),
          `seed=${seed}`,
        ];
        const full = task?.lastStep ?? 1000;
        const diverges = spec.crashEvery > 0 && index % spec.crashEvery === 0;
        const short = !diverges && spec.shortEvery > 0 && index % spec.shortEvery === 0;
        out.push({
          task: task?.name ?? null,
          params,
          seed,
          path: `${folders.join('/')}/log.csv`,
          lastStep: short ? Math.round(full * 0.45) : full,
          diverges,
          short,
        });
      }
    }
  }
  return out;
}

function runLog(spec: StudySpec, run: StudyRun, task: StudyTask): string {
  const random = createRandom(deriveSeed(spec.seed, run.path));
  const level = task.level + task.sd * (spec.effect(run.params) + gauss(random));
  const every = task.lastStep / spec.rows;
  const lines = ['step,train_loss,score,wall_seconds,lr'];
  for (let r = 1; r * every <= run.lastStep + 1e-9; r++) {
    const step = Math.round(r * every);
    const t = step / task.lastStep;
    const progress = 1 - Math.exp(-4 * t);
    const gone = run.diverges && t >= 0.6;
    const score = gone ? NaN : task.floor + (level - task.floor) * progress + 0.2 * task.sd * gauss(random);
    const loss = gone ? NaN : 2.2 * (1 - progress) + 0.3 + 0.02 * Math.abs(gauss(random));
    const wall = step * (0.05 + 0.002 * random.next());
    lines.push([String(step), fmt(loss), fmt(score), fmt(wall), fmt(1e-3 * (1 - 0.9 * t))].join(','));
  }
  return `${lines.join('\n')}\n`;
}

/** The study's files (path relative to the study folder, CSV text). Deterministic for a spec. */
export function generateStudy(spec: StudySpec): StudyFile[] {
  return studyRuns(spec).map((run) => {
    const i = run.task === null ? -1 : Number(run.task.slice('lantern-'.length)) - 1;
    const task = i < 0 ? { ...studyTask(0), lastStep: 1000 } : studyTask(i);
    return { path: run.path, text: runLog(spec, run, task) };
  });
}

/** Write the study under `dir` (emptied first). Returns the number of files written. */
export function writeStudy(dir: string, spec: StudySpec): number {
  rmSync(dir, { recursive: true, force: true });
  const files = generateStudy(spec);
  for (const f of files) {
    const path = join(dir, f.path);
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(path, f.text);
  }
  return files.length;
}

const METHODS = ['base', 'halt-early', 'wide-sync', 'deep-memory', 'tick-dropout'] as const;
const METHOD_EFFECT: Readonly<Record<string, number>> = {
  base: 0,
  'halt-early': -2,
  'wide-sync': 0,
  'deep-memory': 3,
  'tick-dropout': 0.5,
};

/** 100 puzzles x 5 methods x 3 seeds (1,500 runs): an across-task study. Baseline `method=base`, task key `task`. */
export const TASKS_STUDY: StudySpec = {
  keys: { method: METHODS },
  tasks: 100,
  seeds: 3,
  rows: 20,
  crashEvery: 97,
  shortEvery: 89,
  seed: 15,
  effect: (p) => METHOD_EFFECT[p.method ?? ''] ?? 0,
};

/**
 * 7 tick counts x 6 memory lengths x 4 widths = 168 configs x 10
 * seeds (1,680 runs): a sweep. Baseline `ticks=8,memory=4,width=128`.
 */
export const SWEEP_STUDY: StudySpec = {
  keys: {
    ticks: ['4', '8', '12', '16', '24', '32', '48'],
    memory: ['2', '4', '8', '12', '16', '24'],
    width: ['64', '128', '256', '512'],
  },
  tasks: 0,
  seeds: 10,
  rows: 25,
  crashEvery: 211,
  shortEvery: 173,
  seed: 168,
  // More ticks help up to 32 (diminishing), memory does not, a wider readout helps a little.
  effect: (p) =>
    2.5 * Math.log2(Math.min(Number(p.ticks ?? 8), 32) / 8) + 0.5 * Math.log2(Number(p.width ?? 128) / 128),
};
