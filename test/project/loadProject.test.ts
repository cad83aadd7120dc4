import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { loadProject } from '../../src/project/index.js';
import { fixture, projectErrorOf } from './fixtures.js';

const scratch = mkdtempSync(join(tmpdir(), 'dacsmith-project-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** Write bytes to a scratch file and return its path. */
function scratchFile(name: string, bytes: Uint8Array | string): string {
  const path = join(scratch, name);
  writeFileSync(path, bytes);
  return path;
}

const VALID = 'pwm:\n  frequency: 20 kHz\n  high: 3.3 V\nfilter:\n  stages:\n    - { r: 4k7, c: 100n }\n';

describe('loadProject: the file itself', () => {
  it('names a missing file', () => {
    const path = fixture('no-such-file.yaml');
    const e = projectErrorOf(() => loadProject(path));
    expect(e.format()).toBe(`${path}: no such file`);
    expect(e.file).toBe(path);
    expect(e.line).toBeUndefined();
  });

  it('names a directory', () => {
    const path = fixture('');
    const e = projectErrorOf(() => loadProject(path));
    expect(e.format()).toBe(`${path}: is a directory; give the path of a project file (.yaml)`);
  });

  it('refuses text that is not UTF-8, with the line and column of the bad byte', () => {
    // latin1.yaml: "# Widerstand für die Stufe" in ISO-8859-1 on line 4; ü is byte 0xFC at column 15.
    const path = fixture('latin1.yaml');
    const e = projectErrorOf(() => loadProject(path));
    expect(e.format()).toBe(`${path}:4:15: is not UTF-8 text: byte 0xFC does not belong there; save the file as UTF-8`);
  });

  it('refuses UTF-16 and binary files', () => {
    const utf16 = scratchFile('utf16.yaml', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(VALID, 'utf16le')]));
    expect(projectErrorOf(() => loadProject(utf16)).format()).toBe(`${utf16}:1:1: is UTF-16 text; save it as UTF-8`);
    const binary = scratchFile('binary.yaml', Buffer.from('pwm:\n  high: 3\u0000.3 V\n'));
    expect(projectErrorOf(() => loadProject(binary)).format()).toBe(`${binary}:2:10: holds a NUL byte: a binary file, not YAML text`);
  });

  it('refuses malformed UTF-8 sequences of RFC 3629 section 3/4', () => {
    // Overlong "/" (C0 AF), a UTF-16 surrogate (ED A0 80), a byte never used (F5), a sequence cut short.
    for (const bad of [[0xc0, 0xaf], [0xed, 0xa0, 0x80], [0xf5, 0x80, 0x80, 0x80], [0xe2, 0x82]]) {
      const path = scratchFile('bad-utf8.yaml', Buffer.concat([Buffer.from('pwm:\n  high: 3.3 V # '), Buffer.from(bad), Buffer.from('\n')]));
      const e = projectErrorOf(() => loadProject(path));
      expect(e.line).toBe(2);
      expect(e.message).toContain('is not UTF-8 text');
    }
  });

  it('skips a UTF-8 byte order mark', () => {
    const path = scratchFile('bom.yaml', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(VALID)]));
    expect(loadProject(path).pwm.frequency).toBe(20e3);
  });

  it('refuses a file too big to be a project file', () => {
    const path = scratchFile('huge.yaml', `${VALID}${'#'.repeat(80)}\n`.repeat(1 + (1 << 20) / 80));
    expect(projectErrorOf(() => loadProject(path)).message).toMatch(/a project file is at most 1048576 bytes/);
  });
});

describe('loadProject: the example of model.md and the sample configurations', () => {
  it('accepts the example of model.md verbatim', () => {
    // test/fixtures/projects/model-example.yaml is the YAML block of model.md, copied verbatim.
    const p = loadProject(fixture('model-example.yaml'));
    // 20 MHz / (1 * 2^10) = 19531.25 Hz (edge-aligned); the file writes it as 19.5 kHz.
    expect(p.pwm.frequency).toBe(19531.25);
    expect(p.pwm.driver).toEqual({ high: 40, low: 25 });
    expect(p.filter.stages).toEqual([
      { r: 4700, c: 100e-9, buffered: false },
      { r: 47e3, c: 10e-9, buffered: true },
    ]);
    expect(p.lsb).toBe(3.3 / 1024);
    expect(p.spec.ripple).toBe(0.5 * (3.3 / 1024));
    expect(p.spec.settling).toEqual({ band: 0.5 * (3.3 / 1024), time: 0.02, from: 0.1, to: 0.9 });
    expect(p.search?.bits).toEqual({ min: 8, max: 12 });
    expect(p.tolerance).toMatchObject({ resistor: 0.01, capacitor: 0.1, distribution: 'normal', samples: 10000, seed: 1 });
  });

  it('accepts every sample configuration in sample-configs/', () => {
    const dir = fileURLToPath(new URL('../../sample-configs/', import.meta.url));
    for (const file of readdirSync(dir).filter((f) => f.endsWith('.yaml'))) {
      const p = loadProject(join(dir, file));
      expect(p.file).toBe(join(dir, file));
      // a design-only sample may leave out filter: when it has a search: block (schema rule)
      expect(p.filter.stages.length > 0 || p.search !== undefined).toBe(true);
    }
  });
});
