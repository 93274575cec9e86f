/**
 * Exit status of every command that judges a design (`lockstep evaluate`, `lockstep packet`), from its verdict
 * (core/verdict.ts): 0 pass, 1 a check fails, 2 invalid input (set where the input is refused), 3 incomplete
 * (nothing fails, but a check could not be made because an input is missing). Documented in README.md and
 * docs/errors.md.
 */
import type { Verdict } from '../core/index.ts';

export const EXIT_CODES = { pass: 0, fail: 1, invalid: 2, incomplete: 3 } as const;

export function exitCodeFor(verdict: Pick<Verdict, 'overall'>): number {
  return EXIT_CODES[verdict.overall];
}

/** The exit codes in words, for the usage text. */
export const EXIT_CODES_TEXT = 'Exit codes: 0 every check passes, 1 a check fails, 2 the input is invalid, 3 incomplete (nothing fails, but a check could not be made: an input is missing).';
