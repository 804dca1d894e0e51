/** The calibration cell: says which noise the ECE band and the reliability whiskers show. */
import { describe, expect, it } from 'vitest';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

describe('{{calibration}}', () => {
  it('names the band as between seeds and the reliability whiskers as between examples, seeds pooled', async () => {
    const html = await renderCells('{{calibration}}', sampleResults());
    const text = textOf(html);
    expect(text).toContain(
      'Which noise: the band is the 95% interval across seeds (the spread between training runs).',
    );
    expect(text).toContain(
      "The reliability diagrams below pool every seed's samples, so their whiskers show only the " +
        'between-example noise of each bin.',
    );
    expect(html).toContain('<th scope="col" class="num">ECE last tick [95% across seeds]</th>');
    // One ECE chart and one reliability diagram per config.
    expect([...html.matchAll(/<figure class="chart"/g)]).toHaveLength(1 + sampleResults().calibration.length);
  });
});
