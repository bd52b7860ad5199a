// Runs a TypeScript file of the benchmarks in a process of its own, with the project's tsconfig.
import { pathToFileURL, fileURLToPath } from 'node:url';
import { resolve } from 'node:path';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
await import(pathToFileURL(resolve(process.argv[2])).href);
