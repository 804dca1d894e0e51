/**
 * Every problem code is documented for users: README.md's "What seedsift does with bad input"
 * table lists each code of src/problems.ts with its severity, and no code that does not exist.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { PROBLEM_CODES, problem, SeedsiftError } from '../src/problems.js';

const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
const section = readme.slice(readme.indexOf('## What seedsift does with bad input'));
const rows = [...section.matchAll(/^\| `([a-z-]+)` \| (error|warning|note) \|/gm)].map((m) => [m[1], m[2]]);

describe('problem codes', () => {
  it('are all in the README table with their severity, and the table has no others', () => {
    expect(Object.fromEntries(rows)).toEqual(
      Object.fromEntries(Object.entries(PROBLEM_CODES).map(([code, c]) => [code, c.severity])),
    );
  });

  it('build records with the severity of their code and only the places given', () => {
    expect(problem('steps-duplicated', 'm', { file: 'a.csv', line: 3 })).toEqual({
      severity: 'note',
      code: 'steps-duplicated',
      message: 'm',
      file: 'a.csv',
      line: 3,
    });
    expect(Object.keys(problem('run-short', 'm'))).toEqual(['severity', 'code', 'message']);
  });

  it('SeedsiftError names the file and line after the message', () => {
    expect(new SeedsiftError('input', 'bad', { file: 'runs/a.csv', line: 42 }).message).toBe('bad (runs/a.csv:42)');
    expect(new SeedsiftError('usage', 'bad').message).toBe('bad');
  });
});
