/**
 * Errors of the command line (CLI_ERR_*). Each has a stable code (docs/errors.md) and a message that says what
 * to do (core/errors.ts `declareErrors`). They, and the store's STORE_ERR_*, end the command with exit code 2;
 * the status is the HTTP meaning of each, which the command line does not use.
 */
import { declareErrors, isDeclaredIn, type LockstepError } from '../core/errors.ts';
import { storeErrors } from '../store/errors.ts';
import { DESIGN_FILE_MAX_BYTES, DESIGN_FILE_MAX_TEXT } from '../core/file-limits.ts';

/** Largest input file read, bytes: the one design-file limit (core/file-limits.ts). */
export const MAX_INPUT_BYTES = DESIGN_FILE_MAX_BYTES;

const problems = (n: number) => `${n} problem${n === 1 ? '' : 's'}`;
const issueLines = (_file: string, issues: readonly string[]) => issues;

export const cliErrors = declareErrors({
  usage: { code: 'CLI_ERR_USAGE', status: 400, message: (msg: string) => msg },
  fileMissing: { code: 'CLI_ERR_FILE_NOT_FOUND', status: 400, message: (file: string) => `cannot read "${file}": no such file` },
  fileUnreadable: { code: 'CLI_ERR_FILE_UNREADABLE', status: 400, message: (file: string, why: string) => `cannot read "${file}": ${why}` },
  /** `bytes` null: a pipe or device that gave more than the limit (its size is not known). */
  fileTooLarge: {
    code: 'CLI_ERR_FILE_TOO_LARGE',
    status: 413,
    message: (file: string, bytes: number | null) =>
      `"${file === '-' ? 'standard input' : file}" ${bytes === null ? `gives more than ${DESIGN_FILE_MAX_TEXT}` : `is ${(bytes / 1048576).toFixed(1)} MiB`}; design files larger than ${DESIGN_FILE_MAX_TEXT} are refused (a design file is normally a few kilobytes)`,
  },
  fileEmpty: { code: 'CLI_ERR_FILE_EMPTY', status: 400, message: (file: string) => `"${file}" is empty; expected a JSON design file (try: lockstep demo > demo.json)` },
  notJson: {
    code: 'CLI_ERR_NOT_JSON',
    status: 400,
    message: (file: string, why: string) => `"${file}" is not valid JSON (${why}); a design file is JSON, see docs/design-file.md`,
  },
  invalid: {
    code: 'CLI_ERR_DESIGN_INVALID',
    status: 422,
    message: (file: string, issues: readonly string[]) => `"${file}" is not a valid design file (${problems(issues.length)}):`,
    details: issueLines,
  },
  axleLiftInvalid: {
    code: 'CLI_ERR_AXLE_LIFT_INVALID',
    status: 422,
    message: (file: string, issues: readonly string[]) => `"${file}" is not a valid axle-lift file (${problems(issues.length)}; see docs/axle-lift.md):`,
    details: issueLines,
  },
  fileUnwritable: {
    code: 'CLI_ERR_FILE_UNWRITABLE',
    status: 500,
    message: (file: string, why: string) => `cannot write "${file}": ${why} (choose another --out path)`,
  },
});

/** An error a command answers with exit code 2 and its message: its own, or the store's (lockstep store, packet --revision). */
export function isCommandError(e: unknown): e is LockstepError {
  return isDeclaredIn(cliErrors, e) || isDeclaredIn(storeErrors, e);
}
