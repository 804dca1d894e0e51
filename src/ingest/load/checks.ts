/**
 * Problems that concern a file or the set of files rather than a run: malformed rows
 * (`row-malformed`, one per row up to `LISTED_MALFORMED` per file, then one with the count of the
 * rest), files with no data rows (`file-empty`), duplicate column names (`column-duplicated`),
 * the columns a `--seed-columns` file does not use (`aggregate-columns-ignored`, `column-unused`),
 * columns with no number anywhere (`column-not-numeric`) and files whose columns differ from the
 * study's most common set (`header-drift`; columns are matched by name, so order does not matter,
 * and per-tick columns `name@k` count as one `name@*`, since configs with different numbers of
 * ticks legitimately log different tick columns).
 */
import type { FileData, FileToRead } from './loadFiles.js';
import { draft, type Draft } from '../lines/drafts.js';

/** Malformed rows listed one by one per file. */
export const LISTED_MALFORMED = 20;

/**
 * The problems of one read file (see the module comment). Pure.
 * Example: a CSV whose line 5 has too few fields gives a `row-malformed` draft pointing at DuckDB's record 5.
 */
export function fileDrafts(data: FileData): Draft[] {
  const file = data.header.source.file;
  const drafts: Draft[] = [];
  const malformed = data.rejects.length + data.malformed.length;
  for (const r of data.rejects.slice(0, LISTED_MALFORMED)) {
    const column = r.column === null ? '' : ` (column ${data.header.names[r.column] ?? r.column})`;
    drafts.push(
      draft(
        'row-malformed',
        `row rejected, the run keeps its other rows: ${r.type.toLowerCase()}: ${r.message}${column}`,
        {
          file,
          rows: [{ data, kind: 'record', n: r.record }],
        },
      ),
    );
  }
  for (const n of data.malformed.slice(0, Math.max(0, LISTED_MALFORMED - data.rejects.length)))
    drafts.push(
      draft(
        'row-malformed',
        'row rejected, the run keeps its other rows: ' +
          `expected ${data.header.names.length} whitespace-separated fields`,
        { file, rows: [{ data, kind: 'dataRow', n }] },
      ),
    );
  if (malformed > LISTED_MALFORMED)
    drafts.push(
      draft(
        'row-malformed',
        `${malformed - LISTED_MALFORMED} more malformed row(s) were rejected (${malformed} in all)`,
        { file },
      ),
    );
  if (data.rows === 0 && malformed === 0)
    drafts.push(draft('file-empty', 'the file has a header but no data rows; no run is built from it', { file }));
  if (data.plan.duplicated.length > 0)
    drafts.push(
      draft(
        'column-duplicated',
        `duplicate column name(s) ${data.plan.duplicated.join(', ')}; the later ones were renamed with a suffix ` +
          `(_2, _3, ...)`,
        { file },
      ),
    );
  if (data.plan.aggregates.length > 0)
    drafts.push(
      draft(
        'aggregate-columns-ignored',
        `columns that look like aggregates were ignored: ${data.plan.aggregates.join(', ')}`,
        { file },
      ),
    );
  if (data.plan.unmatched.length > 0)
    drafts.push(
      draft(
        'column-unused',
        `columns matching no --seed-columns pattern were not used: ${data.plan.unmatched.join(', ')}`,
        { file },
      ),
    );
  return drafts;
}

/**
 * `column-not-numeric` notes, one per column name, naming up to 3 files. Pure.
 * Example: `{ phase: ['a.csv'] }` gives "phase holds no numbers ... (a.csv)".
 */
export function notNumericDrafts(notNumeric: ReadonlyMap<string, readonly string[]>): Draft[] {
  return [...notNumeric].map(([name, files]) => {
    const more = files.length > 3 ? ` and ${files.length - 3} more` : '';
    return draft(
      'column-not-numeric',
      `column ${name} holds no numbers in any file and is not a metric (${files.slice(0, 3).join(', ')}${more})`,
      files.length === 1 ? { file: files[0] as string } : {},
    );
  });
}

/**
 * `header-drift` notes: the log files are grouped by their set of column names; every group but
 * the largest (the first seen on ties) gets one note naming its first file, its size, and the
 * columns missing and extra against the largest group. Pure, O(files x columns).
 * Example: 9 files with step, loss and 1 with step, loss, acc give one note: "1 file(s) ... extra: acc".
 */
export function headerDrift(items: readonly FileToRead[]): Draft[] {
  const groups = new Map<string, { names: string[]; files: string[] }>();
  for (const item of items) {
    if (item.plan.kind !== 'log') continue;
    const names = [...new Set(item.plan.names.map((n) => n.replace(/@\d+$/, '@*')))].sort();
    const key = JSON.stringify(names);
    const g = groups.get(key) ?? { names, files: [] };
    g.files.push(item.header.source.file);
    groups.set(key, g);
  }
  if (groups.size < 2) return [];
  const all = [...groups.values()];
  const main = all.reduce((a, b) => (b.files.length > a.files.length ? b : a));
  return all
    .filter((g) => g !== main)
    .map((g) => {
      const missing = main.names.filter((n) => !g.names.includes(n));
      const extra = g.names.filter((n) => !main.names.includes(n));
      const diff = [
        missing.length > 0 ? `missing: ${missing.join(', ')}` : '',
        extra.length > 0 ? `extra: ${extra.join(', ')}` : '',
      ]
        .filter((s) => s !== '')
        .join('; ');
      return draft(
        'header-drift',
        `${g.files.length} file(s) have other columns than the ${main.files.length} file(s) like ` +
          `${main.files[0] as string} (${diff}); columns were matched by name`,
        { file: g.files[0] as string },
      );
    });
}
