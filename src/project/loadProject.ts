import { readFileSync, statSync } from 'node:fs';
import { firstInvalidUtf8 } from './firstInvalidUtf8.js';
import { parseProject } from './parseProject.js';
import { ProjectError } from './projectError.js';
import { MAX_PROJECT_BYTES } from './readYamlDocument.js';
import type { Project } from './types.js';

/**
 * Read a project file from disk and return the normalized `Project` (see `parseProject`).
 * A missing file, a directory, a file too big to be a project, a binary file or text that is not
 * UTF-8 is a ProjectError naming the file (and the line, where there is one). A UTF-8 byte order
 * mark is skipped.
 *
 * Syntax: loadProject(path)
 * Example: loadProject('sample-configs/greenhouse-heater.yaml').pwm.frequency   // 15625
 */
export function loadProject(path: string): Project {
  const fail = (message: string, line?: number, column?: number): ProjectError =>
    new ProjectError([{ file: path, path: '', message, ...(line !== undefined && { line, column }) }]);

  let bytes: Buffer;
  try {
    const stats = statSync(path);
    if (stats.isDirectory()) throw fail('is a directory; give the path of a project file (.yaml)');
    if (!stats.isFile()) throw fail('is not a regular file');
    if (stats.size > MAX_PROJECT_BYTES) throw fail(`is ${stats.size} bytes; a project file is at most ${MAX_PROJECT_BYTES} bytes`);
    bytes = readFileSync(path);
  } catch (error) {
    if (error instanceof ProjectError) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    const reason =
      code === 'ENOENT' ? 'no such file' :
      code === 'EACCES' || code === 'EPERM' ? 'cannot read the file: permission denied' :
      code === 'ENOTDIR' ? 'no such file (a part of the path is not a directory)' :
      `cannot read the file: ${(error as Error).message}`;
    throw fail(reason);
  }

  return parseProject(decodeProjectText(bytes, path), path);
}

/**
 * The text of a project file's bytes, refusing what is not UTF-8 text: UTF-16 (by its byte order
 * mark), a NUL byte (a binary file), bytes that are not UTF-8 (Latin-1 from an old editor). The
 * same rules hold for a file on disk and for a file read from git at a revision.
 *
 * Syntax: decodeProjectText(bytes, label)
 * Example: decodeProjectText(Buffer.from('pwm:\n'), 'p.yaml')   // 'pwm:\n'
 */
export function decodeProjectText(bytes: Uint8Array, path: string): string {
  const fail = (message: string, line?: number, column?: number): ProjectError =>
    new ProjectError([{ file: path, path: '', message, ...(line !== undefined && { line, column }) }]);
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) {
    throw fail('is UTF-16 text; save it as UTF-8', 1, 1);
  }
  const nul = bytes.indexOf(0);
  if (nul >= 0) {
    const { line, column } = positionOfByte(bytes, nul);
    throw fail('holds a NUL byte: a binary file, not YAML text', line, column);
  }
  const invalid = firstInvalidUtf8(bytes);
  if (invalid >= 0) {
    const { line, column } = positionOfByte(bytes, invalid);
    const hex = bytes[invalid].toString(16).toUpperCase().padStart(2, '0');
    throw fail(`is not UTF-8 text: byte 0x${hex} does not belong there; save the file as UTF-8`, line, column);
  }
  return new TextDecoder('utf-8').decode(bytes);
}

/** 1-based line and column (in characters) of a byte offset. */
function positionOfByte(bytes: Uint8Array, offset: number): { line: number; column: number } {
  const before = bytes.subarray(0, offset);
  const lineStart = before.lastIndexOf(0x0a) + 1;
  let line = 1;
  for (const b of before) if (b === 0x0a) line++;
  const column = [...new TextDecoder('utf-8').decode(bytes.subarray(lineStart, offset))].length + 1;
  return { line, column };
}
