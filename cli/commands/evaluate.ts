/**
 * `lockstep evaluate FILE|FOLDER ... [--at z1,z2,...] [--rules id,id] [--json] [--curves] [--report junit OUT]`.
 * One file: the full report (or the lockstep-result/1 JSON). Several files or a folder (its *.json files, not
 * recursive, in name order): one line per file and a summary, or with --json one JSON object per line (JSON Lines).
 * Exit status per file through `fileStatus`, from the verdict (cli/exit-code.ts: 0 pass, 1 fail, 2 invalid input,
 * 3 incomplete); the command's
 * exit status is the worst of the files' (`worstStatus`).
 */
import { readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { CAUTION, type EvaluationResult, evaluate, readDesign, RULE_SELECTORS, SCENARIO_LABELS } from '../../core/index.ts';
import { exitCodeFor } from '../exit-code.ts';
import type { LockstepError } from '../../core/errors.ts';
import { cliErrors, isCommandError } from '../errors.ts';
import { junitReport, type JunitCase } from '../junit.ts';
import { readJsonFile } from '../read-json.ts';
import { textReport } from '../text-report.ts';
import type { CommandOutput } from '../output.ts';

export function parseBrakingRates(text: string): number[] {
  const parts = text.split(',').map((s) => s.trim());
  return parts.map((p) => {
    const z = Number(p);
    if (p === '' || !Number.isFinite(z) || z < 0 || z > 1.5) {
      throw cliErrors.usage(`--at: "${p}" is not a braking rate; give numbers from 0 to 1.5 separated by commas, e.g. --at 0.3,0.5,0.8`);
    }
    return z;
  });
}

/** `--rules eu-appendix,fmvss135`: rule-set ids or single rule ids, each one known. */
export function parseRuleSelection(text: string): string[] {
  const ids = text.split(',').map((s) => s.trim());
  for (const id of ids) {
    if (!RULE_SELECTORS.includes(id)) {
      throw cliErrors.usage(`--rules: "${id}" is not a rule set or rule; use one or more of ${RULE_SELECTORS.join(', ')} separated by commas`);
    }
  }
  return ids;
}

/** The exit status of one evaluated design: the one verdict's (cli/exit-code.ts; checks, failed valve, regeneration). */
export function fileStatus(result: EvaluationResult): number {
  return exitCodeFor(result.verdict);
}

/**
 * Severity of the exit statuses, least to most: 0 pass, 3 incomplete (a check could not be made), 1 fail,
 * 2 invalid input. A run over several files ends with the most severe status of any file: an unreadable file is
 * the first thing to fix, then a failing check, then a missing input.
 */
const SEVERITY = [0, 3, 1, 2];
export function worstStatus(statuses: readonly number[]): number {
  return statuses.reduce((w, s) => (SEVERITY.indexOf(s) > SEVERITY.indexOf(w) ? s : w), 0);
}

const USAGE = 'usage: lockstep evaluate FILE|FOLDER ... [--at z1,z2,...] [--rules id,id,...] [--json] [--curves] [--report junit OUT.xml]';

/** The design files named: files as given, a folder as its *.json files (name order, not recursive). */
export function designFiles(paths: readonly string[]): { files: string[]; batch: boolean } {
  const files: string[] = [];
  let folder = false;
  for (const p of paths) {
    let isDir = false;
    try {
      isDir = statSync(p).isDirectory();
    } catch {
      // a missing file is reported when it is read
    }
    if (isDir) {
      folder = true;
      const names = readdirSync(p).filter((n) => n.toLowerCase().endsWith('.json')).sort();
      if (names.length === 0) throw cliErrors.fileUnreadable(p, 'it is a folder with no .json design files in it');
      files.push(...names.map((n) => join(p, n)));
    } else files.push(p);
  }
  return { files, batch: folder || files.length > 1 };
}

type Outcome = { file: string; status: number; result: EvaluationResult } | { file: string; status: 2; error: LockstepError };

const STATUS_WORDS: Record<number, string> = { 0: 'PASS', 1: 'FAIL', 2: 'INVALID', 3: 'INCOMPLETE' };

function outcomeLine(o: Outcome): string {
  if ('error' in o) return `${STATUS_WORDS[2]!.padEnd(10)} ${o.file}: ${o.error.message}${o.error.details.length ? ` first: ${o.error.details[0]}` : ''}`;
  return `${(STATUS_WORDS[o.status] ?? String(o.status)).padEnd(10)} ${o.file} (${o.result.design_name}): ${o.result.verdict.summary}`;
}

function jsonLine(o: Outcome): string {
  if ('error' in o) return JSON.stringify({ file: o.file, status: o.status, error: { code: o.error.code, message: o.error.message, details: o.error.details } });
  return JSON.stringify({ file: o.file, status: o.status, result: o.result });
}

/** The JUnit test cases of one design: one per check (and load state, scenario) and one per failure mode. */
function junitCases(o: Outcome): JunitCase[] {
  if ('error' in o) return [{ name: 'design file reads', error: `${o.error.message}\n${o.error.details.join('\n')}` }];
  const cases: JunitCase[] = o.result.checks.map((c) => {
    const name = [c.title, c.load_state ? `load state ${c.load_state}` : '', SCENARIO_LABELS[c.scenario]].filter(Boolean).join(', ');
    const why = [c.note ?? '', c.verify_note ?? '', `${c.source.document}, ${c.source.paragraph}`].filter(Boolean).join('\n');
    if (!c.applies) return { name, skipped: `does not apply. ${c.note ?? ''}`.trim() };
    if (c.passed === null) return { name, skipped: `not checked. ${c.note ?? ''}`.trim() };
    if (c.advisory) return { name, ...(c.passed ? {} : { skipped: `for information only (does not decide): fails. ${why}` }) };
    return c.passed ? { name } : { name, failure: `fails: worst margin ${c.worst_margin ?? 'n/a'} (${c.margin_unit})${c.worst_at_braking_rate !== null ? ` at z = ${c.worst_at_braking_rate.toFixed(3)}` : ''}\n${why}` };
  });
  for (const f of o.result.failure_modes) {
    const name = `failure mode: ${f.description}, load state ${f.load_state}`;
    cases.push(f.passed ? { name } : { name, failure: `${f.max_deceleration_ms2.toFixed(2)} m/s² reached, ${f.required_ms2.toFixed(2)} m/s² required\n${f.source}` });
  }
  // the curve checks with regeneration at each analysed speed count in the verdict: one case each that fails or is not checked
  for (const r of [...o.result.verdict.failed, ...o.result.verdict.not_checked].filter((x) => x.kind === 'regeneration')) {
    cases.push(r.passed === false ? { name: r.description, failure: r.description } : { name: r.description, skipped: r.description });
  }
  return cases;
}

export function evaluateCommand(argv: string[], out: CommandOutput): number {
  const { values, positionals } = parseArgs({
    args: argv,
    options: {
      at: { type: 'string' },
      json: { type: 'boolean', default: false },
      curves: { type: 'boolean', default: false },
      rules: { type: 'string' },
      report: { type: 'string', multiple: true },
    },
    allowPositionals: true,
    strict: true,
  });
  // --report junit OUT: parseArgs takes "junit" as the option's value and OUT as a positional; pair them back up
  let junitOut: string | undefined;
  const paths = [...positionals];
  for (const kind of values.report ?? []) {
    if (kind !== 'junit') throw cliErrors.usage(`--report: "${kind}" is not a report format; the one known is junit (--report junit OUT.xml)`);
    const i = paths.findIndex((p) => p.toLowerCase().endsWith('.xml'));
    if (i < 0 || junitOut !== undefined) throw cliErrors.usage(`--report junit needs the file to write, ending in .xml (--report junit OUT.xml); ${USAGE}`);
    junitOut = paths.splice(i, 1)[0]!;
  }
  if (paths.length === 0) throw cliErrors.usage(USAGE);
  const at = values.at === undefined ? undefined : parseBrakingRates(values.at);
  const rules = values.rules === undefined ? undefined : parseRuleSelection(values.rules);
  const { files, batch } = designFiles(paths);
  const run = (file: string): Outcome => {
    const reading = readDesign(readJsonFile(file));
    if (!reading.ok) throw cliErrors.invalid(file, reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
    const result = evaluate(reading.design, { at, curves: values.curves, rules, warnings: reading.warnings });
    return { file, status: fileStatus(result), result };
  };

  if (!batch) {
    // one file: the full report; an unreadable file ends the command (exit 2, the message on stderr)
    const file = files[0]!;
    let o: Outcome;
    try {
      o = run(file);
    } catch (e) {
      if (junitOut !== undefined && isCommandError(e)) writeFileSync(junitOut, junitReport([{ name: file, cases: junitCases({ file, status: 2, error: e }) }]));
      throw e;
    }
    if (junitOut !== undefined) writeFileSync(junitOut, junitReport([{ name: file, cases: junitCases(o) }]));
    if ('result' in o) out.stdout(values.json ? JSON.stringify(o.result, null, 2) : textReport(o.result));
    return o.status;
  }
  const outcomes: Outcome[] = [];
  for (const file of files) {
    let o: Outcome;
    try {
      o = run(file);
    } catch (e) {
      if (!(isCommandError(e))) throw e;
      o = { file, status: 2, error: e };
    }
    outcomes.push(o);
    out.stdout(`${values.json ? jsonLine(o) : outcomeLine(o)}\n`);
  }
  if (junitOut !== undefined) writeFileSync(junitOut, junitReport(outcomes.map((o) => ({ name: o.file, cases: junitCases(o) }))));
  const count = (s: number) => outcomes.filter((o) => o.status === s).length;
  if (!values.json) {
    const parts = [`${count(0)} pass`, `${count(1)} fail`, `${count(2)} invalid`, ...(count(3) ? [`${count(3)} incomplete`] : [])];
    out.stdout(`${outcomes.length} designs: ${parts.join(', ')}.${junitOut ? ` JUnit report: ${junitOut}.` : ''}\nCAUTION: ${CAUTION}\n`);
  }
  return worstStatus(outcomes.map((o) => o.status));
}
