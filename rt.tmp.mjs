import { parseDocument } from 'yaml';
import fs from 'node:fs';
for (const f of process.argv.slice(2)) {
  const t = fs.readFileSync(f, 'utf8');
  for (const opts of [{}, { lineWidth: 0 }]) {
    const out = parseDocument(t, { version: '1.2' }).toString(opts);
    console.log(f, JSON.stringify(opts), out === t ? 'SAME' : 'DIFF');
    if (out !== t && opts.lineWidth === 0) { fs.writeFileSync('/tmp/rt.out', out); }
  }
}
