#!/usr/bin/env node
// The installed `seedsift` command. Runs the TypeScript sources through tsx's loader.
import { register } from 'tsx/esm/api';

register();
await import('./main.ts');
