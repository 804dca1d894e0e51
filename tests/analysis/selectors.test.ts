import { describe, expect, it } from 'vitest';
import { checkSelector, matchesSelector, parseSelector, valuesOf } from '../../src/analysis/selectors.js';
import { at } from '../support/at.js';

const configs = [
  { params: { ticks: '8', memory: '4' } },
  { params: { ticks: '8', memory: '12' } },
  { params: { ticks: '16', memory: '4' } },
  { params: { ticks: '16', memory: '8' } },
];

describe('parseSelector', () => {
  it('parses key=value pairs, trimming spaces; a value may hold =', () => {
    expect(parseSelector(' memory = 4 , ticks=8').pairs).toEqual([
      { key: 'memory', value: '4' },
      { key: 'ticks', value: '8' },
    ]);
    expect(parseSelector('opt=a=b').pairs).toEqual([{ key: 'opt', value: 'a=b' }]);
  });

  it('rejects malformed selectors with the option name', () => {
    expect(() => parseSelector('')).toThrow('--baseline: expected key=value[,key=value], got an empty selector');
    expect(() => parseSelector('memory')).toThrow("--baseline: expected key=value[,key=value], got 'memory'");
    expect(() => parseSelector('memory=4,')).toThrow('--baseline');
    expect(() => parseSelector('memory=4,memory=8')).toThrow("key 'memory' named twice");
    expect(() => parseSelector('seed=3')).toThrow('the seed is not part of a config');
  });
});

describe('checkSelector', () => {
  it('accepts a selector that matches a config', () => {
    expect(() => checkSelector(parseSelector('memory=4'), configs, ['ticks', 'memory'], null)).not.toThrow();
    expect(matchesSelector(at(configs, 0).params, parseSelector('memory=4,ticks=8'))).toBe(true);
    expect(matchesSelector(at(configs, 1).params, parseSelector('memory=4'))).toBe(false);
  });

  it('lists the available values when nothing matches, and the keys when a key is unknown', () => {
    expect(() => checkSelector(parseSelector('memory=5'), configs, ['ticks', 'memory'], null)).toThrow(
      '--baseline: memory=5 matches no config; memory takes 4, 8, 12',
    );
    expect(() => checkSelector(parseSelector('memory=12,ticks=16'), configs, ['ticks', 'memory'], null)).toThrow(
      'memory takes 4, 8, 12; ticks takes 8, 16',
    );
    expect(() => checkSelector(parseSelector('width=2'), configs, ['ticks', 'memory'], null)).toThrow(
      "--baseline: no config key 'width'; keys are ticks, memory",
    );
    expect(() => checkSelector(parseSelector('ticks=8'), configs, ['ticks', 'memory'], 'ticks')).toThrow(
      'is the task key',
    );
  });

  it('valuesOf sorts numbers by value', () => {
    expect(valuesOf(configs, 'memory')).toEqual(['4', '8', '12']);
  });
});
