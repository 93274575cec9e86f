/**
 * One design → its evaluation (with curves) → the packet PDF. The CLI and the page both come here, so
 * the packet for a revision always has the numbers the page and `lockstep evaluate` show for it.
 */
import { type DesignFile, evaluate, type EvaluationResult, type Warning } from '../../core/index.ts';
import { revisionId } from '../store/revision-id.ts';
import { packetPdf } from './packet-pdf.ts';

/** The evaluation the packet prints (curves included for the charts). */
export function evaluateForPacket(design: DesignFile, warnings: Warning[] = []): EvaluationResult {
  return evaluate(design, { curves: true, warnings });
}

export async function buildPacket(
  design: DesignFile,
  opts: { date: Date; warnings?: Warning[] },
): Promise<{ pdf: Buffer; revisionId: string; result: EvaluationResult }> {
  const result = evaluateForPacket(design, opts.warnings);
  const rev = revisionId(design);
  const pdf = await packetPdf({ design, result, revisionId: rev, date: opts.date });
  return { pdf, revisionId: rev, result };
}
