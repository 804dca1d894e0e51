/**
 * Writes the demo study in sample-runs/ (deterministic: same bytes every time).
 *
 * The scenario (invented for seedsift's demo): a lab trains a tick-based recurrent classifier on
 * synthetic "glyph counting" puzzles (count the marks in a small procedurally drawn image). It
 * tries three variants of the puzzle, the tasks, varies the number of internal ticks (8, 16, 32)
 * and the activation-memory length (4, 12), 5 seeds each: 90 runs. Layout:
 * task=<t>/ticks=<k>/memory=<m>/seed=<s>/metrics.csv (Hive-style folders); the demo is reported
 * with --task-key task, so every comparison is made within a task and the tasks are aggregated.
 *
 * The tasks differ in scale and length (what the across-task overview must cope with):
 * - count: 10 classes, 2000 steps, val_acc near 0.78 at 8 ticks (the original demo; its runs
 *   are drawn from the same random streams as before the other tasks were added).
 * - count-dense: crowded images, 20 classes, 1500 steps, val_acc near 0.52, ticks help more.
 * - count-sparse: few marks, 10 classes, 800 steps, val_acc near 0.93, near its ceiling.
 *
 * Planted effects (what a correct analysis must find; tests rely on these):
 * - val_acc at the end of training, gain over 8 ticks: count +0.03 at 16 ticks, +0.05 at 32;
 *   count-dense +0.06 and +0.10; count-sparse +0.01 and +0.015. Memory length has NO effect on any
 *   task. Seed-to-seed spread (sd of a run's level) 0.006 (count-dense 0.01); evaluation noise 0.003.
 * - val_loss mirrors val_acc (lower with more ticks), memory has no effect.
 * - per-tick accuracy val_acc@k rises with k and plateaus; more ticks reach a higher plateau.
 * - certainty@k rises with k.
 *
 * Each task's random streams start at its own base (see TASKS): the bases were chosen so that
 * this one draw of the null memory comparisons does not fall among the 5% of draws where a test at
 * alpha 0.05 calls a null difference significant (count keeps the base 2000 it always had). That
 * seedsift holds its false-positive rate is tested separately, on 1,000 null experiments
 * (tests/analysis/analyze.test.ts).
 *
 * Messy cases planted on purpose (each must be reported, none silently lost), all in task count:
 * - ticks=32/memory=12/seed=4 diverges: train_loss and val_loss become nan from step 1400 on.
 * - ticks=16/memory=4/seed=2 was resumed: steps 1000..1190 are logged twice (the later rows win).
 * - ticks=8/memory=12/seed=3 stops early at step 1300 (the others reach 2000).
 * - train rows (every 10 steps) and eval rows (every 100 steps) share one file, so eval columns
 *   are empty on train rows.
 *
 * Per-sample tick dumps at the final checkpoint (columns sample, tick, correct, certainty,
 * confidence, step; gzipped) for task count, ticks=8/memory=4 and ticks=32/memory=4: later ticks
 * are more often correct and more certain; confidence is over-confident at early ticks.
 *
 * Run: npm run sample-runs
 */
import { mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { createRandom, type Random } from '../src/stats/random.js';

const root = dirname(fileURLToPath(import.meta.url));
const TICKS = [8, 16, 32] as const;
const MEMORY = [4, 12] as const;
const SEEDS = 5;
const TRAIN_EVERY = 10;
const EVAL_EVERY = 100;
const SAMPLES = 300;

/** One variant of the puzzle: its scale (accuracy level, chance, gains) and its length. */
interface Task {
  readonly name: string;
  /** val_acc at the end of training with 8 ticks. */
  readonly level: number;
  /** Accuracy of a guess (1 / classes). */
  readonly chance: number;
  /** Gain in val_acc over 8 ticks, by ticks. */
  readonly gain: Readonly<Record<number, number>>;
  /** Seed-to-seed sd of a run's level. */
  readonly spread: number;
  readonly lastStep: number;
  /** First seed of the task's random streams (one stream per run). */
  readonly streams: number;
}

const TASKS: readonly Task[] = [
  {
    name: 'count',
    level: 0.78,
    chance: 0.1,
    gain: { 8: 0, 16: 0.03, 32: 0.05 },
    spread: 0.006,
    lastStep: 2000,
    streams: 2000,
  },
  {
    name: 'count-dense',
    level: 0.52,
    chance: 0.05,
    gain: { 8: 0, 16: 0.06, 32: 0.1 },
    spread: 0.01,
    lastStep: 1500,
    streams: 3000,
  },
  {
    name: 'count-sparse',
    level: 0.93,
    chance: 0.1,
    gain: { 8: 0, 16: 0.01, 32: 0.015 },
    spread: 0.006,
    lastStep: 800,
    streams: 4000,
  },
];

function gauss(random: Random): number {
  // Box-Muller; 1 - next() keeps the argument of log in (0, 1].
  const u = 1 - random.next();
  const v = random.next();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

const fmt = (x: number): string => (Number.isFinite(x) ? Number(x.toPrecision(6)).toString() : 'nan');

interface RunPlan {
  task: Task;
  ticks: number;
  memory: number;
  seed: number;
}

function writeRun(plan: RunPlan, random: Random): void {
  const { task, ticks, memory, seed } = plan;
  const dir = join(root, `task=${task.name}`, `ticks=${ticks}`, `memory=${memory}`, `seed=${seed}`);
  mkdirSync(dir, { recursive: true });
  const chance = task.chance;
  const level = task.level + (task.gain[ticks] ?? 0) + task.spread * gauss(random);
  const speed = 1 + 0.03 * gauss(random);
  const messy = task.name === 'count';
  const diverges = messy && ticks === 32 && memory === 12 && seed === 4;
  const resumed = messy && ticks === 16 && memory === 4 && seed === 2;
  const stopsAt = messy && ticks === 8 && memory === 12 && seed === 3 ? 1300 : task.lastStep;
  const tickCols = Array.from({ length: ticks }, (_, k) => `val_acc@${k}`);
  const certCols = Array.from({ length: ticks }, (_, k) => `certainty@${k}`);
  // The loss of a guess, -ln(chance), to one decimal: 2.3 for 10 classes, 3 for 20.
  const start = Number((-Math.log(chance)).toFixed(1));
  const header = ['step', 'train_loss', 'val_loss', 'val_acc', ...tickCols, ...certCols];
  const lines = [header.join(',')];
  const row = (step: number, jitter: number): string => {
    const progress = 1 - Math.exp(-(step / task.lastStep) * 4 * speed);
    const acc = chance + (level - chance) * progress;
    const gone = diverges && step >= 1400;
    const trainLoss = gone
      ? NaN
      : start * (1 - progress) + 0.25 - 0.5 * (level - task.level) + 0.03 * Math.abs(gauss(random)) + jitter;
    const cells = [String(step), fmt(trainLoss)];
    if (step % EVAL_EVERY === 0) {
      const valAcc = acc + 0.003 * gauss(random) + jitter;
      const valLoss = gone ? NaN : start * (1 - progress) + 0.45 - 1.5 * (level - task.level) + 0.02 * gauss(random);
      cells.push(fmt(valLoss), fmt(valAcc));
      for (let k = 0; k < ticks; k++) {
        const reach = 1 - Math.exp(-(k + 1) / (ticks / 4));
        cells.push(fmt(chance + (valAcc - chance) * reach + 0.004 * gauss(random)));
      }
      for (let k = 0; k < ticks; k++) {
        const c = (0.2 + 0.75 * (1 - Math.exp(-(k + 1) / (ticks / 3)))) * (0.5 + 0.5 * progress);
        cells.push(fmt(Math.min(1, Math.max(0, c + 0.01 * gauss(random)))));
      }
    } else {
      cells.push(...new Array<string>(2 + 2 * ticks).fill(''));
    }
    return cells.join(',');
  };
  for (let step = TRAIN_EVERY; step <= stopsAt; step += TRAIN_EVERY) {
    lines.push(row(step, 0));
    if (resumed && step === 1190) {
      // The job was killed after step 1190 and resumed from the checkpoint at step 990.
      for (let again = 1000; again <= 1190; again += TRAIN_EVERY) lines.push(row(again, 0.001));
    }
  }
  writeFileSync(join(dir, 'metrics.csv'), `${lines.join('\n')}\n`);
  if (messy && memory === 4 && (ticks === 8 || ticks === 32)) writeDump(dir, ticks, level, task.lastStep, random);
}

/** A per-sample tick dump at the final checkpoint. */
function writeDump(dir: string, ticks: number, level: number, lastStep: number, random: Random): void {
  const lines = ['sample,tick,correct,certainty,confidence,step'];
  for (let s = 0; s < SAMPLES; s++) {
    const ease = random.next();
    // A sample is solvable with a probability near the run's accuracy level; it is solved from
    // some tick on (easier samples earlier), with a few flips from tick to tick.
    const solvable = random.next() < Math.min(0.99, level + 0.15 * (ease - 0.5));
    const solvedFrom = Math.floor(ticks * 0.7 * (1 - ease) * random.next());
    for (let t = 0; t < ticks; t++) {
      const reach = 1 - Math.exp(-(t + 1) / (ticks / 4));
      const solved = solvable && t >= solvedFrom;
      const correct = random.next() < 0.03 ? !solved : solved;
      const certainty = Math.min(
        1,
        Math.max(0, reach * (0.35 + 0.6 * ease) + (solved ? 0.1 : -0.05) + 0.05 * gauss(random)),
      );
      const pCorrect = 0.1 + (level - 0.1) * reach;
      const confidence = Math.min(0.999, Math.max(0.1, pCorrect + 0.25 * (1 - reach) + 0.05 * gauss(random)));
      lines.push(`${s},${t},${correct ? 1 : 0},${fmt(certainty)},${fmt(confidence)},${lastStep}`);
    }
  }
  writeFileSync(join(dir, 'ticks.csv.gz'), gzipSync(Buffer.from(`${lines.join('\n')}\n`), { level: 9 }));
}

function main(): void {
  for (const old of readdirSync(root)) {
    if (old.includes('=')) rmSync(join(root, old), { recursive: true, force: true });
  }
  for (const task of TASKS) {
    let index = 0;
    for (const ticks of TICKS) {
      for (const memory of MEMORY) {
        for (let seed = 0; seed < SEEDS; seed++) {
          writeRun({ task, ticks, memory, seed }, createRandom(task.streams + index++));
        }
      }
    }
  }
  process.stdout.write(`wrote ${TASKS.length * TICKS.length * MEMORY.length * SEEDS} runs to sample-runs/\n`);
}

main();
