/**
 * `lockstep store <list|save|show|history|diff|rename|duplicate|delete>`: the saved designs in the data folder
 * (LOCKSTEP_DATA_DIR, default ./data). `show` prints a revision's design file, so a saved revision can be
 * evaluated or packed: `lockstep store show 1a2b3c4d > x.json && lockstep evaluate x.json`.
 */
import { parseArgs } from 'node:util';
import { type DesignStore, openStore } from '../../store/design-store.ts';
import { designJson } from '../../packet/exports.ts';
import { cliErrors } from '../errors.ts';
import { readJsonFile } from '../read-json.ts';
import type { CommandOutput } from '../output.ts';
import { textTable } from '../table.ts';

export const STORE_USAGE = [
  'usage: lockstep store list [--json]',
  '       lockstep store save FILE [--design ID] [--message TEXT] [--name NAME]',
  '       lockstep store show REVISION | --design ID   (prints the design file)',
  '       lockstep store history DESIGN_ID [--json]',
  '       lockstep store diff REVISION_A REVISION_B [--json]',
  '       lockstep store rename DESIGN_ID NAME',
  '       lockstep store duplicate DESIGN_ID [--name NAME]',
  '       lockstep store delete DESIGN_ID --confirm DESIGN_ID',
  'The store lives in LOCKSTEP_DATA_DIR (default ./data). Revisions may be given by a unique prefix of 8 or more characters.',
].join('\n');

/** Runs `fn` on an open store and closes it afterwards; the store's errors reach cli/main.ts as they are. */
export function runStore<T>(fn: (s: DesignStore) => T, open: () => DesignStore = () => openStore()): T {
  let store: DesignStore | undefined;
  try {
    store = open();
    return fn(store);
  } finally {
    store?.close();
  }
}

export function storeCommand(argv: string[], out: CommandOutput): number {
  const [sub, ...rest] = argv;
  const { values, positionals } = parseArgs({
    args: rest,
    options: {
      json: { type: 'boolean', default: false },
      design: { type: 'string' },
      message: { type: 'string', short: 'm' },
      name: { type: 'string' },
      confirm: { type: 'string' },
    },
    allowPositionals: true,
    strict: true,
  });
  const need = (n: number) => {
    if (positionals.length !== n) throw cliErrors.usage(STORE_USAGE);
  };
  switch (sub) {
    case 'list':
      need(0);
      return runStore((s) => {
        const list = s.list();
        if (values.json) out.stdout(JSON.stringify(list, null, 2));
        else if (list.length === 0) out.stdout(`No saved designs in ${s.file}.`);
        else
          out.stdout(
            `Designs in ${s.file}:\n${textTable(
              ['id', 'name', 'revisions', 'latest revision', 'changed (UTC)'],
              list.map((d) => [d.id, d.name, String(d.revision_count), d.head_revision.slice(0, 12), d.updated_at]),
              '  ',
            )}`,
          );
        return 0;
      });
    case 'save': {
      need(1);
      const input = readJsonFile(positionals[0]!);
      return runStore((s) => {
        const r = s.save(input, { designId: values.design, message: values.message, name: values.name });
        if (values.json) out.stdout(JSON.stringify(r, null, 2));
        else
          out.stdout(
            r.changed
              ? `saved revision ${r.revision_id} of design ${r.design.id} ("${r.design.name}")`
              : `unchanged: design ${r.design.id} already has this content as its latest revision ${r.revision_id}`,
          );
        return 0;
      });
    }
    case 'show':
      if (values.design !== undefined) need(0);
      else need(1);
      return runStore((s) => {
        const rev = values.design !== undefined ? s.open(values.design).revision : s.revision(positionals[0]!);
        out.stdout(designJson(rev.design));
        return 0;
      });
    case 'history':
      need(1);
      return runStore((s) => {
        const h = s.history(positionals[0]!);
        if (values.json) out.stdout(JSON.stringify(h, null, 2));
        else out.stdout(textTable(['#', 'saved (UTC)', 'revision', 'message'], h.map((e) => [String(e.seq), e.saved_at, e.revision_id, e.message ?? '']), '  '));
        return 0;
      });
    case 'diff':
      need(2);
      return runStore((s) => {
        const d = s.diff(positionals[0]!, positionals[1]!);
        if (values.json) out.stdout(JSON.stringify(d, null, 2));
        else
          out.stdout(
            [`From ${d.from}`, `to   ${d.to}`, d.entries.length === 0 ? 'No differences.' : `${d.entries.length} field(s) changed:`, ...d.entries.map((e) => `  ${e.text}`)].join('\n'),
          );
        return 0;
      });
    case 'rename':
      need(2);
      return runStore((s) => {
        const d = s.rename(positionals[0]!, positionals[1]!);
        out.stdout(`design ${d.id} is now named "${d.name}"`);
        return 0;
      });
    case 'duplicate':
      need(1);
      return runStore((s) => {
        const d = s.duplicate(positionals[0]!, values.name);
        out.stdout(`new design ${d.id} ("${d.name}") starts at revision ${d.head_revision}`);
        return 0;
      });
    case 'delete':
      need(1);
      return runStore((s) => {
        s.delete(positionals[0]!, values.confirm);
        out.stdout(`deleted design ${positionals[0]!} and its history`);
        return 0;
      });
    default:
      throw cliErrors.usage(STORE_USAGE);
  }
}
