/**
 * Reads a JSON input file for a command, refusing what cannot be a design file before parsing it. The byte cap
 * holds whatever the path is (a file, a pipe, /dev/stdin, /dev/zero): at most the cap plus one byte is ever
 * read. `-` means standard input.
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { LockstepError } from '../core/errors.ts';
import { cliErrors, MAX_INPUT_BYTES } from './errors.ts';

const CHUNK = 64 * 1024;

/**
 * Reads up to `cap + 1` bytes of an open file; waits (briefly, repeatedly) while a non-blocking pipe is empty. Reads
 * chunk by chunk, so that a small file costs a small buffer (not one of the cap's size, zeroed, per file).
 */
function readCapped(fd: number, cap: number): Buffer {
  const chunks: Buffer[] = [];
  let n = 0;
  while (n < cap + 1) {
    const chunk = Buffer.allocUnsafe(Math.min(CHUNK, cap + 1 - n));
    let got: number;
    try {
      got = readSync(fd, chunk, 0, chunk.length, null);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EAGAIN') throw e;
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 10);
      continue;
    }
    if (got === 0) break;
    chunks.push(got === chunk.length ? chunk : chunk.subarray(0, got));
    n += got;
  }
  return Buffer.concat(chunks, n);
}

export function readJsonFile(file: string): unknown {
  // /dev/stdin is read as the open descriptor 0: opening it again fails when standard input is a socket
  const stdin = file === '-' || file === '/dev/stdin' || file === '/dev/fd/0';
  let fd: number;
  try {
    fd = stdin ? 0 : openSync(file, 'r');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw cliErrors.fileMissing(file);
    if (code === 'EISDIR') throw cliErrors.fileUnreadable(file, 'it is a folder');
    throw cliErrors.fileUnreadable(file, (e as Error).message);
  }
  let bytes: Buffer;
  try {
    const st = fstatSync(fd);
    if (st.isDirectory()) throw cliErrors.fileUnreadable(file, 'it is a folder');
    // a regular file's size is known: refuse it before reading anything
    if (st.isFile() && st.size > MAX_INPUT_BYTES) throw cliErrors.fileTooLarge(file, st.size);
    bytes = readCapped(fd, MAX_INPUT_BYTES);
  } catch (e) {
    if (e instanceof LockstepError) throw e;
    throw cliErrors.fileUnreadable(file, (e as Error).message);
  } finally {
    if (!stdin) closeSync(fd);
  }
  if (bytes.length > MAX_INPUT_BYTES) throw cliErrors.fileTooLarge(file, null);
  const text = bytes.toString('utf8');
  if (text.replace(/^\uFEFF/, '').trim() === '') throw cliErrors.fileEmpty(file);
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    throw cliErrors.notJson(file, (e as Error).message);
  }
}
