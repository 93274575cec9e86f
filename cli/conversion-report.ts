/** Lines of `lockstep evaluate` text about where a load state's figures come from and its rating margins. */
import type { LoadStateResult } from '../core/index.ts';
import { fmt } from './table.ts';

const WORDS: Record<string, string> = { build_up: 'mass build-up', measured: 'measured', entered: 'entered' };

export function conversionLines(s: LoadStateResult): string[] {
  const out: string[] = [];
  if (s.derived_from !== undefined) {
    const u = s.cg_height_uncertainty_m;
    out.push(
      `  Figures from: ${WORDS[s.derived_from] ?? s.derived_from}${s.from_build_up ? ` (${s.from_build_up} state)` : ''}; ` +
        `CG height from ${WORDS[s.cg_height_derived_from ?? s.derived_from] ?? s.cg_height_derived_from}${u !== null && u !== undefined ? `, standard uncertainty ${fmt(u, 3)} m` : ''}`,
    );
  }
  const r = s.ratings;
  if (r) {
    const part = (name: string, m: number | null) => (m === null ? null : `${name} ${m >= 0 ? '+' : ''}${fmt(m, 0)} kg${m < 0 ? ' (OVER)' : ''}`);
    const parts = [part('mass', r.mass_margin_kg), part('front axle', r.front_axle_margin_kg), part('rear axle', r.rear_axle_margin_kg)].filter((p) => p !== null);
    if (r.front_share_margin_pct !== null) parts.push(`front share ${fmt(r.front_axle_share_pct, 1)} % (${r.front_share_margin_pct >= 0 ? '+' : ''}${fmt(r.front_share_margin_pct, 1)} points on the minimum)`);
    out.push(`  Rating margins: ${parts.join(', ')}`);
  }
  return out;
}
