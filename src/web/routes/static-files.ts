import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { Hono } from 'hono';

const require = createRequire(import.meta.url);

/** Files served under /static: our CSS and script, and htmx from node_modules (no CDN). */
const FILES: Record<string, { path: string; type: string }> = {
  'plumbline.css': { path: fileURLToPath(new URL('../../../views/static/plumbline.css', import.meta.url)), type: 'text/css; charset=utf-8' },
  'plumbline.js': { path: fileURLToPath(new URL('../../../views/static/plumbline.js', import.meta.url)), type: 'text/javascript; charset=utf-8' },
  'htmx.min.js': { path: require.resolve('htmx.org/dist/htmx.min.js'), type: 'text/javascript; charset=utf-8' },
  'favicon.svg': { path: fileURLToPath(new URL('../../../views/static/favicon.svg', import.meta.url)), type: 'image/svg+xml' },
};

/** Serves the fixed list of static files, read once at start-up. */
export function staticRoutes() {
  const app = new Hono();
  const loaded = Object.fromEntries(Object.entries(FILES).map(([name, f]) => [name, { body: readFileSync(f.path), type: f.type }]));
  app.get('/static/:name', (c) => {
    const file = loaded[c.req.param('name')];
    if (!file) return c.notFound();
    return c.body(file.body, 200, { 'Content-Type': file.type, 'Cache-Control': 'public, max-age=3600' });
  });
  // browsers ask for /favicon.ico whatever the page links; send them the icon
  app.get('/favicon.ico', (c) => c.redirect('/static/favicon.svg', 301));
  return app;
}
