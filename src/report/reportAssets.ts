/**
 * The files a report page is built from: the layout and its partials, the style sheet and the
 * small client script (all under templates/), and the Vega runtime (vega/build/vega.min.js).
 * `renderReport` reads them once per page (about 0.6 MB, a millisecond or two); nothing is kept
 * between calls, so there is no module-level state.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { TEMPLATES_DIR } from './templatePaths.js';

export interface ReportAssets {
  readonly layout: string;
  readonly partials: Readonly<Record<'header' | 'toc' | 'footer', string>>;
  readonly css: string;
  readonly hydrate: string;
  readonly vega: string;
}

/** An inline script must not contain `</script` (it would end the element early). */
function inlineSafe(name: string, text: string): string {
  if (/<\/script/i.test(text) || /<!--/.test(text)) throw new Error(`${name}: cannot be inlined (contains </script or <!--)`);
  return text;
}

/**
 * Read and return the report's assets.
 * Cost: reads about 0.6 MB. Throws the file system's error when an asset is missing (a broken
 * installation), and an Error when a script or style sheet could not be inlined safely.
 * Example: `loadReportAssets().vega.length` → about 520,000.
 */
export function loadReportAssets(): ReportAssets {
  const read = (file: string): string => readFileSync(join(TEMPLATES_DIR, file), 'utf8');
  const require = createRequire(import.meta.url);
  const vegaFile = join(dirname(require.resolve('vega')), 'vega.min.js');
  const css = read('report.css');
  if (/<\/style/i.test(css)) throw new Error('report.css: cannot be inlined (contains </style)');
  return {
    layout: read('layout.hbs'),
    partials: { header: read('partials/header.hbs'), toc: read('partials/toc.hbs'), footer: read('partials/footer.hbs') },
    css,
    hydrate: inlineSafe('hydrate.js', read('hydrate.js')),
    vega: inlineSafe('vega.min.js', readFileSync(vegaFile, 'utf8')),
  };
}
