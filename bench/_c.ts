import { readFileSync } from 'node:fs';
import { combineTreeTemplates } from '../src/bispectrum/tree-template-combination.js';
import { treeTemplateCoefficients } from '../src/bispectrum/tree-template-terms.js';
const nb = 6613, nm = 2;
const T = Float64Array.from({ length: nb * nm * 17 }, () => Math.random());
const X = new WebAssembly.Instance(new WebAssembly.Module(readFileSync('/tmp/asproto/comb.wasm')), { env: { abort() {} } }).exports as any;
const tp = X.reserve(T.byteLength); new Float64Array(X.memory.buffer, tp, T.length).set(T);
const cp = X.reserve(17 * 8), op = X.reserve(nb * nm * 8);
const p = { b1: 2, b2: 0.3, bG2: -0.2, f: 0.8, bispShotPower: 1, bispShotConst: 1.2 };
const out = new Float64Array(nb * nm);
const w = () => { treeTemplateCoefficients(p, new Float64Array(X.memory.buffer, cp, 17)); X.combine(nb, nm, tp, cp, op); new Float64Array(X.memory.buffer, op, nb * nm).slice(); };
const j = () => combineTreeTemplates(T, nm, p, out);
const a = combineTreeTemplates(T, nm, p); w(); const b = new Float64Array(X.memory.buffer, op, nb * nm);
let e = 0; for (let i = 0; i < a.length; i++) e = Math.max(e, Math.abs(a[i] / b[i] - 1)); console.log('diff', e);
function cpu(fn: () => unknown, n = 2000) { for (let i = 0; i < 200; i++) fn(); const c0 = process.cpuUsage(); for (let i = 0; i < n; i++) fn(); const c = process.cpuUsage(c0); return ((c.user + c.system) / 1000 / n).toFixed(4); }
for (let r = 0; r < 3; r++) console.log('js', cpu(j), 'wasm', cpu(w));
