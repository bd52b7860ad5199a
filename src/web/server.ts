import { serve, type ServerType } from '@hono/node-server';
import { UserError, errorCode } from '../errors.ts';
import type { Store } from '../store/connect.ts';
import { createApp } from './app.tsx';

export interface RunningServer {
  url: string;
  close(): Promise<void>;
}

/**
 * Serves the app on `host:port`. A port in use or not allowed is a `UserError` that says what
 * to do. Port 0 picks a free port (tests).
 */
export function startServer(store: Store, options: { host: string; port: number; secureCookies?: boolean }): Promise<RunningServer> {
  const app = createApp({ store, secureCookies: options.secureCookies });
  return new Promise((resolve, reject) => {
    let server: ServerType;
    const onError = (error: unknown) => {
      const code = errorCode(error);
      if (code === 'EADDRINUSE') reject(new UserError(`port ${options.port} on ${options.host} is already in use — stop the other program or set PORT to a free port`));
      else if (code === 'EACCES') reject(new UserError(`not allowed to listen on port ${options.port} — set PORT to a number above 1023`));
      else if (code === 'EADDRNOTAVAIL' || code === 'ENOTFOUND') reject(new UserError(`cannot listen on host "${options.host}" — set HOST to an address of this machine, such as 127.0.0.1`));
      else reject(error);
    };
    server = serve({ fetch: app.fetch, hostname: options.host, port: options.port }, (info) => {
      server.off('error', onError);
      const host = info.family === 'IPv6' ? `[${info.address}]` : info.address;
      resolve({
        url: `http://${host}:${info.port}`,
        close: () =>
          new Promise<void>((done) => {
            server.close(() => done());
            (server as unknown as { closeAllConnections?: () => void }).closeAllConnections?.();
          }),
      });
    });
    server.once('error', onError);
  });
}
