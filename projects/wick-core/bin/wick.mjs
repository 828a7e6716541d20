#!/usr/bin/env node
// `wick` command: loads the TypeScript CLI through tsx (resolved from this package, whatever the caller's folder).
import { register } from 'tsx/esm/api';

register({ tsconfig: new URL('../tsconfig.spec.json', import.meta.url).pathname });
await import('../cli/main.ts');
