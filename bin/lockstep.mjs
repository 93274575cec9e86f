#!/usr/bin/env node
// Entry point of the `lockstep` command. Runs the JavaScript the build step wrote to dist/ (`npm run build`, run
// by `npm ci` through `prepare`), so no transpiler is loaded at start: the bundled command line
// (dist/cli-bundle, a few files) when present, else the compiled modules (dist/cli). Without a build, or with
// LOCKSTEP_FROM_SOURCE=1, it runs the TypeScript sources through tsx instead (slower to start).
import { existsSync } from 'node:fs';

const bundled = new URL('../dist/cli-bundle/main.js', import.meta.url);
const compiled = new URL('../dist/cli/main.js', import.meta.url);
const built = existsSync(bundled) ? bundled : compiled;
const fromSource = process.env.LOCKSTEP_FROM_SOURCE === '1' || !existsSync(built);
// A reader that stops early (`lockstep evaluate x.json --json | head`) closes the pipe: end quietly.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}
if (fromSource) (await import('tsx/esm/api')).register();
const { runCli } = await import(fromSource ? '../cli/main.ts' : built.href);
const code = await runCli(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text.endsWith('\n') ? text : `${text}\n`),
  stderr: (text) => process.stderr.write(text.endsWith('\n') ? text : `${text}\n`),
});
process.exitCode = code;
