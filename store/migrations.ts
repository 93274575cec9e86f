/**
 * Versioned schema migrations of the design store. Each runs once, in its own transaction, in order;
 * the `migrations` table records which have run. Append new migrations; never edit one that has shipped.
 */
import type Database from 'better-sqlite3';
import { storeErrors } from './errors.ts';

export interface Migration {
  version: number;
  name: string;
  sql: string;
}

export const MIGRATIONS: readonly Migration[] = [
  {
    version: 1,
    name: 'designs, immutable revisions and history',
    sql: `
      CREATE TABLE revisions (
        id TEXT PRIMARY KEY CHECK (length(id) = 64),     -- SHA-256 of the canonical JSON, hex
        canonical_json TEXT NOT NULL,
        created_at TEXT NOT NULL
      ) WITHOUT ROWID;
      CREATE TRIGGER revisions_immutable BEFORE UPDATE ON revisions
        BEGIN SELECT RAISE(ABORT, 'revisions are immutable'); END;
      CREATE TABLE designs (
        id TEXT PRIMARY KEY,
        name TEXT NOT NULL,
        created_at TEXT NOT NULL,
        updated_at TEXT NOT NULL
      );
      CREATE TABLE history (
        seq INTEGER PRIMARY KEY AUTOINCREMENT,
        design_id TEXT NOT NULL REFERENCES designs(id) ON DELETE CASCADE,
        revision_id TEXT NOT NULL REFERENCES revisions(id),
        saved_at TEXT NOT NULL,
        message TEXT
      );
      CREATE INDEX history_by_design ON history(design_id, seq);
      CREATE INDEX history_by_revision ON history(revision_id);
    `,
  },
];

export const SCHEMA_VERSION = MIGRATIONS[MIGRATIONS.length - 1]!.version;

/** Runs every migration not yet applied; returns the versions applied now. */
export function migrate(db: Database.Database, now: () => Date): number[] {
  db.exec(`CREATE TABLE IF NOT EXISTS migrations (
    version INTEGER PRIMARY KEY, name TEXT NOT NULL, applied_at TEXT NOT NULL)`);
  const row = db.prepare('SELECT max(version) AS v FROM migrations').get() as { v: number | null };
  const have = row.v ?? 0;
  if (have > SCHEMA_VERSION) throw storeErrors.schemaTooNew(have, SCHEMA_VERSION);
  const applied: number[] = [];
  const record = db.prepare('INSERT INTO migrations (version, name, applied_at) VALUES (?, ?, ?)');
  const done = db.prepare('SELECT 1 FROM migrations WHERE version = ?');
  for (const m of MIGRATIONS) {
    if (m.version <= have) continue;
    // Another process may have run it meanwhile: check again under the write lock.
    const ran = db.transaction(() => {
      if (done.get(m.version)) return false;
      db.exec(m.sql);
      record.run(m.version, m.name, now().toISOString());
      return true;
    }).immediate();
    if (ran) applied.push(m.version);
  }
  return applied;
}
