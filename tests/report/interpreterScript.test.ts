/**
 * interpreterScript: the vega-interpreter ES module turned into a classic script. Checked against
 * Vega itself (external): the script, run in a bare context with the `vega` package as its global,
 * defines `vegaInterpreter`, and a Vega view parsed with `{ ast: true }` and evaluated by it computes
 * the same signal and encoding values as Vega's own compiled expressions; a different build shape
 * is refused.
 */
import { readFileSync } from 'node:fs';
import { runInNewContext } from 'node:vm';
import * as vega from 'vega';
import { describe, expect, it } from 'vitest';
import { interpreterScript } from '../../src/report/interpreterScript.js';

const MODULE = readFileSync(
  new URL('../../node_modules/vega-interpreter/build/vega-interpreter.js', import.meta.url),
  'utf8',
);

/**
 * Run the script as a page would, with `vega`, `window` and the timer functions a browser has; return what it
 * put on window.
 */
function load(script: string, vegaGlobal: unknown): Record<string, unknown> {
  const window: Record<string, unknown> = {};
  runInNewContext(script, { vega: vegaGlobal, window, setTimeout, setInterval });
  return window;
}

/** A spec whose signals and marks go through expressions (arithmetic, a function, a datum field). */
const SPEC = {
  width: 100,
  height: 50,
  signals: [
    { name: 'a', value: 2 },
    { name: 'b', update: 'a * 21' },
    { name: 'c', update: "format(b / 4, '.2f') + ' units'" },
  ],
  data: [
    {
      name: 'rows',
      values: [
        { x: 1, y: 3 },
        { x: 2, y: 5 },
      ],
      transform: [{ type: 'formula', as: 'z', expr: 'datum.x * 10 + datum.y' }],
    },
  ],
  marks: [
    {
      type: 'rect',
      name: 'bars',
      from: { data: 'rows' },
      encode: {
        update: {
          x: { signal: 'datum.z' },
          width: { value: 1 },
          y: { value: 0 },
          height: { signal: 'datum.x > 1 ? 7 : 4' },
        },
      },
    },
  ],
} as const;

async function evaluate(expr: unknown): Promise<{ b: unknown; c: unknown; z: unknown[]; heights: unknown[] }> {
  const spec = SPEC as unknown as vega.Spec;
  const runtime = expr === undefined ? vega.parse(spec) : vega.parse(spec, undefined, { ast: true });
  const view = new vega.View(runtime, {
    renderer: 'none',
    ...(expr === undefined ? {} : { expr }),
  } as vega.ViewOptions);
  await view.runAsync();
  const out = {
    b: view.signal('b'),
    c: view.signal('c'),
    z: (view.data('rows') as { z: unknown }[]).map((r) => r.z),
    heights:
      (
        view.scenegraph() as unknown as { root: { items: { items: { items: { height: unknown }[] }[] }[] } }
      ).root.items[0]?.items[0]?.items.map((i) => i.height) ?? [],
  };
  view.finalize();
  return out;
}

describe('interpreterScript', () => {
  it('defines vegaInterpreter from the installed build, using the helpers of the vega global', () => {
    const script = interpreterScript(MODULE);
    expect(script).not.toMatch(/^\s*(import|export)\b/m);
    expect(script).not.toContain('sourceMappingURL');
    const window = load(script, vega);
    const interpreter = window.vegaInterpreter as Record<string, unknown>;
    for (const key of ['operator', 'parameter', 'event', 'handler', 'encode'])
      expect(typeof interpreter[key]).toBe('function');
  });

  it('evaluates expressions as Vega itself does (parse with ast: true, View with expr)', async () => {
    const interpreter = load(interpreterScript(MODULE), vega).vegaInterpreter as Record<
      string,
      (...args: unknown[]) => unknown
    >;
    // Count the interpreter's calls, so a View that ignored `expr` (and compiled instead) would fail here.
    let calls = 0;
    const counted = Object.fromEntries(
      Object.entries(interpreter).map(([k, f]) => [
        k,
        (...args: unknown[]) => {
          calls++;
          return f(...args);
        },
      ]),
    );
    const reference = await evaluate(undefined);
    expect(reference).toEqual({ b: 42, c: '10.50 units', z: [13, 25], heights: [4, 7] });
    expect(await evaluate(counted)).toEqual(reference);
    expect(calls).toBeGreaterThanOrEqual(4);
  });

  it('throws in the page, before defining anything, when the vega global lacks a helper', () => {
    const { isString: _dropped, ...partial } = vega as unknown as Record<string, unknown>;
    expect(() => load(interpreterScript(MODULE), partial)).toThrow(/lacks a helper/);
  });

  it('refuses a build of another shape instead of guessing', () => {
    const body = 'const e = {};';
    const ok = `import { a, b } from 'vega-util';\n${body}\nexport { e as expressionInterpreter };\n`;
    expect(interpreterScript(ok)).toContain('var a = vega.a, b = vega.b;');
    expect(() => interpreterScript(`${body}\nexport { e as expressionInterpreter };`)).toThrow(
      /one import from 'vega-util'/,
    );
    expect(() => interpreterScript(`import { a } from 'vega-util';\n${body}`)).toThrow(
      /one export of expressionInterpreter/,
    );
    expect(() =>
      interpreterScript(
        `import { a } from 'vega-util';\nimport { c } from 'd3';\n${body}\nexport { e as expressionInterpreter };`,
      ),
    ).toThrow(/unexpected import/);
    expect(() =>
      interpreterScript(`import { a as b } from 'vega-util';\n${body}\nexport { e as expressionInterpreter };`),
    ).toThrow(/cannot read the imported names/);
  });
});
