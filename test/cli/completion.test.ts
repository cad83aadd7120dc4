/**
 * `dacsmith completion`: the scripts it prints, and completion as bash runs it (the printed
 * script sourced into bash, its function called the way bash's programmable completion calls it,
 * with the built command on PATH); completionCandidates on its own.
 */
import { spawnSync } from 'node:child_process';
import type { Dirent } from 'node:fs';
import { chmodSync, mkdirSync, mkdtempSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { completionCandidates, completionShell } from '../../src/cli/completion.js';
import { bin, runBuilt } from './runBuilt.js';

const hasBash = spawnSync('bash', ['--version']).status === 0;

/** Complete `words` (the last one being typed) in `cwd` as bash would, through the printed script. */
function bashComplete(script: string, words: string[], cwd: string): string[] {
  const shims = mkdtempSync(join(tmpdir(), 'dacsmith-shim-'));
  writeFileSync(join(shims, 'dacsmith'), `#!/bin/sh\nexec "${process.execPath}" "${bin}" "$@"\n`);
  chmodSync(join(shims, 'dacsmith'), 0o755);
  const program = [
    script,
    `COMP_WORDS=(${words.map((w) => `'${w}'`).join(' ')})`,
    `COMP_CWORD=${words.length - 1}`,
    '_dacsmith_yargs_completions',
    'printf "%s\\n" "${COMPREPLY[@]}"',
  ].join('\n');
  const r = spawnSync('bash', ['--norc', '--noprofile', '-c', program], { cwd, encoding: 'utf8', env: { ...process.env, PATH: `${shims}:${process.env.PATH}` } });
  expect(r.stderr).toBe('');
  return r.stdout.split('\n').filter((l) => l !== '');
}

describe('dacsmith completion', () => {
  it('prints a bash script by default and a zsh script when asked', () => {
    const bash = runBuilt(['completion'], { env: { SHELL: '/bin/bash' } });
    expect(bash.code).toBe(0);
    expect(bash.stdout).toMatch(/^complete .* dacsmith$/m);
    const zsh = runBuilt(['completion', 'zsh'], { env: { SHELL: '/bin/bash' } });
    expect(zsh.stdout.split('\n')[0]).toBe('#compdef dacsmith');
    expect(runBuilt(['completion', 'bash'], { env: { SHELL: '/bin/zsh' } }).stdout).toBe(bash.stdout);
  });

  it.skipIf(!hasBash)('completes commands, options, choices and .yaml files in bash', () => {
    const script = runBuilt(['completion', 'bash']).stdout;
    const work = realpathSync(mkdtempSync(join(tmpdir(), 'dacsmith-complete-')));
    mkdirSync(join(work, 'boards'));
    for (const f of ['boards/heater.yaml', 'boards/probe.yml', 'boards/notes.txt', 'top.yaml']) writeFileSync(join(work, f), '');
    expect(bashComplete(script, ['dacsmith', 'an'], work)).toEqual(['analyze']);
    expect(bashComplete(script, ['dacsmith', 'check', '--for'], work)).toEqual(['--format']);
    expect(bashComplete(script, ['dacsmith', 'check', '--format', 'g'], work)).toEqual(['github']);
    expect(bashComplete(script, ['dacsmith', 'analyze', 'boards/'], work).sort()).toEqual(['boards/heater.yaml', 'boards/probe.yml']);
    expect(bashComplete(script, ['dacsmith', 'compare', 'top.yaml', ''], work).sort()).toEqual(['boards/', 'top.yaml']);
  });

  it('answers yargs completion requests with the option checker in place (no usage error)', () => {
    const r = runBuilt(['--get-yargs-completions', 'dacsmith', 'tolerance', '--seed', '1', '--seed', '']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
  });
});

describe('completionCandidates', () => {
  const entry = (name: string, dir = false) => ({ name, isDirectory: () => dir }) as unknown as Dirent;
  const folder = [entry('a.yaml'), entry('b.YML'), entry('c.json'), entry('sub', true), entry('.hidden.yaml')];
  const list = (dir: string) => (dir === '.' ? folder : dir === 'sub/' ? [entry('d.yaml')] : []);

  it('offers YAML files and folders for the operands of file commands', () => {
    expect(completionCandidates(['analyze'], '', ['--help'], list)).toEqual(['a.yaml', 'b.YML', 'sub/']);
    expect(completionCandidates(['check', 'a.yaml'], 'sub/', [], list)).toEqual(['sub/d.yaml']);
    expect(completionCandidates(['analyze'], '.h', [], list)).toEqual(['.hidden.yaml']);
  });

  it("keeps yargs' candidates for commands, options and an option's choices", () => {
    expect(completionCandidates([], 'an', ['analyze', 'design'], list)).toEqual(['analyze', 'design']);
    expect(completionCandidates(['analyze'], '--f', ['--format', '--force'], list)).toEqual(['--format', '--force']);
    expect(completionCandidates(['analyze', '--format'], '', ['text', 'json'], list)).toEqual(['text', 'json']);
    expect(completionCandidates(['init'], '', ['--stages'], list)).toEqual(['--stages']);
  });

  it('takes the shell word off `completion SHELL`', () => {
    expect(completionShell(['completion', 'zsh'], { SHELL: '/bin/bash' })).toEqual({ argv: ['completion'], shell: '/bin/zsh' });
    expect(completionShell(['analyze', 'zsh'], { SHELL: '/bin/bash' })).toEqual({ argv: ['analyze', 'zsh'], shell: '/bin/bash' });
  });
});
