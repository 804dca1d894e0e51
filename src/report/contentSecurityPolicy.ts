/**
 * The page's Content-Security-Policy (a `<meta http-equiv>` tag): nothing may be fetched, framed,
 * posted or connected to; images only from `data:` URLs; the inline style allowed; scripts only
 * those whose SHA-256 hash the policy lists (CSP Level 3, "hash-source").
 *
 * No `'unsafe-eval'`: the Vega runtime would compile its expressions (tooltips, selections,
 * scales) with `Function`, so the page parses chart specs with `{ ast: true }` and evaluates them
 * with Vega's interpreter (vega-interpreter, inlined as a classic script) instead; nothing on the
 * page needs `eval` or `Function`.
 */
import { createHash } from 'node:crypto';

/**
 * The CSP source for one inline script: `'sha256-<base64 of SHA-256 of its UTF-8 text>'`.
 * Cost O(length). Never throws. Example: `scriptHash('')` → `"'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='"`.
 */
export function scriptHash(script: string): string {
  return `'sha256-${createHash('sha256').update(script, 'utf8').digest('base64')}'`;
}

/**
 * The policy for a page whose inline scripts are `scripts` (their exact text between the tags).
 * Cost O(total script length). Never throws.
 * Example: `contentSecurityPolicy(['x'])` →
 * `"default-src 'none'; img-src data:; style-src 'unsafe-inline'; script-src 'sha256-...'; connect-src 'none'; ..."`.
 */
export function contentSecurityPolicy(scripts: readonly string[]): string {
  return [
    "default-src 'none'",
    'img-src data:',
    "style-src 'unsafe-inline'",
    `script-src ${scripts.map(scriptHash).join(' ')}`,
    "connect-src 'none'",
    "font-src 'none'",
    "media-src 'none'",
    "object-src 'none'",
    "frame-src 'none'",
    "worker-src 'none'",
    "manifest-src 'none'",
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
}
