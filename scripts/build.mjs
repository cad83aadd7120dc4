// Bundle the command line into dist/cli.js (plus its external source map) with esbuild.
// Output is written next to the target and renamed into place, so a concurrent reader never sees
// half a file. Usage: node scripts/build.mjs
import { build } from 'esbuild';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outfile = join(root, 'dist', 'cli.js');

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
