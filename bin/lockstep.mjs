#!/usr/bin/env node
// Entry point of the `lockstep` command: runs the TypeScript sources through tsx (no build step).
import { register } from 'tsx/esm/api';

register();
// A reader that stops early (`lockstep evaluate x.json --json | head`) closes the pipe: end quietly.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}
const { runCli } = await import('../cli/main.ts');
const code = await runCli(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text.endsWith('\n') ? text : `${text}\n`),
  stderr: (text) => process.stderr.write(text.endsWith('\n') ? text : `${text}\n`),
});
process.exitCode = code;
