/**
 * Applying a sizing proposal to a design: every proposal names the design-file path it changes and
 * the new value (PartOption.path/value, BoreSizing.path, ValveSearch.path, BalanceBarSizing.path).
 * Only these paths are accepted; the result is a new design (the input is not changed) that the
 * caller validates again with readDesign.
 */
import type { DesignFile } from '../design.ts';
import { coreErrors } from '../errors.ts';

export const SIZING_PATHS = [
  'axles.front.brake.piston_diameters_mm',
  'axles.rear.brake.piston_diameters_mm',
  'axles.front.brake.wheel_cylinder_diameter_mm',
  'axles.rear.brake.wheel_cylinder_diameter_mm',
  'hydraulics.master_cylinder_bore_mm',
  'hydraulics.rear_valve',
  'hydraulics.balance_bar.setting_front_share',
] as const;
export type SizingPath = (typeof SIZING_PATHS)[number];

export function isSizingPath(p: string): p is SizingPath {
  return (SIZING_PATHS as readonly string[]).includes(p);
}

/** A copy of the design with `value` written at `path`; throws CORE_ERR_SIZING_PATH for any other path. */
export function applySizingChange(design: DesignFile, path: string, value: unknown): DesignFile {
  if (!isSizingPath(path)) throw coreErrors.sizingPath(`"${path}" is not a path a sizing proposal changes; allowed: ${SIZING_PATHS.join(', ')}`);
  const copy = structuredClone(design) as unknown as Record<string, unknown>;
  const keys = path.split('.');
  let node = copy;
  for (const k of keys.slice(0, -1)) {
    const next = node[k];
    if (next === null || typeof next !== 'object') throw coreErrors.sizingPath(`the design has no "${k}" on the way to "${path}"`);
    node = next as Record<string, unknown>;
  }
  node[keys[keys.length - 1]!] = structuredClone(value);
  return copy as unknown as DesignFile;
}
