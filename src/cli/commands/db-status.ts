import { configFromEnv } from '../../config.ts';
import { openStore } from '../../store/connect.ts';
import { migrationStatus } from '../../store/migrate.ts';
import type { Command } from '../command.ts';

/** `plumbline db status`: which migrations have run on the configured database. */
export const dbStatusCommand: Command = {
  name: 'db status',
  summary: 'list the database migrations and which have run',
  usage: 'plumbline db status',
  options: {},
  async run(_args, io) {
    const store = await openStore(configFromEnv(io.env).database);
    try {
      const status = await migrationStatus(store);
      io.out(`Database: ${store.where} (${store.kind})`);
      for (const m of status) io.out(`  ${m.executedAt ? 'applied' : 'pending'}  ${m.name}${m.executedAt ? `  ${m.executedAt}` : ''}`);
      const pending = status.filter((m) => !m.executedAt).length;
      io.out(pending ? `${pending} pending — they run on the next "plumbline serve"` : 'Up to date.');
    } finally {
      await store.close();
    }
    return 0;
  },
};
