import { describe, expect, it } from 'vitest';
import { fileFormat, logStem } from '../../../src/ingest/locate/fileFormat.js';

// Expected values: the file kinds listed in DESIGN.md "Inputs" (.csv, .tsv, .txt, .parquet, any gzipped).
describe('fileFormat', () => {
  it.each([
    ['log.csv', 'csv', false],
    ['log.tsv', 'tsv', false],
    ['log.txt', 'txt', false],
    ['log.parquet', 'parquet', false],
    ['log.csv.gz', 'csv', true],
    ['log.tsv.gz', 'tsv', true],
    ['log.txt.gz', 'txt', true],
    ['log.parquet.gz', 'parquet', true],
    ['LOG.CSV.GZ', 'csv', true],
    ['runs/seed=3/eval.Parquet', 'parquet', false],
    ['a.b.c.csv', 'csv', false],
  ] as const)('%s is %s (gzip %s)', (name, format, gzip) => {
    expect(fileFormat(name)).toEqual({ format, gzip });
  });

  it.each([
    'log.json',
    'log.gz',
    'log.csv.bak',
    'log.csv.zip',
    'params.json',
    '.csv',
    'runs/.csv',
    'csv',
    'README',
    'log.csvx',
  ])('%s is not a log file', (name) => {
    expect(fileFormat(name)).toBeNull();
  });
});

describe('logStem', () => {
  it('drops the log extension, gzip included', () => {
    expect(logStem('seed=3.csv')).toBe('seed=3');
    expect(logStem('seed=3.csv.gz')).toBe('seed=3');
    expect(logStem('a.b.parquet')).toBe('a.b');
  });
  it('leaves other names alone', () => {
    expect(logStem('seed=3')).toBe('seed=3');
    expect(logStem('notes.json')).toBe('notes.json');
    expect(logStem('.csv')).toBe('.csv');
  });
});
