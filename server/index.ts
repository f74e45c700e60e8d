import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { pathToFileURL } from 'node:url';
import { createApp, type AppContext } from './app';
import { loadConfig, type AppConfig } from './config';
import { attachBoardSockets } from './boards-live';

/** WebSocket close code 1012 (service restart, RFC 6455 registry): reconnect, here or elsewhere. */
export const SERVICE_RESTART = 1012;

export interface RunningServer {
  server: http.Server;
  url: string;
  ctx: AppContext;
  close(): Promise<void>;
}

/** Builds the app and listens on `config.port` (0 = a free port). */
export async function startServer(config: AppConfig): Promise<RunningServer> {
  const ctx = await createApp(config);
  const server = http.createServer(ctx.app);
  // The live boards' websocket upgrade handler (its close runs first among ctx.onClose).
  attachBoardSockets(server, ctx);

  try {
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(config.port, config.host, () => {
        server.off('error', reject);
        resolve();
      });
    });
  } catch (err) {
    await ctx.close();
    throw err;
  }
  const { port } = server.address() as AddressInfo;
  const host = !config.host || config.host === '0.0.0.0' || config.host === '::' ? 'localhost' : config.host;
  const url = `http://${host.includes(':') ? `[${host}]` : host}:${port}`;

  let closing: Promise<void> | undefined;
  const close = () =>
    (closing ??= (async () => {
      // The drain: stop accepting, tell the load balancer (/api/ready answers 503), send every board
      // socket elsewhere (1012 "service restart": the client reconnects, through the proxy, to another
      // server), then the rooms store everything and close.
      ctx.draining = true;
      const stopped = new Promise<void>((resolve) => server.close(() => resolve()));
      for (const room of ctx.boardRegistry.rooms.values()) room.closeAll(SERVICE_RESTART, 'server restarting: reconnect');
      await ctx.closeFeatures(); // rooms flush and close their sockets first
      server.closeIdleConnections();
      const force = setTimeout(() => server.closeAllConnections(), 3000);
      await stopped;
      clearTimeout(force);
      await ctx.close();
    })());
  return { server, url, ctx, close };
}

/** Listens and stops gracefully on SIGTERM/SIGINT. Used by `npm start` (start.ts) and `tsx server/index.ts`. */
export async function runMain(config: AppConfig, announce: (running: RunningServer) => void = (r) => console.log(`Gatefold listening on ${r.url}`)): Promise<RunningServer> {
  const running = await startServer(config);
  announce(running);
  const stop = (signal: string) => {
    console.log(`${signal}: shutting down`);
    const timer = setTimeout(() => process.exit(1), 10000);
    timer.unref();
    running.close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error('shutdown failed:', err);
        process.exit(1);
      },
    );
  };
  process.once('SIGTERM', () => stop('SIGTERM'));
  process.once('SIGINT', () => stop('SIGINT'));
  return running;
}

function isMain(): boolean {
  return process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
}

if (isMain()) {
  try {
    await runMain(loadConfig());
  } catch (err) {
    console.error(`error: ${(err as Error).message}`);
    process.exit(1);
  }
}
