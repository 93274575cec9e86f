/**
 * Starts the web app: `npm start`. Listens on 127.0.0.1 and PORT (default 3000). The app has no login, so
 * binding to any other address needs an explicit HOST and prints a warning. Requests are answered only at the
 * bound address (and the loopback names) or a name in ALLOWED_HOSTS (server/plugins/request-guard.ts).
 */
import { buildApp } from './app.ts';
import type { LockstepError } from '../core/errors.ts';
import { serverErrors } from './errors.ts';
import { parseAllowedHosts } from './plugins/request-guard.ts';
import { builtMount, PUBLIC_DIR, sourceMounts } from './static-assets.ts';

export const DEFAULT_PORT = 3000;
const printError = (e: LockstepError) => console.error(`${e.code}: ${e.message}`);
const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1']);

const port = process.env.PORT ? Number(process.env.PORT) : DEFAULT_PORT;
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  printError(serverErrors.badPort(process.env.PORT));
  process.exit(2);
}
const host = process.env.HOST?.trim() || '127.0.0.1';
if (!LOOPBACK.has(host)) {
  console.warn(
    `WARNING: listening on ${host}. Lockstep has no login: anyone who can reach this address can use it. ` +
      'Use HOST only on a network you trust.',
  );
}

// the app answers only at its own address; ALLOWED_HOSTS="name, name:port" adds names (docs/threat-model.md)
const app = buildApp({ logger: process.env.LOG === '1', allowedHosts: parseAllowedHosts(process.env.ALLOWED_HOSTS) });
try {
  await app.listen({ host, port });
  if (sourceMounts().some((m) => !builtMount(m, PUBLIC_DIR))) {
    console.warn('Note: some page files are sent uncompressed from the sources (no current build); `npm run build` precompresses them.');
  }
  const shown = host.includes(':') ? `[${host}]` : host;
  console.log(`Lockstep workbench: http://${shown}:${app.server.address() && typeof app.server.address() === 'object' ? (app.server.address() as { port: number }).port : port}/`);
} catch (e) {
  printError((e as { code?: string }).code === 'EADDRINUSE' ? serverErrors.portInUse(port, host) : serverErrors.listen(port, host, (e as Error).message));
  process.exit(1);
}

for (const sig of ['SIGINT', 'SIGTERM'] as const) {
  process.once(sig, () => {
    void app.close().then(() => process.exit(0));
  });
}
