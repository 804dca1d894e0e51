/**
 * The shape of one entry of the options table (`readingOptions.ts`, `analysisOptions.ts`) and the
 * parsers its entries share. An entry says everything about one option in one place: its flag and
 * help text (commander), the commands that take it, its notebook front-matter key and the shape of
 * the value there, its default, how a given value is parsed and checked, and (for analysis options)
 * how it appears in `results.json` settings. The command line, the front matter, `resolveOptions`
 * and the settings block are all derived from the table, so adding an option is one entry plus
 * the code that uses its value; the compiler checks that the resolved record has every field.
 */
import { SeedsiftError } from '../problems.js';
import { parseSelector, type Selector } from './selectors.js';

/** Commands that take options from the table. */
export type CommandName = 'scan' | 'report' | 'digest' | 'seeds';

/** The shape of a value in notebook front matter. */
/**
 * `csv`: a YAML list or comma-separated text, joined with commas; `list`: a YAML
 * list or one text, kept as a list (for values that hold commas, such as selectors).
 */
export type FrontShape = 'text' | 'number' | 'boolean' | 'csv' | 'list' | 'goals';

/**
 * A value as given: a string (or list of strings, for a repeatable
 * option) from the command line; YAML scalars from front matter.
 */
export type RawValue = string | number | boolean | readonly string[];

/** A value of `results.json` settings. */
export type SettingValue = string | number | boolean | null | readonly string[] | Readonly<Record<string, string>>;

/** One option (see the module comment). `T` is its resolved type. */
export interface OptionSpec<T> {
  /** Commander's flag, e.g. `--alpha <a>`, `--paired`; its long name is the option's name in every message. */
  readonly flag: string;
  /** Help text with an example of a value. */
  readonly help: string;
  /** Commands that take it on the command line; empty for an option of the front matter only. */
  readonly commands: readonly CommandName[];
  /** Front-matter key (a long option name), or null when the front matter cannot give it. */
  readonly front: string | null;
  readonly shape: FrontShape;
  /** Given several times on the command line, the values are collected into a list. */
  readonly repeatable?: true;
  /** The value when neither the command line nor the front matter gives one. */
  readonly fallback: T;
  /** Parse and check a given value; throws SeedsiftError('usage') naming `option`. */
  parse(raw: RawValue, option: string): T;
  /** How the command line's value combines with the front matter's (default: the command line's wins). */
  merge?(front: RawValue, cli: RawValue): RawValue;
  /** Its entry in `results.json` settings, when it has one. */
  setting?(value: T): SettingValue;
  /**
   * The key of the entry this one is an older name of (`--diverged` for `--failed`): given while
   * that entry is not, its parsed value becomes that entry's; it resolves to no field of its own.
   */
  readonly aliasOf?: string;
}

/** An entry that appears in `results.json` settings, with the type of its setting kept. */
export type ReportedSpec<T, S extends SettingValue> = OptionSpec<T> & { setting(value: T): S };

/**
 * An entry, with `T` inferred from its `fallback` and `parse` (and the type of its setting, when
 * it has one, from `setting`). The methods are bivariant, so every entry fits `AnyOption`.
 */
export function option<T, S extends SettingValue>(spec: ReportedSpec<T, S>): ReportedSpec<T, S>;
export function option<T>(spec: OptionSpec<T>): OptionSpec<T>;
export function option<T>(spec: OptionSpec<T>): OptionSpec<T> {
  return spec;
}

/** An entry that is an older name of another (see `aliasOf`); kept out of the resolved record. */
export type AliasSpec<T> = OptionSpec<T> & { readonly aliasOf: string };

/** An older name of the entry `aliasOf` (see `OptionSpec.aliasOf`). */
export function alias<T>(spec: AliasSpec<T>): AliasSpec<T> {
  return spec;
}

/** Any entry. */
export type AnyOption = OptionSpec<unknown>;

/** The resolved record a table describes. */
export type ResolvedBy<Table> = {
  readonly [K in keyof Table as Table[K] extends { readonly aliasOf: string } ? never : K]: Table[K] extends OptionSpec<
    infer T
  >
    ? T
    : never;
};

/** Raw values keyed like the table (every field optional; null or '' count as not given). */
export type RawBy<Table> = { readonly [K in keyof Table]?: RawValue | null | undefined };

/** The settings block a table describes: the entries with a `setting`. */
type SettingOf<Spec> = Spec extends { setting(value: never): infer S } ? S : never;
export type SettingsBy<Table> = {
  readonly [K in keyof Table as [SettingOf<Table[K]>] extends [never] ? never : K]: SettingOf<Table[K]>;
};

/** The long name of a flag: `-o, --out <file>` → `--out`. */
export function longName(flag: string): string {
  const found = /--[a-z][a-z0-9-]*/.exec(flag);
  if (found === null) throw new Error(`option flag without a long name: ${flag}`);
  return found[0];
}

/** Whether a raw value counts as given. */
export function given(raw: RawValue | null | undefined): raw is RawValue {
  return raw !== undefined && raw !== null && !(typeof raw === 'string' && raw.trim() === '');
}

/**
 * Resolve every entry of a table: the given value parsed by its entry, else its fallback.
 * Cost O(entries). Throws the first entry's SeedsiftError.
 */
export function resolveTable<Table extends Record<string, AnyOption>>(
  table: Table,
  raw: RawBy<Table>,
): ResolvedBy<Table> {
  const out: Record<string, unknown> = {};
  for (const [key, spec] of Object.entries(table)) {
    if (spec.aliasOf !== undefined) continue;
    const value = raw[key as keyof Table];
    out[key] = given(value) ? spec.parse(value, longName(spec.flag)) : spec.fallback;
  }
  for (const [key, spec] of Object.entries(table)) {
    const value = raw[key as keyof Table];
    if (spec.aliasOf === undefined || !given(value) || given(raw[spec.aliasOf as keyof Table])) continue;
    out[spec.aliasOf] = spec.parse(value, longName(spec.flag));
  }
  return out as ResolvedBy<Table>;
}

/** The settings block of resolved values (entries with a `setting`, in table order). */
export function settingsOfTable<Table extends Record<string, AnyOption>>(
  table: Table,
  resolved: ResolvedBy<Table>,
): SettingsBy<Table> {
  const out: Record<string, SettingValue> = {};
  for (const [key, spec] of Object.entries(table))
    if (spec.setting !== undefined) out[key] = spec.setting((resolved as Record<string, unknown>)[key]);
  return out as SettingsBy<Table>;
}

// Parsers shared by the entries. Each throws SeedsiftError('usage') naming the option.

function scalar(raw: RawValue, option: string): string | number | boolean {
  if (typeof raw === 'object') throw new SeedsiftError('usage', `${option}: expected one value, got ${raw.length}`);
  return raw;
}

function toNumber(v: string | number | boolean): number {
  if (typeof v === 'number') return v;
  return typeof v === 'boolean' || v.trim() === '' ? NaN : Number(v);
}

/** Text, trimmed. */
export const text =
  () =>
  (raw: RawValue, option: string): string => {
    const v = scalar(raw, option);
    if (typeof v === 'boolean') throw new SeedsiftError('usage', `${option}: expected text, got ${String(v)}`);
    return String(v).trim();
  };

/** A number in a range: `open` (low, high), `closed` [low, high], `closed-low` [low, high). */
export const numberIn =
  (low: number, high: number, ends: 'open' | 'closed' | 'closed-low') =>
  (raw: RawValue, option: string): number => {
    const v = toNumber(scalar(raw, option));
    const ok =
      Number.isFinite(v) &&
      (ends === 'open' ? v > low && v < high : ends === 'closed' ? v >= low && v <= high : v >= low && v < high);
    if (!ok) {
      const range = ends === 'open' ? `in (${low}, ${high})` : ends === 'closed' ? `in [${low}, ${high}]` : `>= ${low}`;
      throw new SeedsiftError('usage', `${option}: expected a number ${range}, got ${String(raw)}`);
    }
    return v;
  };

/** An integer from low to high. */
export const integerIn =
  (low: number, high: number) =>
  (raw: RawValue, option: string): number => {
    const v = toNumber(scalar(raw, option));
    if (!Number.isInteger(v) || v < low || v > high)
      throw new SeedsiftError('usage', `${option}: expected an integer from ${low} to ${high}, got ${String(raw)}`);
    return v;
  };

/** One of a fixed set of words. */
export const oneOf =
  <W extends string>(allowed: readonly W[]) =>
  (raw: RawValue, option: string): W => {
    const v = String(scalar(raw, option)).trim();
    const found = allowed.find((a) => a === v);
    if (found === undefined)
      throw new SeedsiftError('usage', `${option}: expected ${allowed.join(', ')}, got '${String(raw)}'`);
    return found;
  };

/** A switch: true, or true/false/yes/no/1/0 as text. */
export const booleanOf =
  () =>
  (raw: RawValue, option: string): boolean => {
    const r = scalar(raw, option);
    if (typeof r === 'boolean') return r;
    const v = String(r).trim().toLowerCase();
    if (v === 'true' || v === 'yes' || v === '1' || v === '') return true;
    if (v === 'false' || v === 'no' || v === '0') return false;
    throw new SeedsiftError('usage', `${option}: expected true or false, got '${String(r)}'`);
  };

/** Comma-separated names (or a list of them, from a repeated option or YAML), trimmed, empty ones dropped. */
export function splitList(raw: RawValue): string[] {
  const parts = typeof raw === 'object' ? raw.flatMap((r) => String(r).split(',')) : String(raw).split(',');
  return parts.map((s) => s.trim()).filter((s) => s !== '');
}

/** Selectors (`key=value[,key=value]`), one per value of a repeated option or per item of a YAML list. */
export const selectors =
  () =>
  (raw: RawValue, option: string): readonly Selector[] =>
    (typeof raw === 'object' ? raw : [String(raw)]).map((t) => parseSelector(String(t).trim(), option));

/** A non-empty comma-separated list of names. */
export const names =
  () =>
  (raw: RawValue, option: string): readonly string[] => {
    const out = splitList(raw);
    if (out.length === 0) throw new SeedsiftError('usage', `${option}: expected a comma-separated list of names`);
    return out;
  };
