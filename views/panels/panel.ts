/**
 * What a workbench panel is. A panel renders inputs (into the design form) and/or results (beside the
 * verdict); the list in views/panels/index.ts decides the order. See DEVELOPERS.md, "Workbench panels".
 */
import type { DesignFile, EvaluationResult, UnitSystem, Warning } from '../../core/index.ts';
import type { FormValues } from '../../form/design-form.ts';
import type { InputContext } from '../fields.ts';
import type { SafeHtml } from '../html.ts';

export type { InputContext };

export interface ResultContext {
  /** The last valid design (SI / design-file units). */
  design: DesignFile;
  /** evaluate(design, { curves: true }). */
  result: EvaluationResult;
  units: UnitSystem;
  warnings: Warning[];
  /**
   * Page controls posted with a deferred panel's own request (names starting with `_`, e.g. `_robust` from the
   * sizing panel's "Run robustness analysis" button); absent in the recompute.
   */
  controls?: Readonly<Record<string, string>>;
}

export interface Panel {
  /** Stable id; the panel's section gets id="panel-<id>" (its input section "panel-<id>-inputs" when it has both). */
  id: string;
  title: string;
  /** Inputs, inside the design form. Field names are design paths (form/design-form.ts). */
  inputs?: (ctx: InputContext) => SafeHtml;
  /** Results, rendered only for a valid design. */
  results?: (ctx: ResultContext) => SafeHtml;
  /**
   * Render the results on demand (when the section scrolls into view, POST /workbench/panel/<id>) instead of
   * with every recompute. For result panels that cost more than about a millisecond, so typing stays quick.
   */
  deferred?: boolean;
  /**
   * Called when a structural field changed (a type switch, a list operation, the unit system): drop the fields
   * that no longer apply and fill new ones with starting values, in the user's units.
   */
  normalise?: (values: FormValues, units: UnitSystem) => FormValues;
}
