/**
 * The package as a user gets it: `npm pack`, then an offline install of the tarball into an empty
 * folder (vitest's globalSetup has built dist/). Checks that the install pulls in nothing but
 * dacsmith itself (the bundles carry their dependencies), that `npx dacsmith analyze` runs, that
 * `import('dacsmith')` gives the library API and that each API function returns what the command
 * prints with --format json, and that the type declarations compile in a strict TypeScript project
 * and reach no module outside the package.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { root } from '../cli/runBuilt.js';

const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
let work: string;
let pkg: string;

beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'dacsmith-install-'));
  // dist/ is fresh (globalSetup): pack without running `prepare` again.
  const packed = JSON.parse(execFileSync(npm, ['pack', '--json', '--ignore-scripts', '--pack-destination', work], { cwd: root, encoding: 'utf8' }));
  const tarball = join(work, packed[0].filename);
  writeFileSync(join(work, 'package.json'), JSON.stringify({ name: 'consumer', private: true, type: 'module' }));
  execFileSync(npm, ['install', '--offline', '--no-audit', '--no-fund', '--ignore-scripts', tarball], { cwd: work, encoding: 'utf8', stdio: 'pipe' });
  pkg = join(work, 'node_modules', 'dacsmith');
}, 120_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

const sample = (name: string) => join('node_modules', 'dacsmith', 'sample-configs', name);

/** The installed command, as `npx dacsmith ...` in the consumer folder. */
function npx(args: string[]) {
  const r = spawnSync('npx', ['--no-install', 'dacsmith', ...args], { cwd: work, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Run a script in the consumer folder, where `import('dacsmith')` resolves to the installed package; its stdout as JSON. */
function node(script: string): unknown {
  return JSON.parse(execFileSync(process.execPath, ['--input-type=module', '-e', script], { cwd: work, encoding: 'utf8' }));
}

describe('npm pack and install', () => {
  it('installs nothing but dacsmith itself', () => {
    const installed = readdirSync(join(work, 'node_modules')).filter((n) => !n.startsWith('.'));
    expect(installed).toEqual(['dacsmith']);
    expect(JSON.parse(readFileSync(join(pkg, 'package.json'), 'utf8')).dependencies ?? {}).toEqual({});
  });

  it('runs npx dacsmith analyze on a bundled sample', () => {
    const r = npx(['analyze', sample('greenhouse-heater.yaml'), '--no-charts']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/worst ripple/i);
  });

  it('import("dacsmith") returns the same objects as the JSON output', () => {
    const file = sample('greenhouse-heater.yaml');
    const api = node(`
      const m = await import('dacsmith');
      const out = {
        names: Object.keys(m).sort(),
        analyze: m.analyze(${JSON.stringify(file)}),
        compare: m.compare(${JSON.stringify(file)}, ${JSON.stringify(sample('sensor-bias-trim.yaml'))}),
        tolerance: await m.tolerance(${JSON.stringify(file)}, { samples: 1000, seed: 3 }),
        design: m.design(${JSON.stringify(sample('sensor-bias-trim.yaml'))}, { top: 2, tradeoff: false }),
      };
      process.stdout.write(JSON.stringify(out));
    `) as Record<string, unknown>;
    expect(api.names).toEqual(expect.arrayContaining(['analyze', 'compare', 'design', 'loadProject', 'tolerance']));
    const cli = (args: string[]) => JSON.parse(npx([...args, '--format', 'json']).stdout);
    expect(api.analyze).toEqual(cli(['analyze', file]));
    expect(api.compare).toEqual(cli(['compare', file, sample('sensor-bias-trim.yaml')]));
    expect(api.tolerance).toEqual(cli(['tolerance', file, '--samples', '1000', '--seed', '3', '--workers', '1']));
    expect(api.design).toEqual(cli(['design', sample('sensor-bias-trim.yaml'), '--top', '2', '--no-charts']));
  });

  it('ships type declarations that reach no module outside the package', () => {
    const manifest = JSON.parse(readFileSync(join(pkg, 'package.json'), 'utf8'));
    const entry = resolve(pkg, manifest.exports['.'].types);
    const seen = new Set<string>();
    const outside: string[] = [];
    const walk = (file: string) => {
      if (seen.has(file)) return;
      seen.add(file);
      expect(existsSync(file), file).toBe(true);
      const code = readFileSync(file, 'utf8').replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
      for (const [, spec] of code.matchAll(/(?:from\s+|import\()\s*['"]([^'"]+)['"]/g)) {
        if (spec.startsWith('.')) walk(resolve(dirname(file), spec.replace(/\.js$/, '.d.ts')));
        else outside.push(`${spec} (in ${file})`);
      }
    };
    walk(entry);
    expect(seen.size).toBeGreaterThan(1);
    expect(outside).toEqual([]);
  });

  it('type-checks a strict TypeScript consumer against the declarations', () => {
    writeFileSync(
      join(work, 'consumer.ts'),
      [
        "import { analyze, design, tolerance, compare, loadProject, ProjectError } from 'dacsmith';",
        "const a = analyze('board.yaml', { duties: [0.5] });",
        'const ripple: number = a.worstRipple.ripple;',
        'const pass: boolean = a.pass && compare(loadProject("a.yaml"), { text: "pwm: {}" }).pass;',
        "const top: number = design('board.yaml', { top: 3 }).candidates.length;",
        "export const later = tolerance('board.yaml', { samples: 100 }).then((t) => t.monteCarlo.yield + ripple + top + Number(pass));",
        'export const isError = (e: unknown) => e instanceof ProjectError;',
        '// @ts-expect-error: analyze takes a path, text or a project, not a number',
        'analyze(42);',
        '',
      ].join('\n'),
    );
    // No @types/node: the declarations must stand on their own (and the check is four times faster).
    const options = { strict: true, skipLibCheck: false, module: 'nodenext', moduleResolution: 'nodenext', target: 'es2022', noEmit: true, types: [] };
    writeFileSync(join(work, 'tsconfig.json'), JSON.stringify({ compilerOptions: options, files: ['consumer.ts'] }));
    const r = spawnSync(process.execPath, [join(root, 'node_modules', 'typescript', 'bin', 'tsc'), '-p', '.'], { cwd: work, encoding: 'utf8' });
    expect(r.stdout + r.stderr).toBe('');
    expect(r.status).toBe(0);
  });
});
