/**
 * Hostile text for the report's inputs: script tags, a closing script tag, attribute breakouts,
 * Handlebars braces, javascript: links, a right-to-left override (U+202E) and a 10,000-character
 * name, placed in config names, parameter names, metric names, paths and problem messages.
 */
import { SAMPLE_NAMES, type SampleNames } from './sampleResults.js';

export const LONG_NAME = `memory=${'m'.repeat(10_000 - 'memory='.length)}`;

export const HOSTILE_NAMES: SampleNames = {
  ...SAMPLE_NAMES,
  configs: ['memory=<script>alert(1)</script>', `memory="'><img src=x onerror=alert(2)>`, LONG_NAME],
  key: 'memory<b>{{x}}</b>',
  values: ['<script>alert(1)</script>', `"'><img src=x onerror=alert(2)>`, 'm'.repeat(9_993)],
  acc: '</script><script>alert(3)</script>',
  loss: '{{verdicts}} [click](javascript:alert(4)) _x_ \u202Egnp.exe',
  tick: '<!-- {{#each metrics}} --><svg onload=alert(5)>',
  problemText: ' <script>alert(6)</script> <a href="javascript:alert(7)">x</a> {{problems}} \u202Eevil',
  path: 'runs/<img src=x onerror=alert(8)>',
};
