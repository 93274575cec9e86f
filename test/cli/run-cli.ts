/** Running the command line in process for tests: captured output and a temporary folder for input files. */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../cli/main.ts';

export async function run(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const code = await runCli(argv, { stdout: (t) => void (stdout += t), stderr: (t) => void (stderr += t) });
  return { code, stdout, stderr };
}

/** A temporary folder; `file(name, body)` writes JSON (or raw text/bytes) into it and returns the path. */
export function tempFiles(prefix: string): { dir: string; file(name: string, body: unknown): string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  return {
    dir,
    file(name, body) {
      const p = join(dir, name);
      writeFileSync(p, typeof body === 'string' || Buffer.isBuffer(body) ? body : JSON.stringify(body));
      return p;
    },
    remove: () => rmSync(dir, { recursive: true, force: true }),
  };
}
