/**
 * Import boundaries of src/ (dependency-cruiser, https://github.com/sverweij/dependency-cruiser).
 * Checked by test/layering.test.ts in `npm test`, and by `npm run layers` on its own.
 *
 * Folders import only downward:
 *
 *   units, numeric                 bottom: import no other folder
 *   circuit                        units, numeric
 *   project                        + circuit
 *   engine                         + project
 *   design | tolerance             + engine; neither imports the other
 *   report                         + types only from engine, design and tolerance
 *   api                            everything but cli (the library: core calls and JSON builders)
 *   cli                            anything
 *
 * other folders reach the engine only through src/engine/index.ts, and no import cycle anywhere in
 * src/ (type-only imports count: they couple the files just as much).
 */
const LAYERS = ['units', 'numeric', 'circuit', 'project', 'engine', 'design', 'tolerance', 'report', 'api', 'cli'];

/** What each folder may import besides itself. */
const ALLOWED = {
  units: [],
  numeric: [],
  circuit: ['units', 'numeric'],
  project: ['units', 'numeric', 'circuit'],
  engine: ['units', 'numeric', 'circuit', 'project'],
  design: ['units', 'numeric', 'circuit', 'project', 'engine'],
  tolerance: ['units', 'numeric', 'circuit', 'project', 'engine'],
  report: ['units', 'numeric', 'circuit', 'project', 'engine', 'design', 'tolerance'],
  api: ['units', 'numeric', 'circuit', 'project', 'engine', 'design', 'tolerance', 'report'],
  cli: LAYERS.filter((l) => l !== 'cli'),
};


const folderRules = LAYERS.map((layer) => {
  const forbidden = LAYERS.filter((other) => other !== layer && !ALLOWED[layer].includes(other));
  return {
    name: `${layer}-imports-down-only`,
    comment: `src/${layer} may import only ${ALLOWED[layer].length ? ALLOWED[layer].join(', ') : 'itself'} (DEVELOPERS.md, "Where each concern lives")`,
    severity: 'error',
    from: { path: `^src/${layer}/` },
    to: { path: `^src/(${forbidden.join('|')})/` },
  };
}).filter((rule) => !rule.to.path.endsWith('()/'));

module.exports = {
  forbidden: [
    ...folderRules,
    {
      name: 'report-imports-only-types-from-the-core',
      comment: 'src/report formats results; it may name the types of engine, design and tolerance but not call them',
      severity: 'error',
      from: { path: '^src/report/' },
      to: { path: '^src/(engine|design|tolerance)/', dependencyTypesNot: ['type-only'] },
    },
    {
      name: 'engine-only-through-its-index',
      comment: 'other folders reach the engine through src/engine/index.ts, its one public surface',
      severity: 'error',
      from: { path: '^src/', pathNot: '^src/engine/' },
      to: { path: '^src/engine/', pathNot: '^src/engine/index[.]ts$' },
    },
    {
      name: 'no-circular',
      comment: 'no import cycle, between folders or inside one',
      severity: 'error',
      from: { path: '^src/' },
      to: { circular: true },
    },
    {
      name: 'not-to-unresolvable',
      comment: 'every relative import resolves to a file',
      severity: 'error',
      from: { path: '^src/' },
      to: { couldNotResolve: true, dependencyTypesNot: ['core', 'npm'] },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    includeOnly: '^src/',
    tsPreCompilationDeps: true,
    tsConfig: { fileName: require('node:path').join(__dirname, 'tsconfig.json') },
    enhancedResolveOptions: { extensions: ['.ts', '.js', '.json'] },
  },
};
