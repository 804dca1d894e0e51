/**
 * Cautions grouped by kind (issue 15: hundreds of comparisons read as a handful of kinds). The
 * expected groups are counted by hand from the comparisons built here (first principles).
 */
import { describe, expect, it } from 'vitest';
import type { CautionKind, Comparison } from '../../src/analysis/results.js';
import {
  cautionGroupText,
  cautionListHtml,
  cautionListMarkdown,
  groupCautionsByKind,
  KIND_LINES,
  SCOPE_NAMES,
} from '../../src/report/cautionGroups.js';
import { sampleResults } from './sampleResults.js';

const template = sampleResults().comparisons[0] as Comparison;

/** A comparison `c<i> v base` carrying the given cautions. */
function comparison(i: number, cautions: [CautionKind, string][]): Comparison {
  return {
    ...template,
    candidate: `c${i}`,
    baseline: 'base',
    cautions: cautions.map(([, line]) => line),
    cautionKinds: cautions.map(([kind]) => kind),
  };
}

describe('groupCautionsByKind', () => {
  it('one group per kind in first-seen order, each comparison counted once, lines said once', () => {
    const list = [
      comparison(1, [
        ['goal-guessed', 'guessed'],
        ['unequal-seeds', 'unequal (4 v 5)'],
      ]),
      comparison(2, [
        ['goal-guessed', 'guessed'],
        ['unequal-seeds', 'unequal (3 v 5)'],
      ]),
      comparison(3, [['goal-guessed', 'guessed']]),
    ];
    const groups = groupCautionsByKind(list);
    expect(groups.map((g) => [g.kind, g.comparisons.length, g.all, g.lines.length])).toEqual([
      ['goal-guessed', 3, true, 1],
      ['unequal-seeds', 2, false, 2],
    ]);
    expect(cautionListMarkdown(list, (n) => n)).toEqual([
      '- **goal guessed from the name: all 3 comparisons**. guessed',
      '- **unequal seed counts: 2 comparisons**.',
      '  - c1 v base: unequal (4 v 5)',
      '  - c2 v base: unequal (3 v 5)',
    ]);
  });

  it(`names at most ${SCOPE_NAMES} comparisons per line and shows at most ${KIND_LINES} lines per kind`, () => {
    const many = Array.from({ length: 10 }, (_, i) => comparison(i, [['failed-runs', `failed ${i % 5}`]]));
    const same = Array.from({ length: 9 }, (_, i) => comparison(i, [['tests-disagree', 'disagree']]));
    const [failed] = groupCautionsByKind(many);
    const t = cautionGroupText(failed as NonNullable<typeof failed>, (n) => n);
    expect(t.head).toBe('failed runs: all 10 comparisons');
    // 5 distinct lines (i % 5), each on 2 comparisons: 3 shown, the other 2 lines (4 comparisons) counted.
    expect(t.items).toHaveLength(KIND_LINES + 1);
    expect(t.items[0]).toEqual({ scope: 'c0 v base; c5 v base', line: 'failed 0' });
    expect(t.items[KIND_LINES]).toEqual({
      scope: '2 more lines of this kind',
      line: "on 4 comparisons, each in results.json and in its metric's details",
    });
    // One line on 9 of 10 comparisons: 6 named and 3 counted.
    const [disagree] = groupCautionsByKind([...same, comparison(99, [])]);
    const d = cautionGroupText(disagree as NonNullable<typeof disagree>, (n) => n);
    expect(d.head).toBe('tests disagree: 9 comparisons');
    expect(d.items[0]?.scope).toBe(`${[0, 1, 2, 3, 4, 5].map((i) => `c${i} v base`).join('; ')}; and 3 more`);
  });

  it('HTML: escaped, the metric named when the list spans metrics', () => {
    const html = cautionListHtml([comparison(1, [['not-run', '<b>x</b>']])], true);
    expect(html).toBe(
      `<ul class="cautions"><li><strong>tests or intervals not computed: 1 comparison.</strong> ` +
        `${template.metric}, c1 v base: &lt;b&gt;x&lt;/b&gt;</li></ul>`,
    );
    expect(cautionListHtml([comparison(1, [])])).toBe('');
  });
});
