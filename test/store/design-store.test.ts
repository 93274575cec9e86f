// Sources: SHA-256 test vector "abc" from FIPS 180-2 appendix B.1; SQLite documentation for
// PRAGMA journal_mode (WAL) and PRAGMA integrity_check ("ok" when no problem is found). Everything else
// is hand-derived from the edits each test makes to the invented demo design.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { canonicalJson, demoDesign, type DesignFile } from '../../core/index.ts';
import { DB_FILE_NAME, dataDir, DesignStore, openStore } from '../../store/design-store.ts';
import { LockstepError } from '../../core/errors.ts';
import { MIGRATIONS, SCHEMA_VERSION } from '../../store/migrations.ts';
import { revisionId, revisionIdOfCanonical } from '../../store/revision-id.ts';

const clone = (d: DesignFile): DesignFile => JSON.parse(JSON.stringify(d)) as DesignFile;
let dir: string;
let store: DesignStore;
let t = 0;
const now = () => new Date(Date.UTC(2026, 11, 1, 12, 0, t++));

beforeEach(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'lockstep-store-'));
  store = openStore({ dir: path.join(dir, 'nested', 'data'), now });
  t = 0; // the clock starts after the migrations have run
});
afterEach(() => {
  store.close();
  rmSync(dir, { recursive: true, force: true });
});

function code(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    if (e instanceof LockstepError) return e.code;
    throw e;
  }
  return 'no error';
}

describe('revision ids', () => {
  it('are SHA-256 in hex (FIPS 180-2 B.1: "abc")', () => {
    expect(revisionIdOfCanonical('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
  it('are the SHA-256 of the canonical JSON: same content → same id, whatever the key order', () => {
    const d = demoDesign();
    const reordered = Object.fromEntries(Object.entries(d).reverse());
    expect(revisionId(reordered)).toBe(revisionId(d));
    expect(revisionId(d)).toBe(revisionIdOfCanonical(canonicalJson(d)));
    expect(store.save(reordered).revision_id).toBe(revisionId(d));
  });
  it('change when any field changes', () => {
    const a = demoDesign();
    const b = clone(a);
    b.load_states[0]!.cg_height_m = 0.781;
    expect(revisionId(b)).not.toBe(revisionId(a));
    const c = clone(a);
    c.name = `${a.name} `;
    expect(revisionId(c)).not.toBe(revisionId(a));
  });
});

describe('DesignStore', () => {
  it('creates the data folder, uses WAL and records the migrations', () => {
    expect(store.file).toBe(path.join(dir, 'nested', 'data', DB_FILE_NAME));
    expect(store.db.pragma('journal_mode', { simple: true })).toBe('wal');
    const rows = store.db.prepare('SELECT version FROM migrations ORDER BY version').all() as { version: number }[];
    expect(rows.map((r) => r.version)).toEqual(MIGRATIONS.map((m) => m.version));
    expect(store.integrityCheck()).toBe('ok');
  });
  it('runs migrations once: reopening applies nothing new', () => {
    store.close();
    store = openStore({ dir: path.join(dir, 'nested', 'data'), now });
    const n = (store.db.prepare('SELECT count(*) AS n FROM migrations').get() as { n: number }).n;
    expect(n).toBe(MIGRATIONS.length);
  });
  it('refuses a store written by a newer schema', () => {
    store.db.prepare('INSERT INTO migrations (version, name, applied_at) VALUES (?, ?, ?)').run(SCHEMA_VERSION + 1, 'future', 'x');
    store.close();
    expect(code(() => openStore({ dir: path.join(dir, 'nested', 'data') }))).toBe('STORE_ERR_SCHEMA_TOO_NEW');
    // clean up so afterEach can close a fresh store
    const db = new Database(path.join(dir, 'nested', 'data', DB_FILE_NAME));
    db.prepare('DELETE FROM migrations WHERE version = ?').run(SCHEMA_VERSION + 1);
    db.close();
    store = openStore({ dir: path.join(dir, 'nested', 'data'), now });
  });
  it('takes its folder from LOCKSTEP_DATA_DIR, else ./data', () => {
    expect(dataDir({ LOCKSTEP_DATA_DIR: '/srv/lockstep' })).toBe('/srv/lockstep');
    expect(dataDir({})).toBe(path.resolve('./data'));
  });
  it('saves, lists, opens and keeps a history with times and messages', () => {
    const a = demoDesign();
    const first = store.save(a, { message: 'as bought' });
    expect(first.changed).toBe(true);
    const b = clone(a);
    if (b.axles.rear.brake.type !== 'disc') throw new Error('demo rear brake is a disc');
    b.axles.rear.brake.piston_diameters_mm = [42];
    const second = store.save(b, { designId: first.design.id, message: 'bigger rear caliper' });
    expect(second.revision_id).not.toBe(first.revision_id);
    const again = store.save(b, { designId: first.design.id, message: 'same again' });
    expect(again.changed).toBe(false); // identical to the latest revision: nothing added
    const h = store.history(first.design.id);
    expect(h.map((e) => [e.revision_id, e.message, e.saved_at])).toEqual([
      [first.revision_id, 'as bought', '2026-12-01T12:00:00.000Z'],
      [second.revision_id, 'bigger rear caliper', '2026-12-01T12:00:01.000Z'],
    ]);
    const list = store.list();
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ id: first.design.id, name: a.name, head_revision: second.revision_id, revision_count: 2 });
    expect(store.open(first.design.id).revision.design).toEqual(b);
    expect(store.open(first.design.id, first.revision_id.slice(0, 8)).revision.design).toEqual(a);
    // keys come back in the schema's order, not sorted
    expect(Object.keys(store.revision(first.revision_id).design)[0]).toBe('format');
  });
  it('diffs two revisions field by field', () => {
    const a = demoDesign();
    const s1 = store.save(a);
    const b = clone(a);
    b.load_states[1]!.front_axle_kg = 1650;
    b.vehicle.abs = true;
    const s2 = store.save(b, { designId: s1.design.id });
    expect(store.diff(s1.revision_id, s2.revision_id).entries.map((e) => e.text)).toEqual([
      'load_states[1].front_axle_kg: 1610 → 1650 kg',
      'vehicle.abs: false → true',
    ]);
  });
  it('renames, duplicates and deletes only with the design id as confirmation', () => {
    const s = store.save(demoDesign());
    const id = s.design.id;
    expect(store.rename(id, '  Van, option B  ').name).toBe('Van, option B');
    expect(code(() => store.rename(id, '   '))).toBe('STORE_ERR_NAME_INVALID');
    const dup = store.duplicate(id);
    expect(dup.name).toBe('Van, option B (copy)');
    expect(dup.head_revision).toBe(s.revision_id);
    expect(code(() => store.delete(id, true))).toBe('STORE_ERR_DELETE_NOT_CONFIRMED');
    expect(code(() => store.delete(id, undefined))).toBe('STORE_ERR_DELETE_NOT_CONFIRMED');
    store.delete(id, id);
    expect(store.list().map((d) => d.id)).toEqual([dup.id]);
    // the revision is still there: the duplicate refers to it
    expect(store.revision(s.revision_id).id).toBe(s.revision_id);
    store.delete(dup.id, dup.id);
    expect(code(() => store.revision(s.revision_id))).toBe('STORE_ERR_REVISION_NOT_FOUND');
  });
  it('answers bad ids and designs with coded errors', () => {
    expect(code(() => store.get('nope'))).toBe('STORE_ERR_DESIGN_NOT_FOUND');
    expect(code(() => store.revision('xyz'))).toBe('STORE_ERR_REVISION_ID_INVALID');
    expect(code(() => store.revision('0123456789abcdef'))).toBe('STORE_ERR_REVISION_NOT_FOUND');
    expect(code(() => store.save({ format: 'lockstep-design/1' }))).toBe('STORE_ERR_DESIGN_INVALID');
    expect(code(() => store.save(demoDesign(), { designId: 'nope' }))).toBe('STORE_ERR_DESIGN_NOT_FOUND');
    expect(code(() => store.save(demoDesign(), { message: 'x'.repeat(2001) }))).toBe('STORE_ERR_MESSAGE_TOO_LONG');
  });
  it('keeps revisions immutable (a trigger refuses updates) and checks content against the id on read', () => {
    const s = store.save(demoDesign());
    expect(() => store.db.prepare('UPDATE revisions SET canonical_json = ? WHERE id = ?').run('{}', s.revision_id)).toThrow(/immutable/);
    store.db.exec('DROP TRIGGER revisions_immutable');
    store.db.prepare('UPDATE revisions SET canonical_json = ? WHERE id = ?').run('{"name":"tampered"}', s.revision_id);
    expect(code(() => store.revision(s.revision_id))).toBe('STORE_ERR_REVISION_CORRUPT');
  });
});
