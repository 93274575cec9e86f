/**
 * The sizing panel's "apply" and "undo" (views/panels/sizing.ts). A button posts the whole design form with
 * `_op = "size:apply:<design path>=<JSON value>"`; the path is one a sizing proposal changes
 * (core/sizing/apply-change.ts). The form is read as a design, the value written, and the form rebuilt from
 * the new design in the user's units. The value it replaced is kept in the page control `_sizing_undo`
 * ("<path>=<JSON>"), which the panel offers as "Undo" (an apply of the old value).
 */
import { applySizingChange, isSizingPath, type UnitSystem } from '../core/index.ts';
import { formErrors } from './errors.ts';
import { designToValues, type FormValues, readForm } from './design-form.ts';

export const SIZING_OP = 'size:apply:';
export const SIZING_UNDO_FIELD = '_sizing_undo';

export function sizingOp(path: string, value: unknown): string {
  return `${SIZING_OP}${path}=${JSON.stringify(value)}`;
}

function valueAt(design: unknown, path: string): unknown {
  let node: unknown = design;
  for (const k of path.split('.')) node = node !== null && typeof node === 'object' ? (node as Record<string, unknown>)[k] : undefined;
  return node;
}

/** New form values with the proposal applied; unchanged values when the form is not a valid design. */
export function applySizingOp(values: FormValues, op: string, units: UnitSystem): FormValues {
  const body = op.slice(SIZING_OP.length);
  const eq = body.indexOf('=');
  const path = eq > 0 ? body.slice(0, eq) : '';
  if (!isSizingPath(path)) throw formErrors.unknownOperation(op);
  let value: unknown;
  try {
    value = JSON.parse(body.slice(eq + 1));
  } catch {
    throw formErrors.unknownOperation(op);
  }
  const reading = readForm(values, units);
  if (!reading.ok) return values;
  const old = valueAt(reading.design, path);
  let changed: ReturnType<typeof applySizingChange>;
  try {
    changed = applySizingChange(reading.design, path, value);
  } catch {
    // the proposal names a part the design no longer has (e.g. a balance bar setting without a balance bar)
    throw formErrors.sizingNotApplicable(`it changes a part this design does not have`);
  }
  const next = designToValues(changed, units);
  // other carried page data (names starting with "_") travel along, except what the rebuilt form states anew
  // (`_exact`, `_provenance` come from the design itself) and the undo slot
  for (const [k, v] of Object.entries(values)) if (k.startsWith('_') && k !== SIZING_UNDO_FIELD && k !== '_exact' && !(k in next)) next[k] = v;
  if (old !== undefined) next[SIZING_UNDO_FIELD] = `${path}=${JSON.stringify(old)}`;
  return next;
}
