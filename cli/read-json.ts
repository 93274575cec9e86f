/** Reads a JSON input file for a command, refusing what cannot be a design file before parsing it. */
import { readFileSync, statSync } from 'node:fs';
import { cliErrors, MAX_INPUT_BYTES } from './errors.ts';

export function readJsonFile(file: string): unknown {
  let size: number;
  try {
    const st = statSync(file);
    if (st.isDirectory()) throw cliErrors.fileUnreadable(file, 'it is a folder');
    size = st.size;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') throw cliErrors.fileMissing(file);
    if (e instanceof Error && e.name === 'CliError') throw e;
    throw cliErrors.fileUnreadable(file, (e as Error).message);
  }
  if (size > MAX_INPUT_BYTES) throw cliErrors.fileTooLarge(file, size);
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    throw cliErrors.fileUnreadable(file, (e as Error).message);
  }
  if (text.replace(/^\uFEFF/, '').trim() === '') throw cliErrors.fileEmpty(file);
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    throw cliErrors.notJson(file, (e as Error).message);
  }
}
