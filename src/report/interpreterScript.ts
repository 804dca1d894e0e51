/**
 * Vega's CSP-safe expression interpreter (the `vega-interpreter` package) as a classic script.
 *
 * The package ships one build, an ES module that imports three helpers from `vega-util` and
 * exports `expressionInterpreter`. A report page cannot load modules (its Content-Security-Policy
 * lets only hashed inline scripts run, and a page opened from a file has no module resolution),
 * but the Vega runtime inlined before it already carries the same `vega-util` helpers on its
 * global `vega`. So the module's single `import { ... } from 'vega-util'` line becomes a read of
 * those names from `vega`, its single `export { X as expressionInterpreter }` line becomes the
 * global `vegaInterpreter`, and the whole is wrapped in a function so nothing else leaks. Any other
 * shape of the file (another import or export, a helper missing from `vega` at run time) is
 * refused rather than guessed at: on the page the script then throws before defining
 * `vegaInterpreter`, and the charts stay as drawn.
 */

const IMPORT = /^import\s*\{([^}]*)\}\s*from\s*'vega-util';[ \t]*$/m;
const EXPORT = /^export\s*\{\s*([A-Za-z_$][\w$]*)\s+as\s+expressionInterpreter\s*\};[ \t]*$/m;
const SOURCE_MAP = /^\/\/# sourceMappingURL=.*$/gm;
const IDENTIFIER = /^[A-Za-z_$][\w$]*$/;

/**
 * Turn the text of `vega-interpreter/build/vega-interpreter.js` into a classic script that, run
 * after `vega.min.js`, defines `window.vegaInterpreter` (the object Vega's `View` takes as `expr`).
 * Cost O(length). Throws an Error naming what it found when the module does not have exactly one
 * `vega-util` import of plain names and one `expressionInterpreter` export and no other import or
 * export statement (a different build; seedsift must then be updated, not guess).
 * Example: `interpreterScript("import { a } from 'vega-util';\nconst e = {};\nexport { e as expressionInterpreter };")`
 * → `"(function (vega) {\n'use strict';\nif (...) throw ...;\n" +`
 * `"var a = vega.a;\n...window.vegaInterpreter = e;\n})(vega);\n"`.
 */
export function interpreterScript(moduleText: string): string {
  const imports = moduleText.match(new RegExp(IMPORT.source, 'gm')) ?? [];
  const exports = moduleText.match(new RegExp(EXPORT.source, 'gm')) ?? [];
  if (imports.length !== 1 || exports.length !== 1) {
    throw new Error(
      `vega-interpreter: expected one import from 'vega-util' and one export of expressionInterpreter, ` +
        `found ${imports.length} and ${exports.length}`,
    );
  }
  const names = (IMPORT.exec(moduleText)?.[1] ?? '')
    .split(',')
    .map((n) => n.trim())
    .filter((n) => n !== '');
  const bad = names.filter((n) => !IDENTIFIER.test(n));
  if (names.length === 0 || bad.length > 0)
    throw new Error(`vega-interpreter: cannot read the imported names (${bad.join(', ') || 'none'})`);
  const exported = EXPORT.exec(moduleText)?.[1] ?? '';
  const body = moduleText.replace(IMPORT, '').replace(EXPORT, '').replace(SOURCE_MAP, '');
  const other = /^\s*(import|export)\b/m.exec(body);
  if (other !== null) throw new Error(`vega-interpreter: unexpected ${other[1]} statement in the module`);
  const check = names.map((n) => `typeof vega.${n} === 'undefined'`).join(' || ');
  return [
    '(function (vega) {',
    "'use strict';",
    `if (${check}) throw new Error('vega-interpreter: the inlined Vega runtime lacks a helper it needs');`,
    `var ${names.map((n) => `${n} = vega.${n}`).join(', ')};`,
    body.trim(),
    `window.vegaInterpreter = ${exported};`,
    '})(vega);',
    '',
  ].join('\n');
}
