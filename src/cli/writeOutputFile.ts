import { closeSync, constants, fsyncSync, openSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { UsageError } from './errors.js';

export interface WriteOptions {
  /** Replace an existing file (else an existing file is an error and stays as it is). */
  force: boolean;
  /** Files this run reads: never written over, even with force. */
  inputs?: readonly string[];
  /** The option that named the file, for messages (`--csv`). */
  option: string;
}

const REASONS: Record<string, string> = {
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is exhausted',
  EROFS: 'the file system is read-only',
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  ENOENT: 'no such folder',
  ENOTDIR: 'a part of the path is not a folder',
  EISDIR: 'it is a folder',
  EEXIST: 'it exists',
};

/**
 * Write a file the way an editor saves one: the whole text to a temporary file in the same folder,
 * flushed to the disk, then renamed over the target in one step, so a full disk, a read-only mount
 * or Ctrl-C leaves either the old file or the new one, never half of it (rename(2) is atomic within
 * a file system, POSIX). An existing target is replaced only with `force`; a file the run reads is
 * never replaced; a target that is not a regular file (a terminal, /dev/null, a pipe) is written
 * directly. Every failure is a UsageError (exit 2) naming the option, the file and the reason.
 *
 * Syntax: writeOutputFile(path, text, { force, inputs, option })
 * Example: writeOutputFile('w.csv', csv, { force: false, inputs: ['board.yaml'], option: '--csv' })
 */
export function writeOutputFile(path: string, text: string, options: WriteOptions): void {
  const fail = (why: string): never => {
    throw new UsageError(`${options.option} ${path}: ${why}; nothing written`);
  };
  const reason = (error: unknown) => REASONS[(error as NodeJS.ErrnoException).code ?? ''] ?? (error as Error).message;
  let target: ReturnType<typeof statSync> | undefined;
  try {
    target = statSync(path);
  } catch {
    target = undefined;
  }
  if (target) {
    for (const input of options.inputs ?? []) {
      try {
        const s = statSync(input);
        if (s.ino === target.ino && s.dev === target.dev) fail(`it is ${input}, which this command reads; write to another file`);
      } catch (error) {
        if (error instanceof UsageError) throw error;
      }
    }
    if (target.isDirectory()) fail('it is a folder');
    if (!target.isFile()) {
      try {
        const fd = openSync(path, constants.O_WRONLY);
        try {
          writeSync(fd, text);
        } finally {
          closeSync(fd);
        }
      } catch (error) {
        fail(reason(error));
      }
      return;
    }
    if (!options.force) fail('the file already exists (--force replaces it)');
  }

  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  let fd: number | undefined;
  try {
    fd = openSync(temporary, 'wx', target ? target.mode & 0o777 : 0o666);
    const bytes = Buffer.from(text, 'utf8');
    for (let at = 0; at < bytes.length; ) at += writeSync(fd, bytes, at, bytes.length - at);
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(temporary, path);
  } catch (error) {
    if (fd !== undefined) closeSync(fd);
    try {
      unlinkSync(temporary);
    } catch {
      // never created, or already renamed
    }
    fail(reason(error));
  }
}
