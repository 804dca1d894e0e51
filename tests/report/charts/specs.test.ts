/**
 * Every chart builder, on the fixture and on hostile names: the spec validates against the JSON
 * schema that ships with vega-lite (external: node_modules/vega-lite/build/vega-lite-schema.json,
 * the check vega-lite's own examples test makes), compiles and renders without warnings, draws
 * every layer it declares, renders byte-identically twice, and uses only fixed field names.
 *
 * Ajv setup (compiled once here, the schema takes seconds to compile):
 *   - draft-07 is Ajv 8's default dialect, which is what the schema declares;
 *   - `strict: false`: the schema uses keywords and union types Ajv's strict mode rejects;
 *     `allowUnionTypes: true` is stated for the same reason should strict mode be re-enabled;
 *   - `inlineRefs: false` and `code.optimize: false`: same validation, ~3x faster compile;
 *   - formats: the schema names `color-hex`, `uri` and `uri-reference`; `color-hex` and `uri` are
 *     checked (hex colour pattern, WHATWG URL parse), `uri-reference` is accepted as any string.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import AjvModule from 'ajv';
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { calibrationChart } from '../../../src/report/charts/calibrationChart.js';
import { compareChart } from '../../../src/report/charts/compareChart.js';
import { curvesChart } from '../../../src/report/charts/curvesChart.js';
import { exitHistogramChart } from '../../../src/report/charts/exitHistogramChart.js';
import { haltingChart } from '../../../src/report/charts/haltingChart.js';
import { reliabilityChart } from '../../../src/report/charts/reliabilityChart.js';
import { ticksChart } from '../../../src/report/charts/ticksChart.js';
import { valuesChart } from '../../../src/report/charts/valuesChart.js';
import { compileVegaWithWarnings, renderSvgWithWarnings } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, type FixtureNames, makeResults } from '../fixtures.js';
import { dataKeys, drawn, fieldNames, markItems } from './svgInspect.js';

const Ajv = AjvModule.default;
const schemaPath = createRequire(import.meta.url).resolve('vega-lite/vega-lite-schema.json');
const ajv = new Ajv({
  strict: false,
  allowUnionTypes: true,
  inlineRefs: false,
  code: { optimize: false },
  formats: { 'color-hex': /^#(?:[0-9a-fA-F]{3}){1,2}$/, uri: (s: string) => URL.canParse(s), 'uri-reference': true },
});
const validate = ajv.compile(JSON.parse(readFileSync(schemaPath, 'utf8')) as object);

function schemaErrors(spec: unknown): string {
  return validate(spec) ? '' : ajv.errorsText(validate.errors, { separator: '\n' });
}

function charts(results: Results, names: FixtureNames): [string, TopLevelSpec | null][] {
  return [
    ['curvesChart', curvesChart(results, names.metric)],
    ['valuesChart', valuesChart(results, names.metric, names.summary)],
    ['compareChart', compareChart(results, names.metric, names.summary)],
    ['ticksChart', ticksChart(results, names.tickMetric)],
    ['haltingChart', haltingChart(results)],
    ['exitHistogramChart', exitHistogramChart(results, names.configs[1])],
    ['calibrationChart', calibrationChart(results)],
    ['reliabilityChart', reliabilityChart(results, names.configs[1])],
  ];
}

/** The mark names a spec declares: its layers' names, or its own name for a single view. */
function layerNames(spec: TopLevelSpec): string[] {
  if ('layer' in spec) return spec.layer.map((l) => ('name' in l && typeof l.name === 'string' ? l.name : ''));
  return ['name' in spec && typeof spec.name === 'string' ? spec.name : ''];
}

/** One render per spec object, shared by the tests of that spec. */
const renders = new Map<TopLevelSpec, ReturnType<typeof renderSvgWithWarnings>>();
function rendered(spec: TopLevelSpec): ReturnType<typeof renderSvgWithWarnings> {
  let r = renders.get(spec);
  if (r === undefined) {
    r = renderSvgWithWarnings(spec);
    renders.set(spec, r);
  }
  return r;
}

const HOSTILE: FixtureNames = {
  configs: ['</script><img src=x onerror=alert(1)>', 'a.b[0]"\'', 'x&y <b>bold</b>'],
  metric: '</script><img src=x onerror=alert(1)>',
  tickMetric: 'a.b[0]"\'',
  summary: 'step:5"<i>',
};

describe('the schema check itself (so a pass means something)', () => {
  it('rejects a spec with an unknown mark and accepts a minimal valid one', () => {
    expect(schemaErrors({ mark: 'pointy', data: { values: [] } })).not.toBe('');
    expect(
      schemaErrors({
        mark: 'point',
        data: { values: [{ a: 1 }] },
        encoding: { x: { field: 'a', type: 'quantitative' } },
      }),
    ).toBe('');
    expect(schemaErrors({ mark: 'point', encoding: { x: { field: 'a', type: 'ratio' } } })).not.toBe('');
  });
});

for (const [label, names] of [
  ['fixture', DEFAULT_NAMES],
  ['hostile names', HOSTILE],
] as const) {
  describe(`every chart builder (${label})`, () => {
    const results = makeResults(names);
    for (const [name, spec] of charts(results, names)) {
      describe(name, () => {
        it('builds a spec that validates against the vega-lite JSON schema', () => {
          expect(spec).not.toBeNull();
          expect(schemaErrors(spec)).toBe('');
        });

        it('compiles without warnings and uses only fixed field names', () => {
          const s = spec as TopLevelSpec;
          expect(compileVegaWithWarnings(s).warnings).toEqual([]);
          for (const f of [...fieldNames(s), ...dataKeys(s)]) expect(f).toMatch(/^[A-Za-z][A-Za-z0-9]*$/);
        });

        it('renders every declared layer with drawn marks (and identically twice on the fixture)', async () => {
          const s = spec as TopLevelSpec;
          const first = await rendered(s);
          expect(first.warnings).toEqual([]);
          if (names !== HOSTILE) expect((await renderSvgWithWarnings(s)).svg).toBe(first.svg);
          for (const layer of layerNames(s)) {
            expect(layer).not.toBe('');
            const items = markItems(first.svg, layer);
            expect(items.length, `${name}: layer ${layer} has items`).toBeGreaterThan(0);
            expect(items.some(drawn), `${name}: layer ${layer} draws`).toBe(true);
          }
        });

        if (names === HOSTILE) {
          it('shows hostile names only escaped', async () => {
            const { svg } = await rendered(spec as TopLevelSpec);
            // The names did reach the SVG (escaped), so the checks below are not vacuous. The
            // per-config charts are drawn for configs[1] (a.b[0]"'); the others show configs[0].
            expect(svg).toContain('a.b[0]');
            if (name !== 'exitHistogramChart' && name !== 'reliabilityChart')
              expect(svg).toContain('&lt;/script&gt;&lt;img src=x onerror=alert(1)&gt;');
            const tags = svg.match(/<[^>]*>/g) ?? [];
            const elements = new Set(tags.map((t) => /^<\/?([a-zA-Z:]+)/.exec(t)?.[1] ?? t));
            expect(
              [...elements].filter(
                (e) =>
                  !['svg', 'g', 'path', 'line', 'text', 'rect', 'title', 'desc', 'defs', 'clipPath', 'tspan'].includes(
                    e,
                  ),
              ),
            ).toEqual([]);
            for (const tag of tags) {
              // Attribute values are quoted with " and contain no raw " (Vega escapes it), so
              // removing quoted values leaves only element and attribute names.
              const bare = tag.replace(/"[^"]*"/g, '""');
              expect(bare).toMatch(/^<\/?[a-zA-Z:]+(\s+[a-zA-Z][a-zA-Z0-9:-]*="")*\s*\/?>$/);
              expect(bare).not.toMatch(/\son[a-z]+=/);
            }
            const text = svg.replace(/<[^>]*>/g, '');
            expect(text).not.toMatch(/[<>]/);
          });
        }
      });
    }
  });
}
