/**
 * The optional blocks of a design that take part in its evaluation, in words: the workbench shows them above
 * the results and the evidence packet beside the inputs, so nothing the file carries (a base vehicle for the
 * brake heat, regeneration figures, test results) works unseen.
 */
import type { DesignFile } from '../core/index.ts';

const OPTIONAL_BLOCKS: readonly [keyof DesignFile, string][] = [
  ['regen', 'regenerative braking'],
  ['heat', 'brake heat'],
  ['traction', 'traction limits'],
  ['stopping', 'stopping distance'],
  ['tester', 'roller brake tester settings'],
  ['hardware', 'fluid volume and pedal travel data'],
  ['base_vehicle', 'base vehicle'],
  ['conversion', 'conversion facts'],
  ['build_up', 'mass build-up'],
  ['ratings', 'rating plate values'],
  ['parking_brake', 'parking brake'],
  ['tolerances', 'tolerances (robustness)'],
  ['lightly_loaded', 'lightly loaded vehicle'],
  ['towing', 'towing'],
  ['systems', 'antilock, stability control and brake-force distribution status'],
  ['test_results', 'measured brake-test results'],
];

export function activeBlocks(design: DesignFile): string[] {
  const out = OPTIONAL_BLOCKS.filter(([k]) => design[k] !== undefined).map(([, w]) => w);
  // the base vehicle of the brake-heat comparison sits inside `heat`
  if (design.heat?.base_vehicle_mass_kg !== undefined) out.push('base vehicle mass (brake heat comparison)');
  return out;
}

/** "Optional parts taking part: regenerative braking, brake heat." */
export function activeBlocksLine(design: DesignFile): string {
  const a = activeBlocks(design);
  return `Optional parts of the design taking part: ${a.length ? a.join(', ') : 'none'}.`;
}
