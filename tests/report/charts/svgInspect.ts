/**
 * Reading Vega's SVG output in tests. Vega's SVG string renderer writes each named mark as
 * `<g class="mark-TYPE role-mark NAME_marks" ...>` holding one leaf element per item (a `<path>`
 * for lines, areas, symbols and rects, a `<line>` for rules, a `<text>` for text); a Vega-Lite
 * layer named `NAME` compiles to the mark `NAME_marks`. Faceted marks (one path per config) repeat
 * the group, so items are collected over every group with that name.
 */

/** The leaf elements of every group of the mark `${layer}_marks`. */
export function markItems(svg: string, layer: string): string[] {
  const items: string[] = [];
  const open = new RegExp(`<g class="mark-[a-z]+ role-mark ${layer}_marks"[^>]*>`, 'g');
  for (const match of svg.matchAll(open)) {
    const start = (match.index ?? 0) + match[0].length;
    const end = svg.indexOf('</g>', start);
    const body = svg.slice(start, end);
    for (const el of body.matchAll(/<(path|line|text)\b[^>]*?(?:\/>|>[^<]*<\/text>)/g)) items.push(el[0]);
  }
  return items;
}

/** The value of one attribute of an element, or null. */
export function attr(element: string, name: string): string | null {
  const m = new RegExp(`\\s${name}="([^"]*)"`).exec(element);
  return m === null ? null : (m[1] ?? null);
}

/** The number of subpaths (move-to commands) of a path item. */
export function subpaths(element: string): number {
  return (attr(element, 'd') ?? '').match(/M/g)?.length ?? 0;
}

/**
 * Whether an item visibly draws: a path whose `d` has a drawing command after a move-to
 * (L, H, V, C, A, Q, h, v, l, ...), a line of non-zero length, or a text with content.
 */
export function drawn(element: string): boolean {
  if (element.startsWith('<path')) return /M[^MZ]*[LHVCSQTAlhvcsqta]/.test(attr(element, 'd') ?? '');
  if (element.startsWith('<line'))
    return Number(attr(element, 'x2') ?? 0) !== 0 || Number(attr(element, 'y2') ?? 0) !== 0;
  return />[^<]+<\/text>$/.test(element);
}

/** The translate(x, y) of an item. */
export function translate(element: string): { x: number; y: number } {
  const m = /translate\(([-\d.e]+),([-\d.e]+)\)/.exec(attr(element, 'transform') ?? '');
  return { x: Number(m?.[1] ?? NaN), y: Number(m?.[2] ?? NaN) };
}

/** Every `field` name used anywhere in a spec (encodings, sorts, orders). */
export function fieldNames(spec: unknown): string[] {
  const out: string[] = [];
  const walk = (node: unknown, key: string): void => {
    if (key === 'values') return; // inline data rows: their keys are checked separately
    if (Array.isArray(node)) for (const n of node) walk(n, '');
    else if (node !== null && typeof node === 'object') {
      for (const [k, v] of Object.entries(node)) {
        if (k === 'field' && typeof v === 'string') out.push(v);
        walk(v, k);
      }
    }
  };
  walk(spec, '');
  return out;
}

/** Every key of every inline data row in a spec. */
export function dataKeys(spec: unknown): string[] {
  const out = new Set<string>();
  const walk = (node: unknown): void => {
    if (Array.isArray(node)) node.forEach(walk);
    else if (node !== null && typeof node === 'object') {
      for (const [k, v] of Object.entries(node)) {
        if (k === 'values' && Array.isArray(v)) {
          for (const row of v)
            if (row !== null && typeof row === 'object') for (const key of Object.keys(row)) out.add(key);
        } else walk(v);
      }
    }
  };
  walk(spec);
  return [...out];
}

/** A mark of a compiled Vega spec by name, searched through nested group marks. */
export function vegaMark(
  spec: { readonly marks?: readonly unknown[] },
  name: string,
): { name?: string; encode?: { update?: Record<string, unknown> } } | undefined {
  for (const m of spec.marks ?? []) {
    const mark = m as { name?: string; marks?: readonly unknown[]; encode?: { update?: Record<string, unknown> } };
    if (mark.name === name) return mark;
    const inner = vegaMark(mark, name);
    if (inner !== undefined) return inner;
  }
  return undefined;
}
