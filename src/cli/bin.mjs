#!/usr/bin/env node
// Entry point for the `plumbline` command: registers the TypeScript loader with the project's
// tsconfig (so JSX settings hold whatever the working directory), then runs the CLI.
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
const { main } = await import('./main.ts');
process.exitCode = await main(process.argv.slice(2));
