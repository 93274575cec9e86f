// Sources: issue 4 (a check table per load state: rule, verdict, margin, where it fails, source, status;
// [P]/[M] verdicts carry "verify against the current official text"); OWASP XSS Prevention Cheat Sheet
// rule #1 (user text escaped). Design: hand-built fixed split φ = 0.6, which fails the M1 lock order of
// 71/320/EEC Annex II Appendix point 3.1.1 from z* = (0.6 − 0.5)/0.2 = 0.50 (test/core/checks/fixed-split.ts).
import { describe, expect, it } from 'vitest';
import { evaluate, VERIFY_NOTE } from '../../core/index.ts';
import { checksPanel } from '../../views/panels/checks.ts';
import { panels } from '../../views/panels/index.ts';
import { splitDesign } from '../core/checks/fixed-split.ts';

describe('checks panel', () => {
  it('shows a table per load state with the failing range, source and verify note, and is registered', () => {
    const design = splitDesign({ frontPistons: 3, rearPistons: 2 });
    design.load_states[1]!.label = 'laden <script>';
    const page = checksPanel.results!({ design, result: evaluate(design), units: 'metric', warnings: [] }).html;
    expect(page).toContain('front axle locks first (71/320/EEC Appendix)');
    expect(page).toContain('title="eu-appendix/lock-order"'); // the rule id only in a tooltip
    expect(page).toContain('FAIL');
    expect(page).toContain('z 0.500–0.800');
    expect(page).toContain('71/320/EEC Annex II Appendix, point 3.1.1, M1 requirement (diagram 1A)');
    expect(page).toContain(VERIFY_NOTE);
    expect(page).toContain('laden &lt;script&gt;');
    expect(page).not.toContain('laden <script>');
    expect(panels.map((p) => p.id)).toContain('checks');
  });
});
