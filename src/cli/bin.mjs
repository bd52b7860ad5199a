#!/usr/bin/env node
// Entry point for the `plumbline` command: registers the TypeScript loader with the project's
// tsconfig (so JSX settings hold whatever the working directory), then runs the CLI.
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

// A reader that stops early (`plumbline score … | head`) is not an error.
process.stdout.on('error', (error) => {
  if (error.code === 'EPIPE') process.exit(0);
  throw error;
});
register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
const { main } = await import('./main.ts');
process.exitCode = await main(process.argv.slice(2));
