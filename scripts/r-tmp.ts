import { loadProject } from '../src/project/index.js';
import { designSearch } from '../src/design/index.js';
import { robustDesigns } from '../src/design/robustDesigns.js';
import { robustChecks } from '../src/tolerance/index.js';
const p = loadProject('scripts/bench-projects/wide-e24.yaml');
for (const mode of ['worst-case', 'yield'] as const) {
  let tSearch = 0, tCheck = 0, nCheck = 0, nPass = 0;
  const t0 = performance.now();
  const check = mode === 'worst-case' ? robustChecks.worstCase : robustChecks.yield(2000);
  const r = robustDesigns(p, mode, {
    top: 10,
    check: (proj, ladder) => { const t = performance.now(); const v = check(proj, ladder); tCheck += performance.now() - t; nCheck++; if (v.pass) nPass++; if (process.env.V) console.error(JSON.stringify(v)); return v; },
    search: (proj, o) => { const t = performance.now(); const v = designSearch(proj, o); tSearch += performance.now() - t; return v; },
  });
  console.log(mode, 'total', (performance.now() - t0).toFixed(0), 'search', tSearch.toFixed(0), 'checks', nCheck, nPass, tCheck.toFixed(0), 'found', r.candidates.length, r.asked, r.scanned);
}
