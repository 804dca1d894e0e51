/**
 * The files a report page is built from: the layout and its partials, the style sheet and the
 * small client script (all under templates/), the Vega runtime (vega/build/vega.min.js) and Vega's
 * CSP-safe expression interpreter (vega-interpreter, turned into a classic script by
 * `interpreterScript`). `renderReport` reads them once per page (about 0.5 MB, a millisecond or
 * two); nothing is kept between calls, so there is no module-level state.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { interpreterScript } from './interpreterScript.js';
import { TEMPLATES_DIR } from './templatePaths.js';

export interface ReportAssets {
  readonly layout: string;
  readonly partials: Readonly<Record<'header' | 'toc' | 'footer', string>>;
  readonly css: string;
  readonly hydrate: string;
  readonly vega: string;
  /** Defines the global `vegaInterpreter`; runs after `vega`, before `hydrate`. */
  readonly interpreter: string;
}

/** An inline script must not contain `</script` (it would end the element early). */
function inlineSafe(name: string, text: string): string {
  if (/<\/script/i.test(text) || /<!--/.test(text))
    throw new Error(`${name}: cannot be inlined (contains </script or <!--)`);
  return text;
}

/**
 * Read and return the report's assets.
 * Cost: reads about 0.5 MB. Throws the file system's error when an asset is missing (a broken
 * installation), and an Error when a script or style sheet could not be inlined safely or the
 * interpreter's build has an unexpected shape (see `interpreterScript`).
 * Example: `loadReportAssets().vega.length` → about 520,000.
 */
export function loadReportAssets(): ReportAssets {
  const read = (file: string): string => readFileSync(join(TEMPLATES_DIR, file), 'utf8');
  const require = createRequire(import.meta.url);
  const vegaFile = join(dirname(require.resolve('vega')), 'vega.min.js');
  // The package's only export is its ES module build (build/vega-interpreter.js).
  const interpreterFile = require.resolve('vega-interpreter');
  const css = read('report.css');
  if (/<\/style/i.test(css)) throw new Error('report.css: cannot be inlined (contains </style)');
  return {
    layout: read('layout.hbs'),
    partials: {
      header: read('partials/header.hbs'),
      toc: read('partials/toc.hbs'),
      footer: read('partials/footer.hbs'),
    },
    css,
    hydrate: inlineSafe('hydrate.js', read('hydrate.js')),
    vega: inlineSafe('vega.min.js', readFileSync(vegaFile, 'utf8')),
    interpreter: inlineSafe('vega-interpreter.js', interpreterScript(readFileSync(interpreterFile, 'utf8'))),
  };
}
