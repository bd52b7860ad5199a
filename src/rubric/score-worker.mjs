// A scoring thread: registers the TypeScript loader with the project's tsconfig, as the CLI
// entry point does, then runs score-worker.ts.
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
const { serveScoring } = await import('./score-worker.ts');
serveScoring();
