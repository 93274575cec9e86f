/**
 * The design store: SQLite (WAL, synchronous FULL) in a data folder created on first use.
 * A design is a named history of revisions; a revision is immutable and named by the SHA-256 of the
 * design's canonical JSON, so the same content always has the same id, in any design and on any machine.
 * Renaming changes the store's label only (the design file's own `name` is content and changes by saving).
 */
import { mkdirSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import Database from 'better-sqlite3';
import { canonicalJson, type DesignFile, type DiffEntry, designDiff, readDesign, type Warning } from '../core/index.ts';
import { storeErrors } from './errors.ts';
import { migrate } from './migrations.ts';
import { revisionIdOfCanonical } from './revision-id.ts';

export const DB_FILE_NAME = 'lockstep.sqlite';
export const DEFAULT_DATA_DIR = './data';
export const MAX_MESSAGE_CHARS = 2000;

/** The data folder: LOCKSTEP_DATA_DIR, else ./data, resolved against the working directory. */
export function dataDir(env: NodeJS.ProcessEnv = process.env): string {
  const d = env.LOCKSTEP_DATA_DIR;
  return path.resolve(d && d.trim() !== '' ? d : DEFAULT_DATA_DIR);
}

export interface StoreOptions {
  /** Data folder (default: dataDir()). */
  dir?: string;
  /** Clock, injectable for reproducible tests. */
  now?: () => Date;
}

export interface DesignSummary {
  id: string;
  name: string;
  created_at: string;
  updated_at: string;
  head_revision: string;
  revision_count: number;
}

export interface HistoryEntry {
  seq: number;
  revision_id: string;
  saved_at: string;
  message: string | null;
}

export interface StoredRevision {
  id: string;
  design: DesignFile;
  created_at: string;
}

export interface SaveResult {
  design: DesignSummary;
  revision_id: string;
  /** False when the content equals the design's latest revision (nothing was added). */
  changed: boolean;
  warnings: Warning[];
}

const HEX_ID = /^[0-9a-f]{8,64}$/;

function checkName(name: unknown): string {
  if (typeof name !== 'string') throw storeErrors.nameInvalid('is missing');
  const t = name.trim();
  if (t === '') throw storeErrors.nameInvalid('is empty');
  if (t.length > 200) throw storeErrors.nameInvalid(`is ${t.length} characters long`);
  return t;
}

function checkMessage(m: unknown): string | null {
  if (m === undefined || m === null) return null;
  const t = String(m).trim();
  if (t.length > MAX_MESSAGE_CHARS) throw storeErrors.messageTooLong(t.length);
  return t === '' ? null : t;
}

export class DesignStore {
  readonly db: Database.Database;
  readonly file: string;
  private readonly now: () => Date;

  constructor(opts: StoreOptions = {}) {
    const dir = opts.dir ?? dataDir();
    this.now = opts.now ?? (() => new Date());
    this.file = path.join(dir, DB_FILE_NAME);
    try {
      mkdirSync(dir, { recursive: true });
      this.db = new Database(this.file);
      this.db.pragma('journal_mode = WAL');
      this.db.pragma('synchronous = FULL');
      this.db.pragma('foreign_keys = ON');
      this.db.pragma('busy_timeout = 5000');
    } catch (e) {
      throw storeErrors.openFailed(dir, (e as Error).message);
    }
    migrate(this.db, this.now);
  }

  close(): void {
    if (this.db.open) this.db.close();
  }

  private stamp(): string {
    return this.now().toISOString();
  }

  /** Validates and saves a design: a new design unless `designId` is given. */
  save(input: unknown, opts: { designId?: string; message?: string | null; name?: string } = {}): SaveResult {
    const reading = readDesign(input);
    if (!reading.ok) throw storeErrors.designInvalid(reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
    const message = checkMessage(opts.message);
    const canonical = canonicalJson(reading.design);
    const rev = revisionIdOfCanonical(canonical);
    const t = this.stamp();
    const run = this.db.transaction(() => {
      let id = opts.designId;
      if (id !== undefined) {
        const head = this.headOf(id);
        if (head === rev) return { id, changed: false };
        this.db.prepare('UPDATE designs SET updated_at = ? WHERE id = ?').run(t, id);
      } else {
        const name = checkName(opts.name ?? reading.design.name);
        id = this.newDesignId();
        this.db.prepare('INSERT INTO designs (id, name, created_at, updated_at) VALUES (?, ?, ?, ?)').run(id, name, t, t);
      }
      this.db.prepare('INSERT OR IGNORE INTO revisions (id, canonical_json, created_at) VALUES (?, ?, ?)').run(rev, canonical, t);
      this.db.prepare('INSERT INTO history (design_id, revision_id, saved_at, message) VALUES (?, ?, ?, ?)').run(id, rev, t, message);
      return { id, changed: true };
    });
    const r = run.immediate();
    return { design: this.get(r.id), revision_id: rev, changed: r.changed, warnings: reading.warnings };
  }

  private newDesignId(): string {
    for (;;) {
      const id = randomBytes(5).toString('hex');
      if (!this.db.prepare('SELECT 1 FROM designs WHERE id = ?').get(id)) return id;
    }
  }

  private headOf(designId: string): string {
    if (!this.db.prepare('SELECT 1 FROM designs WHERE id = ?').get(designId)) throw storeErrors.designNotFound(designId);
    const row = this.db
      .prepare('SELECT revision_id FROM history WHERE design_id = ? ORDER BY seq DESC LIMIT 1')
      .get(designId) as { revision_id: string } | undefined;
    return row?.revision_id ?? '';
  }

  private static SUMMARY_SQL = `
    SELECT d.id, d.name, d.created_at, d.updated_at,
      (SELECT h.revision_id FROM history h WHERE h.design_id = d.id ORDER BY h.seq DESC LIMIT 1) AS head_revision,
      (SELECT count(*) FROM history h WHERE h.design_id = d.id) AS revision_count
    FROM designs d`;

  /** Every design, most recently changed first. */
  list(): DesignSummary[] {
    return this.db.prepare(`${DesignStore.SUMMARY_SQL} ORDER BY d.updated_at DESC, d.id`).all() as DesignSummary[];
  }

  get(designId: string): DesignSummary {
    const row = this.db.prepare(`${DesignStore.SUMMARY_SQL} WHERE d.id = ?`).get(designId) as DesignSummary | undefined;
    if (!row) throw storeErrors.designNotFound(designId);
    return row;
  }

  /** A design and one revision of it (its latest unless `revision` names one in its history). */
  open(designId: string, revision?: string): { design: DesignSummary; revision: StoredRevision } {
    const d = this.get(designId);
    if (revision === undefined) return { design: d, revision: this.revision(d.head_revision) };
    const r = this.revision(revision);
    if (!this.db.prepare('SELECT 1 FROM history WHERE design_id = ? AND revision_id = ?').get(designId, r.id)) {
      throw storeErrors.notInDesign(r.id, designId);
    }
    return { design: d, revision: r };
  }

  /** Full id of a revision from its full id or a unique prefix of at least 8 hexadecimal characters. */
  resolveRevision(idOrPrefix: string): string {
    const p = String(idOrPrefix).trim().toLowerCase();
    if (!HEX_ID.test(p)) throw storeErrors.badRevisionId(String(idOrPrefix));
    if (p.length === 64) {
      if (!this.db.prepare('SELECT 1 FROM revisions WHERE id = ?').get(p)) throw storeErrors.revisionNotFound(p);
      return p;
    }
    const rows = this.db.prepare('SELECT id FROM revisions WHERE id >= ? AND id < ? LIMIT 2').all(p, `${p}g`) as { id: string }[];
    if (rows.length === 0) throw storeErrors.revisionNotFound(p);
    if (rows.length > 1) throw storeErrors.revisionAmbiguous(p, rows.length);
    return rows[0]!.id;
  }

  /** A revision's design file. Its content is checked against its id on every read. */
  revision(idOrPrefix: string): StoredRevision {
    const id = this.resolveRevision(idOrPrefix);
    const row = this.db.prepare('SELECT id, canonical_json, created_at FROM revisions WHERE id = ?').get(id) as
      | { id: string; canonical_json: string; created_at: string }
      | undefined;
    if (!row) throw storeErrors.revisionNotFound(id);
    if (revisionIdOfCanonical(row.canonical_json) !== row.id) {
      throw storeErrors.revisionCorrupt(id);
    }
    // Parsed again so that keys come back in the schema's order (the stored text has them sorted).
    const parsed: unknown = JSON.parse(row.canonical_json);
    const reading = readDesign(parsed);
    return { id: row.id, design: reading.ok ? reading.design : (parsed as DesignFile), created_at: row.created_at };
  }

  /** The designs whose history holds a revision. */
  designsWithRevision(revisionId: string): string[] {
    const id = this.resolveRevision(revisionId);
    return (this.db.prepare('SELECT DISTINCT design_id FROM history WHERE revision_id = ? ORDER BY design_id').all(id) as { design_id: string }[]).map(
      (r) => r.design_id,
    );
  }

  /** A design's saves, oldest first. */
  history(designId: string): HistoryEntry[] {
    this.get(designId);
    return this.db
      .prepare('SELECT seq, revision_id, saved_at, message FROM history WHERE design_id = ? ORDER BY seq')
      .all(designId) as HistoryEntry[];
  }

  rename(designId: string, name: string): DesignSummary {
    const n = checkName(name);
    const r = this.db.prepare('UPDATE designs SET name = ?, updated_at = ? WHERE id = ?').run(n, this.stamp(), designId);
    if (r.changes === 0) throw storeErrors.designNotFound(designId);
    return this.get(designId);
  }

  /** A new design whose history starts with the source's latest revision. */
  duplicate(designId: string, name?: string): DesignSummary {
    const src = this.get(designId);
    const n = checkName(name ?? `${src.name} (copy)`.slice(0, 200));
    const t = this.stamp();
    const id = this.db.transaction(() => {
      const nid = this.newDesignId();
      this.db.prepare('INSERT INTO designs (id, name, created_at, updated_at) VALUES (?, ?, ?, ?)').run(nid, n, t, t);
      this.db
        .prepare('INSERT INTO history (design_id, revision_id, saved_at, message) VALUES (?, ?, ?, ?)')
        .run(nid, src.head_revision, t, `duplicated from design ${src.id}`);
      return nid;
    }).immediate();
    return this.get(id);
  }

  /**
   * Deletes a design and its history; `confirm` must equal the design id. Revisions no other design
   * refers to are removed with it.
   */
  delete(designId: string, confirm: unknown): void {
    this.get(designId);
    if (confirm !== designId) throw storeErrors.deleteNotConfirmed(designId);
    this.db.transaction(() => {
      this.db.prepare('DELETE FROM history WHERE design_id = ?').run(designId);
      this.db.prepare('DELETE FROM designs WHERE id = ?').run(designId);
      this.db.prepare('DELETE FROM revisions WHERE id NOT IN (SELECT revision_id FROM history)').run();
    }).immediate();
  }

  /** Field-level differences from revision `a` to revision `b`. */
  diff(a: string, b: string): { from: string; to: string; entries: DiffEntry[] } {
    const ra = this.revision(a);
    const rb = this.revision(b);
    return { from: ra.id, to: rb.id, entries: designDiff(ra.design, rb.design) };
  }

  integrityCheck(): string {
    return String(this.db.pragma('integrity_check', { simple: true }));
  }
}

export function openStore(opts: StoreOptions = {}): DesignStore {
  return new DesignStore(opts);
}
