/**
 * The document model: what a result says to people, built once from an EvaluationResult (and the unit system),
 * as sections of tables with titled columns and units, lines of text, item lists (verdict lines, warnings) and
 * chart series. The command-line text report and the workbench panels render this model; neither formats a
 * number nor names a code itself (numbers: report/format.ts, words for codes: report/labels.ts).
 */
import type { EvaluationResult, UnitSystem } from '../core/index.ts';
import type { ReportDocument, Section } from './model.ts';
import { checksSection } from './checks.ts';
import { pedalTravelSection, pitfallSection, valveFailureSection } from './hardware.ts';
import { limitsSection } from './limits.ts';
import { stateSection, verdictSection, warningsSection } from './states.ts';

export type * from './model.ts';
export { cellText, col, text } from './model.ts';

export interface DocumentOptions {
  units?: UnitSystem;
}

const cache = new WeakMap<EvaluationResult, Map<UnitSystem, ReportDocument>>();

/** The document of a result in a unit system (built once per result object and system). */
export function buildDocument(r: EvaluationResult, opts: DocumentOptions = {}): ReportDocument {
  const units = opts.units ?? 'metric';
  const known = cache.get(r)?.get(units);
  if (known) return known;
  const labels = r.load_states.map((s) => s.label);
  const sections: Section[] = [];
  const warn = warningsSection(r.warnings, labels, 'design-warnings', 'Warnings');
  if (warn) sections.push(warn);
  const pit = pitfallSection(r, labels);
  if (pit) sections.push(pit);
  r.load_states.forEach((s, i) => sections.push(stateSection(s, i, units, labels)));
  sections.push(valveFailureSection(r, units), pedalTravelSection(r, units, labels));
  sections.push(...limitsSection(r, units));
  const checks = checksSection(r, units);
  if (checks) sections.push(checks);
  const doc: ReportDocument = {
    title: `Lockstep ${r.lockstep_version}: ${r.design_name}`,
    units,
    verdict: verdictSection(r.verdict),
    sections,
    caution: r.caution,
  };
  const m = cache.get(r) ?? new Map<UnitSystem, ReportDocument>();
  m.set(units, doc);
  cache.set(r, m);
  return doc;
}

/** The section of a document with this id (panels pick theirs). */
export function sectionOf(doc: ReportDocument, id: string): Section | undefined {
  return doc.sections.find((s) => s.id === id);
}

/** Every section whose id starts with a prefix ("state-", "traction-"). */
export function sectionsOf(doc: ReportDocument, prefix: string): Section[] {
  return doc.sections.filter((s) => s.id.startsWith(prefix));
}
