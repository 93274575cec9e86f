/**
 * Nothing typed is lost on the workbench form:
 * - `keepSwitchedOut`: a type switch (brake, valve, a load state taken from the build-up) makes the panels'
 *   `normalise` drop the fields of the other variant. Those fields are kept, as typed, in the carried control
 *   field `_stash` (JSON, field name -> text) and put back when the variant is chosen again.
 * - `withoutDraftRows`: a new row of a build-up list starts empty; until something is typed into it, it is a
 *   draft and left out of the design that is read (so it raises no "is required" messages). Only trailing rows
 *   are drafts, so the paths of the other rows (and their messages) do not move.
 */
import { EMPTYABLE_LISTS, type FormValues, listIndices } from './design-form.ts';

export const STASH_FIELD = '_stash';
/** Most fields kept; a form has a few hundred fields, so this is never reached by typing. */
const STASH_LIMIT = 500;

function stashOf(values: FormValues): FormValues {
  const text = values[STASH_FIELD];
  if (!text) return {};
  try {
    const o: unknown = JSON.parse(text);
    if (o === null || typeof o !== 'object' || Array.isArray(o)) return {};
    // hostile input: plain string entries only, never a prototype key
    return Object.fromEntries(Object.entries(o).filter(([k, v]) => typeof v === 'string' && !k.startsWith('_') && k !== '__proto__' && k !== 'constructor' && k !== 'prototype').slice(0, STASH_LIMIT)) as FormValues;
  } catch {
    return {};
  }
}

/**
 * Runs `normalise` on the values with the stashed fields put back (where no field of that name is present;
 * `normalise` drops again those that do not apply) and stashes what `normalise` removed.
 * `convert` re-expresses the stash after a unit switch; `dropUnder` forgets stashed fields of a list whose
 * entries were just renumbered by a list operation.
 */
export function keepSwitchedOut(
  values: FormValues,
  normalise: (v: FormValues) => FormValues,
  opts: { convert?: (v: FormValues) => FormValues; dropUnder?: string } = {},
): FormValues {
  let stash = stashOf(values);
  if (opts.dropUnder) {
    const list = opts.dropUnder;
    stash = Object.fromEntries(Object.entries(stash).filter(([k]) => !k.startsWith(`${list}[`)));
  }
  if (opts.convert && Object.keys(stash).length > 0) {
    stash = opts.convert(stash);
    delete stash._exact;
  }
  const current: FormValues = { ...values };
  delete current[STASH_FIELD];
  const merged: FormValues = { ...stash, ...current };
  const out: FormValues = { ...normalise(merged) };
  delete out[STASH_FIELD];
  const removed = Object.entries(merged).filter(([k]) => !(k in out) && !k.startsWith('_'));
  if (removed.length > 0) out[STASH_FIELD] = JSON.stringify(Object.fromEntries(removed.slice(0, STASH_LIMIT)));
  return out;
}

/** Fields of a build-up row that do not make it filled in (a starting choice, not something typed). */
const NOT_TYPED = new Set(['group', 'driver', 'fill_weighed']);

/** The values without the trailing rows of the build-up lists that nothing was typed into (for reading only). */
export function withoutDraftRows(values: FormValues): FormValues {
  let out: FormValues | null = null;
  for (const { list } of EMPTYABLE_LISTS) {
    const idx = listIndices(values, list);
    for (let j = idx.length - 1; j >= 0; j--) {
      const p = `${list}[${idx[j]}]`;
      const fields = Object.entries(out ?? values).filter(([n]) => n.startsWith(`${p}.`));
      const typed = fields.some(([n, v]) => !NOT_TYPED.has(n.slice(p.length + 1)) && v.trim() !== '');
      if (typed || fields.length === 0) break;
      out ??= { ...values };
      for (const [n] of fields) delete out[n];
    }
  }
  return out ?? values;
}
