/**
 * Problems: everything seedsift noticed about its input or its own results that a reader should
 * know. Soft problems are collected (never printed by library code) and travel to every output;
 * hard errors are thrown as a `SeedsiftError` and become exit code 2 at the command line.
 *
 * Every code is documented in `PROBLEM_CODES` with what it means and what the user should do; the
 * README's "What seedsift does with bad input" table is checked against this table by a test.
 */
import { PROBLEM_CODES, type Severity } from './problemCodes.js';

export { PROBLEM_CODES, type Severity } from './problemCodes.js';

export type ProblemCode = keyof typeof PROBLEM_CODES;

/** One recorded problem. `file` is relative to the working directory; `line` is 1-based. */
export interface Problem {
  readonly severity: Severity;
  readonly code: ProblemCode;
  readonly message: string;
  readonly file?: string;
  readonly line?: number;
  readonly run?: string;
}

/** Build a problem with the severity of its code. */
export function problem(
  code: ProblemCode,
  message: string,
  where: { file?: string; line?: number; run?: string } = {},
): Problem {
  const p: { -readonly [K in keyof Problem]: Problem[K] } = { severity: PROBLEM_CODES[code].severity, code, message };
  if (where.file !== undefined) p.file = where.file;
  if (where.line !== undefined) p.line = where.line;
  if (where.run !== undefined) p.run = where.run;
  return p;
}

/** Codes of hard errors: what the user typed or supplied cannot be used at all (exit 2). */
export type ErrorCode = 'usage' | 'input' | 'notebook' | 'output';

/**
 * The one error class for user-facing failures. The message reads
 * "what: expected X, got Y (file:line)"; the command line prints it on one line and exits 2.
 */
export class SeedsiftError extends Error {
  readonly code: ErrorCode;
  readonly file: string | undefined;
  readonly line: number | undefined;
  constructor(code: ErrorCode, message: string, where: { file?: string; line?: number } = {}) {
    const place = where.file === undefined ? '' : ` (${where.file}${where.line === undefined ? '' : `:${where.line}`})`;
    super(message + place);
    this.name = 'SeedsiftError';
    this.code = code;
    this.file = where.file;
    this.line = where.line;
  }
}
