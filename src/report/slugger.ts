/**
 * Heading ids for one page: readable, ASCII, unique within the page, and the same for the same
 * page every time (no counters shared between renders: each render makes its own slugger).
 */

/**
 * Make a slugger: each call turns text into a lowercase ASCII id (letters, digits, single
 * dashes, at most 48 characters; `section` when nothing is left) and appends `-2`, `-3`, ... to
 * ids already given out by this slugger.
 * Cost O(length) per call. Never throws.
 * Example: `const slug = createSlugger(); slug('Val acc!'); slug('val acc')` → `'val-acc'`, then `'val-acc-2'`.
 */
export function createSlugger(): (text: string) => string {
  const used = new Map<string, number>();
  return (text: string): string => {
    const base =
      text
        .normalize('NFKD')
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-+|-+$/g, '')
        .slice(0, 48)
        .replace(/-+$/, '') || 'section';
    let id = base;
    let count = used.get(base) ?? 0;
    while (used.has(id)) {
      count += 1;
      id = `${base}-${count + 1}`;
    }
    used.set(base, count);
    used.set(id, used.get(id) ?? 0);
    return id;
  };
}
