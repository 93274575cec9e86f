/**
 * One design → its evaluation (with curves) → the packet PDF. The CLI and the page both come here, so
 * the packet for a revision always has the numbers the page and `lockstep evaluate` show for it.
 */
import { type DesignFile, evaluate, type EvaluationResult, readDesign, type Warning } from '../core/index.ts';
import { revisionId } from '../store/revision-id.ts';
import { packetPdf } from './packet-pdf.ts';

/** The evaluation the packet prints (curves included for the charts). */
export function evaluateForPacket(design: DesignFile, warnings: Warning[] = [], rules?: readonly string[]): EvaluationResult {
  return evaluate(design, { curves: true, warnings, ...(rules ? { rules } : {}) });
}

/** A stored design's warnings, as `lockstep evaluate` shows them for the same file. */
export function warningsOf(design: DesignFile): Warning[] {
  const r = readDesign(design);
  return r.ok ? r.warnings : [];
}

export async function buildPacket(
  design: DesignFile,
  opts: { date: Date; warnings?: Warning[]; rules?: readonly string[]; saved?: boolean },
): Promise<{ pdf: Buffer; revisionId: string; result: EvaluationResult }> {
  const result = evaluateForPacket(design, opts.warnings, opts.rules);
  const rev = revisionId(design);
  // only a saved revision prints its id; a draft is marked as such on every page
  const pdf = await packetPdf({ design, result, revisionId: opts.saved ? rev : null, date: opts.date });
  return { pdf, revisionId: rev, result };
}
