/**
 * Small input components for the workbench form. Each takes the field's design path as its name and shows
 * the value as typed, the unit of the user's unit system and the field's messages (see form/design-form.ts).
 */
import { type InputSource, PROVENANCE_SOURCES, type UnitSystem } from '../core/index.ts';
import { displayUnitOf, type FormValues, NOTE_FIELD, SOURCE_FIELD, unitLabel } from '../form/design-form.ts';
import { PROVENANCE_LABELS } from '../report/labels.ts';
import { html, type SafeHtml } from './html.ts';

export interface InputContext {
  values: FormValues;
  units: UnitSystem;
  /** Messages per field name (design path). */
  errors: ReadonlyMap<string, readonly string[]>;
  /** Names of fields whose change re-renders the inputs (filled while rendering). */
  structural: Set<string>;
  /** Names of the fields rendered so far; any other value is carried along as a hidden input. */
  rendered: Set<string>;
  /** Label of each rendered field, for the problem list in the status block (optional). */
  labels?: Map<string, string>;
  /** Where each input's value came from, for the inputs with a provenance entry (form/design-form.ts formProvenance). */
  sources?: ReadonlyMap<string, InputSource>;
}

const SOURCE_WORDS: readonly [string, string][] = [['', 'not stated'], ...PROVENANCE_SOURCES.map((s): [string, string] => [s, PROVENANCE_LABELS[s]])];

/**
 * The source of an input beside it: a small select (not stated, measured, maker's figure, ...) and a note. An
 * entry recorded for another value shows as "not stated", flagged: the value changed since its source was given.
 */
export function sourceField(ctx: InputContext, name: string, label: string, oob = false): SafeHtml {
  const src = ctx.sources?.get(name);
  const current = src && (src.state === 'recorded' || src.state === 'unconfirmed') ? (src.source ?? '') : '';
  const flag = src?.state === 'changed' ? 'the value changed since its source was given' : src?.state === 'unconfirmed' ? 'recorded without its value: confirm the source' : '';
  const sel = `${SOURCE_FIELD}${name}`;
  const note = `${NOTE_FIELD}${name}`;
  return html`<details class="src${flag ? ' flagged' : ''}" id="${sourceId(name)}"${oob ? html` hx-swap-oob="true"` : ''}><summary>source: ${SOURCE_WORDS.find(([k]) => k === current)?.[1] ?? 'not stated'}${flag ? html` <em>(${flag})</em>` : ''}</summary>
<label for="${fieldId(sel)}" class="sr">Source of ${label}</label><select id="${fieldId(sel)}" name="${sel}">${SOURCE_WORDS.map(([k, w]) => html`<option value="${k}"${k === current ? html` selected` : ''}>${w}</option>`)}</select>
<label for="${fieldId(note)}" class="sr">Note on the source of ${label}</label><input id="${fieldId(note)}" name="${note}" value="${current ? (ctx.values[note] ?? src?.note ?? '') : ''}" maxlength="2000" placeholder="note (weighbridge, data sheet …)" class="w-l"></details>`;
}

export function fieldId(name: string): string {
  return `f-${name.replace(/[^A-Za-z0-9_-]+/g, '-')}`;
}
export function sourceId(name: string): string {
  return `s-${name.replace(/[^A-Za-z0-9_-]+/g, '-')}`;
}
export function messageId(name: string): string {
  return `m-${name.replace(/[^A-Za-z0-9_-]+/g, '-')}`;
}

/** The message slot under a field; the server fills it (or empties it) with out-of-band swaps. */
export function fieldMessage(name: string, messages: readonly string[] | undefined, oob = false): SafeHtml {
  return html`<p class="msg" id="${messageId(name)}"${oob ? html` hx-swap-oob="true"` : ''}>${(messages ?? []).join('; ')}</p>`;
}

export interface FieldOptions {
  hint?: string;
  /** Leave empty to omit the key (optional values). */
  optional?: boolean;
  /** Visually hidden label (tables). */
  compact?: boolean;
  /** Unit shown for a plain number, e.g. "–" for ratios. */
  unitText?: string;
  width?: 's' | 'm' | 'l';
}

function labelFor(name: string, label: string, unit: string, o: FieldOptions): SafeHtml {
  return html`<label for="${fieldId(name)}"${o.compact ? html` class="sr"` : ''}>${label}${unit ? html` <span class="unit">(${unit})</span>` : ''}${o.optional ? html` <span class="opt">optional</span>` : ''}</label>`;
}

/** A number field; accepts a typed unit ("58 in"). */
export function numberField(ctx: InputContext, name: string, label: string, o: FieldOptions = {}): SafeHtml {
  ctx.rendered.add(name);
  ctx.labels?.set(name, label);
  const unit = o.unitText ?? unitLabel(displayUnitOf(name, ctx.units));
  const errs = ctx.errors.get(name);
  return html`<div class="field${o.compact ? ' compact' : ''}${errs?.length ? ' bad' : ''}">
${labelFor(name, label, unit, o)}<span class="in"><input id="${fieldId(name)}" name="${name}" value="${ctx.values[name] ?? ''}" inputmode="decimal" autocomplete="off" class="w-${o.width ?? 'm'}" aria-describedby="${messageId(name)}"${o.compact ? html` aria-label="${label}${unit ? ` (${unit})` : ''}"` : ''}>${unit ? html`<span class="u" aria-hidden="true">${unit}</span>` : ''}</span>
${o.hint ? html`<small class="hint">${o.hint}</small>` : ''}${o.compact ? '' : sourceField(ctx, name, label)}${fieldMessage(name, errs)}</div>`;
}

export function textField(ctx: InputContext, name: string, label: string, o: FieldOptions & { maxLength?: number; multiline?: boolean } = {}): SafeHtml {
  ctx.rendered.add(name);
  ctx.labels?.set(name, label);
  const errs = ctx.errors.get(name);
  const v = ctx.values[name] ?? '';
  const attrs = html`id="${fieldId(name)}" name="${name}" maxlength="${o.maxLength ?? 200}" aria-describedby="${messageId(name)}"${o.compact ? html` aria-label="${label}"` : ''} class="w-${o.width ?? 'l'}"`;
  return html`<div class="field${o.compact ? ' compact' : ''}${errs?.length ? ' bad' : ''}">
${labelFor(name, label, '', o)}${o.multiline ? html`<textarea ${attrs} rows="2">${v}</textarea>` : html`<input ${attrs} value="${v}" autocomplete="off">`}
${o.hint ? html`<small class="hint">${o.hint}</small>` : ''}${fieldMessage(name, errs)}</div>`;
}

/** A choice from a fixed list. `structural` re-renders the inputs when it changes (type switches). */
export function selectField(
  ctx: InputContext,
  name: string,
  label: string,
  options: ReadonlyArray<readonly [value: string, text: string]>,
  o: FieldOptions & { structural?: boolean } = {},
): SafeHtml {
  ctx.rendered.add(name);
  ctx.labels?.set(name, label);
  if (o.structural) ctx.structural.add(name);
  const v = ctx.values[name] ?? options[0]?.[0] ?? '';
  const errs = ctx.errors.get(name);
  return html`<div class="field${o.compact ? ' compact' : ''}${errs?.length ? ' bad' : ''}">
${labelFor(name, label, '', o)}<select id="${fieldId(name)}" name="${name}" aria-describedby="${messageId(name)}"${o.compact ? html` aria-label="${label}"` : ''}>${options.map(([value, text]) => html`<option value="${value}"${value === v ? html` selected` : ''}>${text}</option>`)}${options.some(([value]) => value === v) ? '' : html`<option value="${v}" selected>${v} (not allowed)</option>`}</select>
${o.hint ? html`<small class="hint">${o.hint}</small>` : ''}${fieldMessage(name, errs)}</div>`;
}

/** A yes/no value: hidden "false" then the checkbox "true" (the last value sent wins). */
export function checkField(ctx: InputContext, name: string, label: string, o: FieldOptions = {}): SafeHtml {
  ctx.rendered.add(name);
  ctx.labels?.set(name, label);
  const on = ['true', 'on', '1', 'yes'].includes((ctx.values[name] ?? '').toLowerCase());
  const errs = ctx.errors.get(name);
  return html`<div class="field check${errs?.length ? ' bad' : ''}"><input type="hidden" name="${name}" value="false">
<label><input type="checkbox" id="${fieldId(name)}" name="${name}" value="true"${on ? html` checked` : ''} aria-describedby="${messageId(name)}"> ${label}</label>
${o.hint ? html`<small class="hint">${o.hint}</small>` : ''}${fieldMessage(name, errs)}</div>`;
}

/** Values of a three-way yes/no choice: "" leaves the key out (form/design-form.ts). */
export const TRI_STATE_OPTIONS = [['', 'not stated'], ['true', 'yes'], ['false', 'no']] as const;

/**
 * An optional yes/no fact where "not stated" must stay possible (a checkbox always writes true or false):
 * a select "not stated" / "yes" / "no". "not stated" sends empty text and leaves the key out of the design.
 */
export function triStateField(ctx: InputContext, name: string, label: string, o: FieldOptions = {}): SafeHtml {
  const v = (ctx.values[name] ?? '').trim().toLowerCase();
  const shown = ['true', 'on', '1', 'yes'].includes(v) ? 'true' : ['false', 'off', '0', 'no'].includes(v) ? 'false' : v;
  return selectField({ ...ctx, values: { ...ctx.values, [name]: shown } }, name, label, TRI_STATE_OPTIONS, { optional: true, ...o });
}

/** A button that changes the structure of a list ("add:path", "dup:path[i]", "remove:path[i]"). */
export function listButton(op: string, text: string, title: string, disabled = false): SafeHtml {
  return html`<button type="button" class="op" name="_op" value="${op}" title="${title}" hx-post="/workbench/update" hx-target="#status" hx-swap="outerHTML" hx-sync="closest form:replace"${disabled ? html` disabled` : ''}>${text}</button>`;
}

/** Names of the fields currently present under a list path, by index. */
export function listIndicesOf(values: FormValues, listPath: string): number[] {
  const set = new Set<number>();
  for (const n of Object.keys(values)) {
    if (!n.startsWith(`${listPath}[`)) continue;
    const m = /^\[(\d+)\]/.exec(n.slice(listPath.length));
    if (m) set.add(Number(m[1]));
  }
  return [...set].sort((a, b) => a - b);
}

/** A message slot for a whole list or block (e.g. "load_states"), kept up to date like a field's. */
export function blockMessage(ctx: InputContext, path: string): SafeHtml {
  ctx.rendered.add(path);
  return fieldMessage(path, ctx.errors.get(path));
}

/** Prefixes the problem-list labels of every field under a path ("Load state 2: Vehicle mass"). */
export function prefixLabels(ctx: InputContext, pathPrefix: string, textPrefix: string): void {
  if (!ctx.labels) return;
  for (const [n, l] of ctx.labels) if (n.startsWith(pathPrefix) && !l.startsWith(textPrefix)) ctx.labels.set(n, `${textPrefix}${l}`);
}
