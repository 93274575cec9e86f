/**
 * A JUnit XML report (`lockstep evaluate ... --report junit OUT.xml`), so CI systems list the checks natively:
 * one <testsuite> per design file, one <testcase> per check (per load state and scenario) and failure mode.
 * The shape is the common one CI tools read (testsuites > testsuite > testcase with failure / error / skipped),
 * common practice, no source (JUnit's own XML has no published schema).
 */

export interface JunitCase {
  name: string;
  /** A failed check: the message. */
  failure?: string;
  /** The design could not be read. */
  error?: string;
  /** Not applicable, not checked or for information only. */
  skipped?: string;
}

export interface JunitSuite {
  name: string;
  cases: JunitCase[];
}

/** Text for an XML attribute or element: the five special characters escaped, control characters dropped. */
export function xmlText(s: string): string {
  return s
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/g, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

function firstLine(s: string): string {
  return s.split('\n')[0]!.slice(0, 200);
}

export function junitReport(suites: readonly JunitSuite[]): string {
  const count = (cs: readonly JunitCase[], k: 'failure' | 'error' | 'skipped') => cs.filter((c) => c[k] !== undefined).length;
  const all = suites.flatMap((s) => s.cases);
  const out = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<testsuites name="lockstep evaluate" tests="${all.length}" failures="${count(all, 'failure')}" errors="${count(all, 'error')}" skipped="${count(all, 'skipped')}">`,
  ];
  for (const s of suites) {
    const suite = xmlText(s.name);
    out.push(`  <testsuite name="${suite}" tests="${s.cases.length}" failures="${count(s.cases, 'failure')}" errors="${count(s.cases, 'error')}" skipped="${count(s.cases, 'skipped')}">`);
    for (const c of s.cases) {
      const open = `    <testcase classname="${suite}" name="${xmlText(c.name)}"`;
      const inner =
        c.failure !== undefined
          ? `<failure message="${xmlText(firstLine(c.failure))}">${xmlText(c.failure)}</failure>`
          : c.error !== undefined
            ? `<error message="${xmlText(firstLine(c.error))}">${xmlText(c.error)}</error>`
            : c.skipped !== undefined
              ? `<skipped message="${xmlText(firstLine(c.skipped))}"/>`
              : '';
      out.push(inner ? `${open}>${inner}</testcase>` : `${open}/>`);
    }
    out.push('  </testsuite>');
  }
  out.push('</testsuites>', '');
  return out.join('\n');
}
