// Durability of the design store under abrupt process death. Source: SQLite documentation, "Atomic Commit
// In SQLite" and "Write-Ahead Logging" — a transaction that has returned from COMMIT survives a crash of the
// process (WAL, synchronous=FULL); PRAGMA integrity_check answers "ok" when no problem is found.
// The child prints an acknowledgement only after save() has returned (stdout to a pipe is synchronous on
// Linux, Node.js process I/O documentation), so every acknowledged revision must be found after the kill.
import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { openStore } from '../../store/design-store.ts';

const here = path.dirname(fileURLToPath(import.meta.url));
const child = path.join(here, 'save-loop.ts');
const dir = mkdtempSync(path.join(tmpdir(), 'lockstep-durability-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** mulberry32: a small seeded PRNG so the kill moments are reproducible. */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function runAndKill(label: string, killAfterAcks: number, extraDelayMs: number): Promise<{ acks: [string, string][]; signal: string | null }> {
  return new Promise((resolve, reject) => {
    const acks: [string, string][] = [];
    let buf = '';
    let armed = false;
    const p: ChildProcess = spawn(process.execPath, ['--import', 'tsx', child, dir, label], { stdio: ['ignore', 'pipe', 'pipe'] });
    let err = '';
    p.stderr!.on('data', (c: Buffer) => (err += c.toString()));
    p.stdout!.on('data', (c: Buffer) => {
      buf += c.toString();
      let nl: number;
      while ((nl = buf.indexOf('\n')) >= 0) {
        const line = buf.slice(0, nl);
        buf = buf.slice(nl + 1);
        const m = /^ACK ([0-9a-f]{64}) ([0-9a-f]+)$/.exec(line);
        if (m) acks.push([m[1]!, m[2]!]);
      }
      if (!armed && acks.length >= killAfterAcks) {
        armed = true;
        setTimeout(() => p.kill('SIGKILL'), extraDelayMs);
      }
    });
    p.on('error', reject);
    p.on('exit', (_code, signal) => {
      if (signal !== 'SIGKILL') reject(new Error(`child ended without being killed (${signal ?? _code}): ${err}`));
      else resolve({ acks, signal });
    });
  });
}

describe('design store durability', () => {
  it('keeps every acknowledged revision when the saving process is killed with SIGKILL', async () => {
    const rnd = prng(20261201);
    const all: [string, string][] = [];
    // Three waves of two writers at once (they also contend for the write lock), each killed at its own moment.
    for (let wave = 0; wave < 3; wave++) {
      const runs = await Promise.all(
        [0, 1].map((k) => runAndKill(`wave${wave}-${k}`, 1 + Math.floor(rnd() * 40), Math.floor(rnd() * 15))),
      );
      for (const { acks } of runs) {
        expect(acks.length).toBeGreaterThan(0);
        all.push(...acks);
      }
    }
    const store = openStore({ dir });
    try {
      expect(store.integrityCheck()).toBe('ok');
      for (const [rev, design] of all) {
        expect(store.revision(rev).id).toBe(rev);
        expect(store.history(design).some((h) => h.revision_id === rev)).toBe(true);
      }
      // one design per writer, each with at least its acknowledged revisions
      expect(store.list()).toHaveLength(6);
    } finally {
      store.close();
    }
  }, 30000);
});
