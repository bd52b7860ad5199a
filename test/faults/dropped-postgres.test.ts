import { createServer, connect, type Server, type Socket } from 'node:net';
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openStore, type Store } from '../../src/store/connect.ts';
import { migrate } from '../../src/store/migrate.ts';
import { seedDemo } from '../../src/demo/seed.ts';
import { createApp } from '../../src/web/app.tsx';
import { ORIGIN, demoPassword, signIn } from '../helpers/web.ts';

const url = process.env.TEST_DATABASE_URL;
if (!url && process.env.CI === 'true') throw new Error('CI=true but TEST_DATABASE_URL is not set: the dropped-connection test must run on PostgreSQL (see DEVELOPERS.md)');
if (!url) console.warn('[plumbline tests] TEST_DATABASE_URL is not set: the dropped PostgreSQL connection test is SKIPPED.');

/** A TCP relay between the app and PostgreSQL that can cut every connection, as a network fault would. */
class Relay {
  private server: Server | null = null;
  private readonly sockets = new Set<Socket>();
  port = 0;
  constructor(private readonly target: { host: string; port: number }) {}

  async start(port = 0): Promise<void> {
    this.server = createServer((client) => {
      const upstream = connect(this.target.port, this.target.host);
      for (const s of [client, upstream]) {
        this.sockets.add(s);
        s.on('close', () => this.sockets.delete(s));
        s.on('error', () => {});
      }
      client.pipe(upstream).pipe(client);
    });
    await new Promise<void>((resolve) => this.server!.listen(port, '127.0.0.1', resolve));
    this.port = (this.server.address() as { port: number }).port;
  }

  /** Drops every open connection and refuses new ones. */
  async cut(): Promise<void> {
    for (const s of this.sockets) s.destroy();
    await new Promise<void>((resolve) => this.server!.close(() => resolve()));
  }
}

describe.skipIf(!url)('a dropped PostgreSQL connection', () => {
  const schema = `plumbline_drop_${randomBytes(5).toString('hex')}`;
  let relay: Relay;
  let store: Store;
  let direct: pg.Client;

  beforeAll(async () => {
    const target = new URL(url!);
    direct = new pg.Client({ connectionString: url });
    await direct.connect();
    await direct.query(`create schema ${schema}`);
    relay = new Relay({ host: target.hostname, port: Number(target.port || 5432) });
    await relay.start();
    const through = new URL(url!);
    through.host = `127.0.0.1:${relay.port}`;
    through.searchParams.set('options', `-c search_path=${schema}`);
    store = await openStore({ kind: 'postgres', url: through.toString() });
    await migrate(store);
    await seedDemo(store.db, { password: demoPassword });
  });
  afterAll(async () => {
    await store?.close().catch(() => {});
    await direct.query(`drop schema if exists ${schema} cascade`);
    await direct.end();
  });

  const count = async (table: string) => Number((await direct.query(`select count(*) as n from ${schema}.${table}`)).rows[0].n);

  it('answers with 503 and the reason while the database is cut off, loses nothing stored, and works again once it is back', async () => {
    const app = createApp({ store });
    const reviewer = await signIn(app, 'reviewer');
    const next = await app.request('/review/next', { headers: { cookie: reviewer.cookie } });
    const path = next.headers.get('location')!;
    const page = await (await app.request(path, { headers: { cookie: reviewer.cookie } })).text();
    const ranks = Object.fromEntries([...page.matchAll(/name="(rank_[^"]+)"/g)].map((m, i) => [m[1], String(i + 1)]));
    const submit = () => app.request(`${path}/submit`, { method: 'POST', headers: { cookie: reviewer.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: reviewer.csrf, ...ranks, rationale: 'The first answers the question; the rest do not.', started_at: new Date().toISOString() }) });
    const before = { reviews: await count('reviews'), items: await count('items'), adjudications: await count('adjudications'), audit: await count('audit_events') };

    await relay.cut();
    const res = await submit();
    expect(res.status).toBe(503);
    expect(await res.text()).toMatch(/connection to the database was lost|database is unavailable/);
    const queue = await app.request('/', { headers: { cookie: reviewer.cookie } });
    expect(queue.status).toBe(503);
    expect({ reviews: await count('reviews'), items: await count('items'), adjudications: await count('adjudications'), audit: await count('audit_events') }).toEqual(before);

    await relay.start(relay.port);
    const again = await submit();
    expect(again.status).toBe(303);
    expect(await count('reviews')).toBe(before.reviews + 1);
    expect((await sql<{ n: number }>`select count(*) as n from items`.execute(store.db)).rows[0].n).toBe(before.items);
  }, 60_000);
});
