/** Where the shipped templates live (resolved from this module, so it works from any working directory). */
import { fileURLToPath } from 'node:url';

export const TEMPLATES_DIR = fileURLToPath(new URL('../../templates/', import.meta.url));
export const DEFAULT_NOTEBOOK = fileURLToPath(new URL('../../templates/notebook.md', import.meta.url));
