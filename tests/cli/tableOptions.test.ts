/**
 * The options tables drive the command line, the notebook front matter and results.json settings;
 * these tests hold README, commander, the front matter keys and the JSON schema to the tables, so
 * an option added to a table and not documented (or documented and not built) fails here.
 */
import { readFileSync } from 'node:fs';
import { Option } from 'commander';
import { describe, expect, it } from 'vitest';
import { ANALYSIS_OPTIONS } from '../../src/analysis/analysisOptions.js';
import { longName } from '../../src/analysis/optionSpec.js';
import { optionSettings, resolveOptions } from '../../src/analysis/options.js';
import { READING_OPTIONS } from '../../src/analysis/readingOptions.js';
import { buildProgram } from '../../src/cli/program.js';
import { OPTION_TABLES, tableValues } from '../../src/cli/tableOptions.js';
import { parseNotebook } from '../../src/report/parseNotebook.js';
import { memoryIo } from './memoryIo.js';

const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');

/** The long option names in the first column of the Markdown table under a heading. */
function readmeTable(heading: string): string[] {
  const at = readme.indexOf(heading);
  expect(at, `README heading ${heading}`).toBeGreaterThanOrEqual(0);
  const rest = readme.slice(at + heading.length);
  const next = rest.search(/\n#{2,3} /);
  const section = next < 0 ? rest : rest.slice(0, next);
  return [...section.matchAll(/^\| `(?:-\w, )?(--?[a-z][a-z0-9-]*)/gm)].map((m) => m[1] as string);
}

function commandOptions(name: string): string[] {
  const program = buildProgram(memoryIo(), () => undefined);
  const command = program.commands.find((c) => c.name() === name);
  if (command === undefined) throw new Error(`no command ${name}`);
  return command.options.map((o) => o.long as string);
}

describe('the options tables', () => {
  it("README's report and reading tables list exactly the options of seedsift report", () => {
    const documented = [...readmeTable('### `seedsift report PATH...`'), ...readmeTable('### Options for reading')];
    expect([...documented].sort()).toEqual([...commandOptions('report')].sort());
  });

  it("README's reading table lists exactly the reading options, and scan and digest take them all", () => {
    const reading = Object.values(READING_OPTIONS).map((s) => longName(s.flag));
    expect(readmeTable('### Options for reading').sort()).toEqual([...reading].sort());
    for (const name of ['scan', 'digest', 'seeds'])
      expect(commandOptions(name)).toEqual(expect.arrayContaining(reading));
  });

  it("README's front-matter table lists exactly the options of the front matter only", () => {
    const frontOnly = Object.values(OPTION_TABLES)
      .filter((s) => s.commands.length === 0)
      .map((s) => s.front);
    const documented = [...readme.slice(readme.indexOf('### Notebook front matter')).matchAll(/^\| `([a-z-]+)` \|/gm)]
      .map((m) => m[1])
      .slice(0, frontOnly.length);
    expect(documented.sort()).toEqual([...frontOnly].sort());
  });

  it('every entry with a front-matter key reads it back from a notebook, as the command line would', () => {
    for (const [key, spec] of Object.entries(OPTION_TABLES)) {
      if (spec.front === null) continue;
      const value = spec.shape === 'goals' ? '{ acc: max }' : spec.shape === 'boolean' ? 'true' : '0.5';
      const front = parseNotebook(`---\n${spec.front}: ${value}\n---\n`, 'n.md').options as Record<string, unknown>;
      expect(Object.keys(front), spec.front).toEqual([key]);
      // The command line's attribute name (commander) is the table key, or the entry says how it maps.
      const typed = tableValues(OPTION_TABLES, { [new Option(spec.flag).attributeName()]: 'x' });
      expect(Object.keys(typed)).toEqual([key]);
    }
  });

  it('the command line overrides the front matter, and --metric goals merge per metric name', () => {
    const merged = tableValues(
      OPTION_TABLES,
      { alpha: '0.01', metric: ['acc:min'] },
      { alpha: 0.1, seed: 3, metricGoals: ['acc:max', 'loss:min'] },
    );
    expect(merged).toEqual({ alpha: '0.01', seed: 3, metricGoals: ['acc:min', 'loss:min'] });
  });

  it('--diverged, the old name of --failed, gives failed and loses to --failed (README report options)', () => {
    const failed = (opts: Record<string, unknown>, front: Record<string, string> = {}): string =>
      resolveOptions(tableValues(ANALYSIS_OPTIONS, opts, front)).failed;
    expect(failed({})).toBe('exclude');
    expect(failed({ diverged: 'worst' })).toBe('worst');
    expect(failed({ failed: 'exclude', diverged: 'worst' })).toBe('exclude');
    expect(failed({}, { diverged: 'worst' })).toBe('worst');
    // Typed on the command line, the old name beats the front matter's failed, as any typed option does.
    expect(failed({ diverged: 'worst' }, { failed: 'exclude' })).toBe('worst');
    expect(failed({}, { failed: 'worst', diverged: 'exclude' })).toBe('worst');
    expect(() => failed({ diverged: 'keep' })).toThrow("--diverged: expected exclude, worst, got 'keep'");
    expect(Object.keys(resolveOptions({}))).not.toContain('diverged');
  });

  it('level is 1 - alpha unless given (the intervals are unadjusted; METHODS.md "Defaults")', () => {
    expect(resolveOptions({ alpha: '0.1' }).level).toBeCloseTo(0.9, 15);
    expect(resolveOptions({ alpha: '0.1', level: 0.8 }).level).toBe(0.8);
  });

  it("results.json settings are the table's entries with a setting, and match the schema's", () => {
    const schema = JSON.parse(
      readFileSync(new URL('../../src/report/results.schema.json', import.meta.url), 'utf8'),
    ) as { properties: { settings: { required: string[]; properties: Record<string, unknown> } } };
    const settings = optionSettings(resolveOptions({ baseline: 'memory=4', summary: 'last:10%' }));
    expect(Object.keys(settings).sort()).toEqual([...schema.properties.settings.required].sort());
    expect(Object.keys(schema.properties.settings.properties)).toEqual(Object.keys(settings));
    expect(settings).toMatchObject({ baseline: 'memory=4', summary: 'last:10%', alpha: 0.05, failOn: null });
    const withSetting = Object.entries(ANALYSIS_OPTIONS).filter(([, s]) => 'setting' in s);
    // summaryDescription (main, issue 13) is the summary in words, not an option of its own.
    expect(Object.keys(settings).filter((k) => k !== 'summaryDescription')).toEqual(withSetting.map(([k]) => k));
  });
});
