import { settlingCost } from './bench-settling.js';
import { engineVersusOde } from './bench-ode-race.js';
import { benchTable } from './bench-table.js';
const which = process.argv[2];
const r = which === 'ode' ? await engineVersusOde() : settlingCost();
console.log(benchTable({ machine: { cpu: '', cores: 0, node: '', platform: '', loadBefore: 0, loadAfter: 0 }, sections: [r.section], targets: [], seconds: 0, data: {} }));
