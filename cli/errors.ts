/**
 * Errors of the command line. Each carries a stable code (documented in docs/errors.md) and a
 * message that says what to do. All of them end the command with exit code 2.
 */
import { DESIGN_FILE_MAX_BYTES, DESIGN_FILE_MAX_TEXT } from '../core/file-limits.ts';

export class CliError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly details: string[] = [],
  ) {
    super(message);
    this.name = 'CliError';
  }
}

/** Largest input file read, bytes: the one design-file limit (core/file-limits.ts). */
export const MAX_INPUT_BYTES = DESIGN_FILE_MAX_BYTES;

export const cliErrors = {
  usage: (msg: string) => new CliError('CLI_ERR_USAGE', msg),
  fileMissing: (file: string) => new CliError('CLI_ERR_FILE_NOT_FOUND', `cannot read "${file}": no such file`),
  fileUnreadable: (file: string, why: string) => new CliError('CLI_ERR_FILE_UNREADABLE', `cannot read "${file}": ${why}`),
  /** `bytes` null: a pipe or device that gave more than the limit (its size is not known). */
  fileTooLarge: (file: string, bytes: number | null) =>
    new CliError(
      'CLI_ERR_FILE_TOO_LARGE',
      `"${file === '-' ? 'standard input' : file}" ${bytes === null ? `gives more than ${DESIGN_FILE_MAX_TEXT}` : `is ${(bytes / 1048576).toFixed(1)} MiB`}; design files larger than ${DESIGN_FILE_MAX_TEXT} are refused (a design file is normally a few kilobytes)`,
    ),
  fileEmpty: (file: string) => new CliError('CLI_ERR_FILE_EMPTY', `"${file}" is empty; expected a JSON design file (try: lockstep demo > demo.json)`),
  notJson: (file: string, why: string) =>
    new CliError('CLI_ERR_NOT_JSON', `"${file}" is not valid JSON (${why}); a design file is JSON, see docs/design-file.md`),
  invalid: (file: string, issues: string[]) =>
    new CliError('CLI_ERR_DESIGN_INVALID', `"${file}" is not a valid design file (${issues.length} problem${issues.length === 1 ? '' : 's'}):`, issues),
  axleLiftInvalid: (file: string, issues: string[]) =>
    new CliError('CLI_ERR_AXLE_LIFT_INVALID', `"${file}" is not a valid axle-lift file (${issues.length} problem${issues.length === 1 ? '' : 's'}; see docs/axle-lift.md):`, issues),
} as const;
