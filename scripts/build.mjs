// Bundle the command line into dist/cli.js (plus its external source map) with esbuild; nothing else.
// Output is written next to the target and renamed into place, so a concurrent reader never sees
// half a file. Usage: node scripts/build.mjs
import { build } from 'esbuild';
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outfile = join(root, 'dist', 'cli.js');

/**
 * The command modules load the engine, project and report layers with import() so that running
 * from source stays lazy. In a single-file bundle, though, esbuild wraps every module reached
 * through import() and can no longer drop unused code: all of mathjs would then be built at the
 * first project load (about 1 s more per run, measured). Inside the bundle those imports become
 * static, and tree shaking keeps only what is used.
 */
const bundleLazyImportsStatically = {
  name: 'bundle-lazy-imports-statically',
  setup(b) {
    b.onLoad({ filter: /[\\/]src[\\/]cli[\\/][^\\/]+\.ts$/ }, (args) => {
      const heads = [];
      const contents = readFileSync(args.path, 'utf8').replace(/\bimport\('(\.\.?\/[^']+)'\)/g, (_, spec) => {
        const name = `__bundled${heads.length}`;
        heads.push(`import * as ${name} from '${spec}';`);
        return `Promise.resolve(${name})`;
      });
      return { contents: `${heads.join('\n')}\n${contents}`, loader: 'ts' };
    });
  },
};

const result = await build({
  entryPoints: [join(root, 'src', 'cli', 'main.ts')],
  outfile,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  sourcemap: 'external',
  minifySyntax: true,
  write: false,
  logLevel: 'warning',
  plugins: [bundleLazyImportsStatically],
  // Some dependencies are CommonJS and call require() for Node built-ins: give the ESM bundle one.
  banner: {
    js: "import { createRequire as __dacsmithCreateRequire } from 'node:module';\nconst require = __dacsmithCreateRequire(import.meta.url);",
  },
});

mkdirSync(dirname(outfile), { recursive: true });
for (const file of result.outputFiles) {
  const temp = `${file.path}.${process.pid}.tmp`;
  writeFileSync(temp, file.contents);
  renameSync(temp, file.path);
}
