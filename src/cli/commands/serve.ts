import { configFromEnv } from '../../config.ts';
import { seedDemo } from '../../demo/seed.ts';
import { openStore } from '../../store/connect.ts';
import { migrate } from '../../store/migrate.ts';
import { sweepUnfinishedImports } from '../../store/repos/unfinished-imports.ts';
import { startServer } from '../../web/server.ts';
import type { Command } from '../command.ts';

/** `plumbline serve`: migrate, seed the demo on first start, serve until Ctrl-C. */
export const serveCommand: Command = {
  name: 'serve',
  summary: 'serve the web app (creates, migrates and on first start seeds the database)',
  usage: 'plumbline serve [--no-demo]',
  options: { flags: ['no-demo'] },
  async run(args, io) {
    const config = configFromEnv(io.env);
    const store = await openStore(config.database);
    try {
      await migrate(store);
      for (const name of await sweepUnfinishedImports(store.db)) io.out(`Removed batch "${name}": its import stopped part-way (the process ended); nothing of it was shown. Import the file again.`);
      const seed = args.flags.has('no-demo') ? { seeded: false, logins: [] } : await seedDemo(store.db);
      const server = await startServer(store, { host: config.host, port: config.port, secureCookies: config.secureCookies });
      io.out(`Plumbline is serving ${server.url}/ (database: ${store.where})`);
      if (seed.seeded) {
        io.out('Demo data loaded. Sign in with one of these accounts (shown this once; keep them):');
        for (const login of seed.logins) io.out(`  ${login.username.padEnd(12)} ${login.password}   ${login.roles.join(', ')}`);
      }
      io.out('Press Ctrl-C to stop.');
      await waitForSignal();
      io.out('Stopping…');
      await server.close();
    } finally {
      await store.close();
    }
    return 0;
  },
};

function waitForSignal(): Promise<void> {
  return new Promise((resolve) => {
    const stop = () => {
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
      resolve();
    };
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
  });
}
