/** @jsxImportSource hono/jsx */
// The reference for the queue page's throughput: a bare Hono route rendering a 50-row HTML
// table from memory (no database, no session), served the same way the app is.
import { serve } from '@hono/node-server';
import { Hono } from 'hono';

const rows = Array.from({ length: 50 }, (_, i) => ({ id: i + 1, prompt: `Prompt number ${i + 1}: how long should stream water boil before drinking?`, batch: 'reference', state: 'waiting', reviews: `${i % 3} of 2` }));
const app = new Hono();
app.get('/', (c) =>
  c.html(
    <html lang="en">
      <head><title>Reference table</title></head>
      <body>
        <table>
          <thead><tr><th>#</th><th>Prompt</th><th>Reviews</th><th>State</th><th>Batch</th></tr></thead>
          <tbody>{rows.map((r) => <tr><td>{r.id}</td><td><a href={`/items/${r.id}`}>{r.prompt}</a></td><td>{r.reviews}</td><td>{r.state}</td><td>{r.batch}</td></tr>)}</tbody>
        </table>
      </body>
    </html>,
  ),
);
const server = serve({ fetch: app.fetch, hostname: '127.0.0.1', port: 0 }, (info) => console.log(`reference serving http://127.0.0.1:${info.port}/`));
process.on('SIGTERM', () => server.close(() => process.exit(0)));
