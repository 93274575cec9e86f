/** Where a command writes: the process streams (bin/lockstep.mjs) or a test's buffers. */
export interface CommandOutput {
  stdout(text: string): void;
  stderr(text: string): void;
}

/** A command of `lockstep`: its arguments after the command name in, the exit code out. */
export type Command = (argv: string[], out: CommandOutput) => number | Promise<number>;
