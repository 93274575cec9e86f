/** The human-readable form of `lockstep evaluate`: the document model of the result (report/) as plain text. */
import type { EvaluationResult, UnitSystem } from '../core/index.ts';
import { buildDocument } from '../report/document.ts';
import { documentText } from './document-text.ts';

export function textReport(r: EvaluationResult, units: UnitSystem = 'metric'): string {
  return documentText(buildDocument(r, { units }));
}
