import { execFileSync } from 'node:child_process';
import { realpathSync } from 'node:fs';
import { basename, dirname, relative, sep } from 'node:path';
import { InputError } from '../units/index.js';
import { decodeProjectText } from './loadProject.js';

/** The file could not be read at that revision (no repository, unknown revision, file not there). */
export class GitShowError extends InputError {
  override name = 'GitShowError';
}

/** A file's text at a revision, and a label naming both (`REF:path`, as git writes it). */
export interface FileAtRevision {
  text: string;
  label: string;
}

/** Run git in `cwd`; its first line of standard error becomes the message of a GitShowError. */
function git(args: string[], cwd: string): Buffer {
  try {
    return execFileSync('git', args, { cwd, stdio: ['ignore', 'pipe', 'pipe'], maxBuffer: 64 << 20 });
  } catch (error) {
    const e = error as NodeJS.ErrnoException & { stderr?: Buffer };
    if (e.code === 'ENOENT') throw new GitShowError('git is not installed or not on PATH');
    const first = (e.stderr?.toString('utf8') ?? '').split('\n').find((l) => l.trim() !== '') ?? e.message;
    throw new GitShowError(first.replace(/^fatal:\s*/, ''));
  }
}

/**
 * Read `file` as it was at git revision `ref`: `git show REF:PATH`, with PATH relative to the top of
 * the repository that holds the file (`git rev-parse --show-toplevel`). Symbolic links in the
 * directory are resolved first, so that the path matches git's view of the work tree.
 * Shell edge: this is the only place that runs git.
 *
 * Syntax: fileAtRevision(file, ref)
 * Example: fileAtRevision('boards/dac.yaml', 'main').label   // 'main:boards/dac.yaml'
 */
export function fileAtRevision(file: string, ref: string): FileAtRevision {
  if (ref === '' || ref.startsWith('-')) throw new GitShowError(`'${ref}' is not a revision`);
  let dir: string;
  try {
    dir = realpathSync(dirname(file));
  } catch {
    throw new GitShowError(`${file}: no such directory`);
  }
  let top: string;
  try {
    top = git(['rev-parse', '--show-toplevel'], dir).toString('utf8').trim();
  } catch (error) {
    throw new GitShowError(`${file} is not inside a git repository (${(error as Error).message})`);
  }
  const path = relative(realpathSync(top), `${dir}${sep}${basename(file)}`).split(sep).join('/');
  const spec = `${ref}:${path}`;
  let bytes: Buffer;
  try {
    bytes = git(['show', spec], top);
  } catch (error) {
    throw new GitShowError(`cannot read ${path} at revision ${ref}: ${(error as Error).message}`);
  }
  // The same byte rules as a file on disk (UTF-8 only, no NUL, no UTF-16), with the revision named.
  return { text: decodeProjectText(bytes, spec), label: spec };
}
