/**
 * How a long job reports that it is advancing (the command line draws it on a terminal:
 * src/cli/progress.ts). Each stage counts its own items: files whose heads were looked at, files
 * read, metrics compared, charts drawn.
 */

/** The stages that report progress, in the order a report goes through them. */
export type ProgressStage = 'headers' | 'reading' | 'comparing' | 'drawing';

/** Called as work advances: `done` items of `total` in `stage` (called with done = total at the end of a stage). */
export type ProgressHook = (stage: ProgressStage, done: number, total: number) => void;
