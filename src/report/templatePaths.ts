/**
 * Where the shipped templates live (found from the package
 * root, so it works from any working directory and from dist/).
 */
import { join } from 'node:path';
import { packageRoot } from '../packageRoot.js';

export const TEMPLATES_DIR = join(packageRoot(), 'templates');
export const DEFAULT_NOTEBOOK = join(TEMPLATES_DIR, 'notebook.md');
