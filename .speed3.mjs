// ../../tmp/i3-base/src/numeric/dense.ts
function zeros(n) {
  const v = [];
  for (let i = 0; i < n; i++) v.push(0);
  return v;
}
function matmul(a, b, n, out = zeros(n * n)) {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < n; j++) out[row + j] = 0;
    for (let k = 0; k < n; k++) {
      const aik = a[row + k];
      if (aik === 0) continue;
      const bk = k * n;
      for (let j = 0; j < n; j++) out[row + j] += aik * b[bk + j];
    }
  }
  return out;
}
function matvec(a, x, n, out = zeros(n)) {
  for (let i = 0; i < n; i++) {
    let s = 0;
    const row = i * n;
    for (let k = 0; k < n; k++) s += a[row + k] * x[k];
    out[i] = s;
  }
  return out;
}
function transposeMatvec(a, x, n, out = zeros(n)) {
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += a[k * n + i] * x[k];
    out[i] = s;
  }
  return out;
}
function spectralMatrix(u, d, n) {
  const out = zeros(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += u[i * n + k] * d[k] * u[j * n + k];
      out[i * n + j] = s;
      out[j * n + i] = s;
    }
  }
  return out;
}

// ../../tmp/i3-base/src/numeric/symmetricEigen.ts
function symmetricEigen(a, n, options) {
  if (n === 1) return { values: [a[0]], vectors: [1] };
  if (n === 2) return eigen2(a[0], a[1], a[3]);
  const withVectors = options?.vectors === true;
  const m = zeros(n * n);
  for (let i = 0; i < n * n; i++) m[i] = a[i];
  const v = withVectors ? zeros(n * n) : [];
  if (withVectors) for (let i = 0; i < n; i++) v[i * n + i] = 1;
  for (let sweep = 0; sweep < 50; sweep++) {
    let rotated = false;
    for (let p2 = 0; p2 < n - 1; p2++) {
      for (let q = p2 + 1; q < n; q++) {
        const apq = m[p2 * n + q];
        if (apq === 0) continue;
        const app = m[p2 * n + p2];
        const aqq = m[q * n + q];
        if (Math.abs(apq) <= 1e-19 * Math.sqrt(Math.abs(app * aqq))) {
          m[p2 * n + q] = 0;
          m[q * n + p2] = 0;
          continue;
        }
        rotated = true;
        const zeta = (aqq - app) / (2 * apq);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        m[p2 * n + p2] = app - t * apq;
        m[q * n + q] = aqq + t * apq;
        m[p2 * n + q] = 0;
        m[q * n + p2] = 0;
        for (let k = 0; k < n; k++) {
          if (k === p2 || k === q) continue;
          const akp = m[k * n + p2];
          const akq = m[k * n + q];
          const kp = c * akp - s * akq;
          const kq = s * akp + c * akq;
          m[k * n + p2] = kp;
          m[p2 * n + k] = kp;
          m[k * n + q] = kq;
          m[q * n + k] = kq;
        }
        if (withVectors) {
          for (let k = 0; k < n; k++) {
            const vkp = v[k * n + p2];
            const vkq = v[k * n + q];
            v[k * n + p2] = c * vkp - s * vkq;
            v[k * n + q] = s * vkp + c * vkq;
          }
        }
      }
    }
    if (!rotated) break;
  }
  const order = zeros(n);
  for (let i = 0; i < n; i++) {
    let j = i;
    while (j > 0 && m[order[j - 1] * n + order[j - 1]] > m[i * n + i]) {
      order[j] = order[j - 1];
      j--;
    }
    order[j] = i;
  }
  const values = zeros(n);
  for (let dst = 0; dst < n; dst++) values[dst] = m[order[dst] * n + order[dst]];
  if (!withVectors) return { values };
  const vectors = zeros(n * n);
  for (let dst = 0; dst < n; dst++) {
    const src = order[dst];
    for (let k = 0; k < n; k++) vectors[k * n + dst] = v[k * n + src];
  }
  return { values, vectors };
}
function eigen2(app, apq, aqq) {
  if (apq === 0) {
    return app <= aqq ? { values: [app, aqq], vectors: [1, 0, 0, 1] } : { values: [aqq, app], vectors: [0, 1, 1, 0] };
  }
  const zeta = (aqq - app) / (2 * apq);
  const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
  const c = 1 / Math.sqrt(1 + t * t);
  const s = t * c;
  const l1 = app - t * apq;
  const l2 = aqq + t * apq;
  return l1 <= l2 ? { values: [l1, l2], vectors: [c, s, -s, c] } : { values: [l2, l1], vectors: [s, c, c, -s] };
}

// ../../tmp/i3-base/src/design/fast/fastLadder.ts
function fastLadderOf(ladder, r, c) {
  const n = r.length;
  if (n < 1 || n > 4) throw new RangeError(`fastLadder: 1 to 4 stages, got ${n}`);
  const sqrtC = zeros(n);
  for (let k = 0; k < n; k++) sqrtC[k] = Math.sqrt(c[k] + (k === n - 1 ? ladder.loadCapacitance : 0));
  const lti = ladder.driverHigh === ladder.driverLow;
  let pinHigh;
  let pinLow;
  let delta;
  if (lti) {
    const perVolt = phase(ladder, r, sqrtC, ladder.driverHigh, 1);
    pinHigh = { ...perVolt, yEq: scaled(perVolt.yEq, ladder.high) };
    pinLow = { ...perVolt, yEq: scaled(perVolt.yEq, ladder.low) };
    delta = scaled(perVolt.yEq, ladder.high - ladder.low);
  } else {
    pinHigh = phase(ladder, r, sqrtC, ladder.driverHigh, ladder.high);
    pinLow = phase(ladder, r, sqrtC, ladder.driverLow, ladder.low);
    delta = zeros(n);
    for (let i = 0; i < n; i++) delta[i] = pinHigh.yEq[i] - pinLow.yEq[i];
  }
  return { n, period: ladder.period, high: ladder.high, low: ladder.low, lti, sqrtC, pinHigh, pinLow, delta };
}
function scaled(v, k) {
  const out = zeros(v.length);
  for (let i = 0; i < v.length; i++) out[i] = v[i] * k;
  return out;
}
function phase(ladder, r, sqrtC, driver, source) {
  const n = r.length;
  const g = zeros(n);
  for (let k = 0; k < n; k++) g[k] = 1 / (r[k] + (k === 0 ? driver : 0));
  const gLoad = ladder.loadResistance === null ? 0 : 1 / ladder.loadResistance;
  const diag = zeros(n);
  const off = zeros(n);
  for (let k = 0; k < n; k++) {
    diag[k] = g[k] + (k < n - 1 ? g[k + 1] : gLoad);
    if (k < n - 1) off[k] = -g[k + 1];
  }
  const s = zeros(n * n);
  for (let k = 0; k < n; k++) {
    s[k * n + k] = diag[k] / (sqrtC[k] * sqrtC[k]);
    if (k < n - 1) {
      const v = off[k] / (sqrtC[k] * sqrtC[k + 1]);
      s[k * n + k + 1] = v;
      s[(k + 1) * n + k] = v;
    }
  }
  const { values, vectors } = symmetricEigen(s, n, { vectors: true });
  const out = zeros(n);
  for (let i = 0; i < n; i++) out[i] = vectors[(n - 1) * n + i] / sqrtC[n - 1];
  const cp = zeros(n);
  const dp = zeros(n);
  for (let k = 0; k < n; k++) {
    const rhs = k === 0 ? g[0] * source : 0;
    const lower = k > 0 ? off[k - 1] : 0;
    const denom = diag[k] - lower * (k > 0 ? cp[k - 1] : 0);
    cp[k] = k < n - 1 ? off[k] / denom : 0;
    dp[k] = (rhs - lower * (k > 0 ? dp[k - 1] : 0)) / denom;
  }
  const yEq = zeros(n);
  let next = 0;
  for (let k = n - 1; k >= 0; k--) {
    const x = dp[k] - cp[k] * next;
    next = x;
    yEq[k] = x * sqrtC[k];
  }
  return { rate: values, mode: vectors, out, yEq };
}

// ../../tmp/i3-base/src/numeric/brentRoot.ts
function brentRoot(f, a, b, xtol = 0, fa = f(a), fb = f(b)) {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa > 0 === fb > 0) throw new RangeError("brentRoot: f(a) and f(b) have the same sign");
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p2;
      let q;
      const s = fb / fa;
      if (a === c) {
        p2 = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p2 = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p2 > 0) q = -q;
      else p2 = -p2;
      if (2 * p2 < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p2 / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}

// ../../tmp/i3-base/src/numeric/expSumRoots.ts
function expSumRoots(coef, rate, length, xtol = 1e-13 * length) {
  if (coef.length < 2 || !(length > 0)) return [];
  if (coef.length === 2) return twoTermRoot(coef[0], rate[0], coef[1], rate[1], length);
  let largest = 0;
  for (let i = 0; i < coef.length; i++) largest = Math.max(largest, Math.abs(coef[i]));
  let top = -1;
  let kept = 0;
  for (let i = 0; i < coef.length; i++) {
    if (!keep(coef[i], largest)) continue;
    kept++;
    if (top < 0 || rate[i] > rate[top]) top = i;
  }
  if (kept < 2) return [];
  const cs = [];
  const rs = [];
  for (let i = 0; i < coef.length; i++) {
    if (i === top || !keep(coef[i], largest)) continue;
    cs.push(coef[i] / coef[top]);
    rs.push(rate[i] - rate[top]);
  }
  return normalizedRoots(cs, rs, length, xtol);
}
function twoTermRoot(c0, r0, c1, r1, length) {
  const largest = Math.max(Math.abs(c0), Math.abs(c1));
  if (!keep(c0, largest) || !keep(c1, largest) || !(r0 !== r1)) return [];
  const ratio = -c0 / c1;
  if (!(ratio > 0)) return [];
  const s = Math.log(ratio) / (r1 - r0);
  return s > 0 && s < length ? [s] : [];
}
function keep(c, largest) {
  return Math.abs(c) > 1e-200 * largest && Number.isFinite(c);
}
function normalizedRoots(cs, rs, length, xtol) {
  if (cs.length === 1) {
    if (!(cs[0] < 0)) return [];
    const s = Math.log(-1 / cs[0]) / rs[0];
    return s > 0 && s < length ? [s] : [];
  }
  const slopes = [];
  for (let i = 0; i < cs.length; i++) slopes.push(cs[i] * rs[i]);
  const turns = expSumRoots(slopes, rs, length, xtol);
  const roots = [];
  let a = 0;
  let ga = sumAt(cs, rs, 0);
  for (let k = 0; k <= turns.length; k++) {
    const b = k < turns.length ? turns[k] : length;
    const gb = sumAt(cs, rs, b);
    if (ga === 0 && k > 0) roots.push(a);
    else if (ga < 0 && gb > 0 || ga > 0 && gb < 0) {
      BRENT_CS = cs;
      BRENT_RS = rs;
      roots.push(brentRoot(brentTarget, a, b, xtol, ga, gb));
    }
    a = b;
    ga = gb;
  }
  const inside = [];
  for (const s of roots) if (s > 0 && s < length) inside.push(s);
  return inside;
}
function sumAt(cs, rs, s) {
  let v = 1;
  for (let i = 0; i < cs.length; i++) v += cs[i] * Math.exp(rs[i] * s);
  return v;
}
var BRENT_CS = [];
var BRENT_RS = [];
function brentTarget(s) {
  return sumAt(BRENT_CS, BRENT_RS, s);
}

// ../../tmp/i3-base/src/numeric/lu.ts
function luFactor(a, n) {
  const f = factor(a, n, false);
  if (!f) throw new RangeError("singular matrix in luFactor");
  return f;
}
function luSolve(f, b, columns = 1) {
  const { n, lu, piv } = f;
  const x = zeros(n * columns);
  for (let c = 0; c < columns; c++) {
    for (let i = 0; i < n; i++) {
      let s = b[piv[i] * columns + c];
      for (let k = 0; k < i; k++) s -= lu[i * n + k] * x[k * columns + c];
      x[i * columns + c] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = x[i * columns + c];
      for (let k = i + 1; k < n; k++) s -= lu[i * n + k] * x[k * columns + c];
      x[i * columns + c] = s / lu[i * n + i];
    }
  }
  return x;
}
function factor(a, n, strict) {
  const lu = zeros(n * n);
  for (let i = 0; i < n * n; i++) lu[i] = a[i];
  const piv = zeros(n);
  for (let i = 0; i < n; i++) piv[i] = i;
  for (let k = 0; k < n; k++) {
    let p2 = k;
    let big = Math.abs(lu[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]);
      if (v > big) {
        big = v;
        p2 = i;
      }
    }
    if (big === 0 || strict && !Number.isFinite(big)) return null;
    if (p2 !== k) {
      for (let j = 0; j < n; j++) {
        const t2 = lu[k * n + j];
        lu[k * n + j] = lu[p2 * n + j];
        lu[p2 * n + j] = t2;
      }
      const t = piv[k];
      piv[k] = piv[p2];
      piv[p2] = t;
    }
    const pivot = lu[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const m = lu[i * n + k] / pivot;
      lu[i * n + k] = m;
      if (m === 0) continue;
      for (let j = k + 1; j < n; j++) lu[i * n + j] -= m * lu[k * n + j];
    }
  }
  return { n, lu, piv };
}

// ../../tmp/i3-base/src/numeric/phi.ts
function oneMinusPhi1(x) {
  if (x < 0.01) return x * (1 / 2 - x * (1 / 6 - x * (1 / 24 - x * (1 / 120 - x / 720))));
  return (x + Math.expm1(-x)) / x;
}

// ../../tmp/i3-base/src/design/fast/fastSteadyState.ts
function fastSteadyState(model, duty) {
  const { n, period } = model;
  const high = phaseAt(model.pinHigh, duty * period);
  const low = phaseAt(model.pinLow, (1 - duty) * period);
  const psiH = spectralMatrix(high.ph.mode, high.gone, n);
  const phiL = spectralMatrix(low.ph.mode, low.decay, n);
  const phiLpsiH = matmul(phiL, psiH, n);
  const sys = spectralMatrix(low.ph.mode, low.gone, n);
  for (let i = 0; i < n * n; i++) sys[i] += phiLpsiH[i];
  const u = luSolve(luFactor(sys, n), matvec(phiLpsiH, model.delta, n));
  const last = n - 1;
  const vHigh = zeros(n);
  for (let i = 0; i < n; i++) vHigh[i] = model.delta[i] - u[i];
  const cHigh = transposeMatvec(high.ph.mode, vHigh, n);
  const wHigh = zeros(n);
  const a = zeros(n);
  for (let i = 0; i < n; i++) wHigh[i] = cHigh[i] * high.ph.out[i];
  for (let k = 0; k < n; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += high.ph.mode[k * n + i] * high.gone[i] * cHigh[i];
    a[k] = s;
  }
  const aOut = a[last] / model.sqrtC[last];
  const vLow = zeros(n);
  for (let i = 0; i < n; i++) vLow[i] = -u[i] - a[i];
  const cLow = transposeMatvec(low.ph.mode, vLow, n);
  const wLow = zeros(n);
  for (let i = 0; i < n; i++) wLow[i] = cLow[i] * low.ph.out[i];
  const ext = [Math.max(0, aOut), Math.min(0, aOut)];
  if (high.t > 0) scanPhase(wHigh, high.ph.rate, high.t, 0, n, ext);
  if (low.t > 0) scanPhase(wLow, low.ph.rate, low.t, aOut, n, ext);
  const maxDev = ext[0];
  const minDev = ext[1];
  let integral = aOut * low.t;
  for (let i = 0; i < n; i++) {
    integral += wHigh[i] * high.t * oneMinusPhi1(high.ph.rate[i] * high.t);
    integral += wLow[i] * low.t * oneMinusPhi1(low.ph.rate[i] * low.t);
  }
  const meanOffset = integral / period;
  const yStart = (model.pinLow.yEq[last] + u[last]) / model.sqrtC[last];
  return {
    duty,
    high,
    low,
    u,
    yStart,
    wHigh,
    aOut,
    a,
    wLow,
    maxDev,
    minDev,
    meanOffset,
    ripple: maxDev - minDev,
    average: yStart + meanOffset
  };
}
function scanPhase(w, rate, t, offset, n, ext) {
  const slope = zeros(n);
  const exponent = zeros(n);
  for (let i = 0; i < n; i++) {
    slope[i] = w[i] * rate[i];
    exponent[i] = -rate[i];
  }
  for (const s of expSumRoots(slope, exponent, t)) {
    let v = offset;
    for (let i = 0; i < n; i++) v -= w[i] * Math.expm1(-rate[i] * s);
    if (v > ext[0]) ext[0] = v;
    if (v < ext[1]) ext[1] = v;
  }
}
function phaseAt(ph, t) {
  const n = ph.rate.length;
  const decay = zeros(n);
  const gone = zeros(n);
  for (let i = 0; i < n; i++) {
    decay[i] = Math.exp(-ph.rate[i] * t);
    gone[i] = -Math.expm1(-ph.rate[i] * t);
  }
  return { ph, t, decay, gone };
}

// ../../tmp/i3-base/src/design/fast/fastSettlingBound.ts
var MAX_PERIODS = 2 ** 52;
function fastSettlingBound(model, from2, to2, band, steadyFrom = fastSteadyState(model, from2), steadyTo = fastSteadyState(model, to2)) {
  const { n, period } = model;
  const plan = steadyTo;
  const above = plan.maxDev - plan.meanOffset;
  const below = plan.meanOffset - plan.minDev;
  if (above > band || below > band) return Infinity;
  const margin = band - Math.max(above, below, 0);
  const e0 = zeros(n);
  for (let i = 0; i < n; i++) e0[i] = steadyFrom.u[i] - plan.u[i];
  const { high, low } = plan;
  const last = n - 1;
  const phiH = spectralMatrix(high.ph.mode, high.decay, n);
  let kHigh = -plan.meanOffset;
  let kLow = plan.aOut - plan.meanOffset;
  for (let i = 0; i < n; i++) {
    kHigh += plan.wHigh[i];
    kLow += plan.wLow[i];
  }
  const lastViolation = (e) => {
    const eFall = matvec(phiH, e, n);
    const inLow = lateCrossing(low, kLow, plan.wLow, eFall, band, n);
    if (inLow === Infinity) return period;
    if (inLow >= 0) return high.t + inLow;
    const inHigh = lateCrossing(high, kHigh, plan.wHigh, e, band, n);
    if (inHigh === Infinity) return high.t;
    return inHigh;
  };
  const sqrtDecayL = zeros(n);
  for (let i = 0; i < n; i++) sqrtDecayL[i] = Math.sqrt(low.decay[i]);
  const halfL = spectralMatrix(low.ph.mode, sqrtDecayL, n);
  const psiH = spectralMatrix(high.ph.mode, high.gone, n);
  const nMat = spectralMatrix(low.ph.mode, low.gone, n);
  const inner = matmul(matmul(halfL, psiH, n), halfL, n);
  for (let i = 0; i < n * n; i++) nMat[i] += inner[i];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const v2 = 0.5 * (nMat[i * n + j] + nMat[j * n + i]);
      nMat[i * n + j] = v2;
      nMat[j * n + i] = v2;
    }
  }
  const { values: nu, vectors: v } = symmetricEigen(nMat, n, { vectors: true });
  const logBeta = zeros(n);
  for (let i = 0; i < n; i++) logBeta[i] = Math.log1p(-Math.min(nu[i], 1 - 1e-16));
  const z = transposeMatvec(v, matvec(halfL, matvec(phiH, e0, n), n), n);
  const g = matmul(halfL, v, n);
  const stateAt = (k) => {
    if (k === 0) return e0;
    const e = zeros(n);
    for (let j = 0; j < n; j++) {
      const amp = z[j] * Math.exp((k - 1) * logBeta[j]);
      if (amp === 0) continue;
      for (let r = 0; r < n; r++) e[r] += g[r * n + j] * amp;
    }
    return e;
  };
  const leaves = (k) => lastViolation(stateAt(k)) >= 0;
  const slowOut = g[last * n] * z[0] / model.sqrtC[last];
  let kEst = 0;
  if (Math.abs(slowOut) > margin && logBeta[0] < 0) {
    kEst = Math.min(MAX_PERIODS, Math.max(0, Math.floor(1 + Math.log(margin / Math.abs(slowOut)) / logBeta[0])));
  }
  let kv = -1;
  let kn = MAX_PERIODS;
  if (leaves(kEst)) {
    kv = kEst;
    for (let step = 1; ; step *= 2) {
      const k = kv + step;
      if (k >= MAX_PERIODS) break;
      if (leaves(k)) kv = k;
      else {
        kn = k;
        break;
      }
    }
  } else {
    kn = kEst;
    for (let step = 1; kn > 0; step *= 2) {
      const k = Math.max(0, kn - step);
      if (leaves(k)) {
        kv = k;
        break;
      }
      kn = k;
    }
  }
  if (kv < 0) return 0;
  while (kn - kv > 1) {
    const mid = Math.floor((kv + kn) / 2);
    if (leaves(mid)) kv = mid;
    else kn = mid;
  }
  return kv * period + lastViolation(stateAt(kv));
}
function lateCrossing(p2, c, w, e, band, n) {
  if (p2.t <= 0) return -1;
  const modal = transposeMatvec(p2.ph.mode, e, n);
  const b = zeros(n + 1);
  const rate = zeros(n + 1);
  let end = c;
  for (let i = 0; i < n; i++) {
    b[i + 1] = p2.ph.out[i] * modal[i] - w[i];
    rate[i + 1] = -p2.ph.rate[i];
    end += b[i + 1] * p2.decay[i];
  }
  if (end > band || end < -band) return Infinity;
  let latest = -1;
  b[0] = c - band;
  const up = expSumRoots(b, rate, p2.t);
  if (up.length > 0) latest = up[up.length - 1];
  b[0] = c + band;
  const down = expSumRoots(b, rate, p2.t);
  if (down.length > 0) latest = Math.max(latest, down[down.length - 1]);
  return latest;
}

// src/numeric/dense.ts
function zeros2(n) {
  const v = [];
  for (let i = 0; i < n; i++) v.push(0);
  return v;
}
function normInf(a, n) {
  let best = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(a[i * n + j]);
    best = Math.max(best, s);
  }
  return best;
}

// src/circuit/dcGain.ts
function dcGain(ladder, driver) {
  const { stages: stages2 } = ladder;
  const n = stages2.length;
  const gain = new Array(n).fill(1);
  let vIn = 1;
  let first = 0;
  for (let k = 0; k < n; k++) {
    if (!(stages2[k].buffered || k === n - 1)) continue;
    const last = k;
    const loaded = last === n - 1 && !stages2[last].buffered && ladder.loadResistance !== null;
    if (loaded) {
      dividerGain(stages2.map((s) => s.r), first, last, ladder.loadResistance, first === 0 ? driver : 0, vIn, gain);
    } else {
      for (let j = first; j <= last; j++) gain[j] = vIn;
    }
    vIn = gain[last];
    first = last + 1;
  }
  return gain;
}
function dividerGain(r, first, last, loadResistance, source, vIn, gain) {
  let total = loadResistance + source;
  for (let j = first; j <= last; j++) total += r[j];
  let after = loadResistance;
  for (let j = last; j >= first; j--) {
    gain[j] = vIn * after / total;
    after += r[j];
  }
}

// src/numeric/symmetricEigen.ts
function symmetricEigen2(a, n, options) {
  if (n === 1) return { values: [a[0]], vectors: [1] };
  if (n === 2) return symmetricEigen22(a[0], a[1], a[3]);
  const withVectors = options?.vectors === true;
  const m = zeros2(n * n);
  for (let i = 0; i < n * n; i++) m[i] = a[i];
  const v = withVectors ? zeros2(n * n) : [];
  if (withVectors) for (let i = 0; i < n; i++) v[i * n + i] = 1;
  for (let sweep = 0; sweep < 50; sweep++) {
    let rotated = false;
    for (let p2 = 0; p2 < n - 1; p2++) {
      for (let q = p2 + 1; q < n; q++) {
        const apq = m[p2 * n + q];
        if (apq === 0) continue;
        const app = m[p2 * n + p2];
        const aqq = m[q * n + q];
        if (Math.abs(apq) <= 1e-19 * Math.sqrt(Math.abs(app * aqq))) {
          m[p2 * n + q] = 0;
          m[q * n + p2] = 0;
          continue;
        }
        rotated = true;
        const zeta = (aqq - app) / (2 * apq);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        m[p2 * n + p2] = app - t * apq;
        m[q * n + q] = aqq + t * apq;
        m[p2 * n + q] = 0;
        m[q * n + p2] = 0;
        for (let k = 0; k < n; k++) {
          if (k === p2 || k === q) continue;
          const akp = m[k * n + p2];
          const akq = m[k * n + q];
          const kp = c * akp - s * akq;
          const kq = s * akp + c * akq;
          m[k * n + p2] = kp;
          m[p2 * n + k] = kp;
          m[k * n + q] = kq;
          m[q * n + k] = kq;
        }
        if (withVectors) {
          for (let k = 0; k < n; k++) {
            const vkp = v[k * n + p2];
            const vkq = v[k * n + q];
            v[k * n + p2] = c * vkp - s * vkq;
            v[k * n + q] = s * vkp + c * vkq;
          }
        }
      }
    }
    if (!rotated) break;
  }
  const order = zeros2(n);
  for (let i = 0; i < n; i++) {
    let j = i;
    while (j > 0 && m[order[j - 1] * n + order[j - 1]] > m[i * n + i]) {
      order[j] = order[j - 1];
      j--;
    }
    order[j] = i;
  }
  const values = zeros2(n);
  for (let dst = 0; dst < n; dst++) values[dst] = m[order[dst] * n + order[dst]];
  if (!withVectors) return { values };
  const vectors = zeros2(n * n);
  for (let dst = 0; dst < n; dst++) {
    const src = order[dst];
    for (let k = 0; k < n; k++) vectors[k * n + dst] = v[k * n + src];
  }
  return { values, vectors };
}
function symmetricEigen22(app, apq, aqq) {
  if (apq === 0) {
    return app <= aqq ? { values: [app, aqq], vectors: [1, 0, 0, 1] } : { values: [aqq, app], vectors: [0, 1, 1, 0] };
  }
  const zeta = (aqq - app) / (2 * apq);
  const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
  const c = 1 / Math.sqrt(1 + t * t);
  const s = t * c;
  const l1 = app - t * apq;
  const l2 = aqq + t * apq;
  return l1 <= l2 ? { values: [l1, l2], vectors: [c, s, -s, c] } : { values: [l2, l1], vectors: [s, c, c, -s] };
}

// src/engine/modal/modalLadderOf.ts
function modalLadderOf(circuit, r, c) {
  return r.length === 1 || r.length === 2 ? smallLadder(circuit, r, c) : modalLadderOfAnyOrder(circuit, r, c);
}
function modalLadderOfAnyOrder(circuit, r, c) {
  const n = r.length;
  checkStages(r, c);
  if (CS.length < n) grow(n);
  const { loadResistance, loadCapacitance, driverHigh, driverLow } = circuit;
  for (let k = 0; k < n; k++) CS[k] = Math.sqrt(c[k] + (k === n - 1 ? loadCapacitance : 0));
  for (let k = 1; k < n; k++) G_IN[k] = 1 / r[k];
  G_IN[n] = loadResistance !== null ? 1 / loadResistance : 0;
  const equal = driverHigh === driverLow;
  const high = phase2(n, r[0] + driverHigh);
  const low = equal ? high : phase2(n, r[0] + driverLow);
  for (let k = 0; k < n; k++) G_HIGH[k] = 1;
  if (loadResistance !== null) dividerGain(r, 0, n - 1, loadResistance, driverHigh, 1, G_HIGH);
  const gLow = equal ? G_HIGH : G_LOW;
  if (!equal) {
    for (let k = 0; k < n; k++) G_LOW[k] = 1;
    if (loadResistance !== null) dividerGain(r, 0, n - 1, loadResistance, driverLow, 1, G_LOW);
  }
  const span = circuit.high - circuit.low;
  for (let j = 0; j < n; j++) DC_DELTA[j] = equal ? G_HIGH[j] * span : G_HIGH[j] * circuit.high - gLow[j] * circuit.low;
  const hb = high.basis;
  const lb = low.basis;
  const mix = zeros2(n * n);
  const delta = zeros2(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += lb[k * n + i] * hb[k * n + j];
      mix[i * n + j] = s;
      delta[i] += hb[j * n + i] * CS[j] * DC_DELTA[j];
    }
  }
  return {
    n,
    period: circuit.period,
    high: circuit.high,
    low: circuit.low,
    symmetric: true,
    hi: high.modes,
    lo: low.modes,
    mix,
    delta,
    outLow: gLow[n - 1] * circuit.low,
    outHigh: G_HIGH[n - 1] * circuit.high,
    condition: 1
  };
}
function checkStages(r, c) {
  for (let k = 0; k < r.length; k++) {
    if (!(r[k] > 0) || !(c[k] > 0)) throw new RangeError("invalid ladder: every stage needs r > 0 and c > 0");
  }
}
function smallLadder(circuit, r, c) {
  const n = r.length;
  checkStages(r, c);
  const { loadResistance, loadCapacitance, driverHigh, driverLow, high: vHigh, low: vLow } = circuit;
  const equal = driverHigh === driverLow;
  const gLoad = loadResistance !== null ? 1 / loadResistance : 0;
  G_HIGH[0] = G_HIGH[1] = G_LOW[0] = G_LOW[1] = 1;
  if (loadResistance !== null) {
    dividerGain(r, 0, n - 1, loadResistance, driverHigh, 1, G_HIGH);
    if (!equal) dividerGain(r, 0, n - 1, loadResistance, driverLow, 1, G_LOW);
  }
  const gLow = equal ? G_HIGH : G_LOW;
  const span = vHigh - vLow;
  const last = n - 1;
  const outLow = gLow[last] * vLow;
  const outHigh = G_HIGH[last] * vHigh;
  if (n === 1) {
    const cs02 = Math.sqrt(c[0] + loadCapacitance);
    const cc = cs02 * cs02;
    const hi2 = { rate: [-(1 / (r[0] + driverHigh) + gLoad) / cc], out: [1 / cs02] };
    const lo2 = equal ? hi2 : { rate: [-(1 / (r[0] + driverLow) + gLoad) / cc], out: [1 / cs02] };
    const d02 = equal ? G_HIGH[0] * span : G_HIGH[0] * vHigh - gLow[0] * vLow;
    return { n, period: circuit.period, high: vHigh, low: vLow, symmetric: true, hi: hi2, lo: lo2, mix: [0 + 1 * 1], delta: [0 + 1 * cs02 * d02], outLow, outHigh, condition: 1 };
  }
  const cs0 = Math.sqrt(c[0] + 0);
  const cs1 = Math.sqrt(c[1] + loadCapacitance);
  const g1 = 1 / r[1];
  const off = g1 / (cs0 * cs1);
  const s11 = -(g1 + gLoad) / (cs1 * cs1);
  const eh = symmetricEigen22(-(1 / (r[0] + driverHigh) + g1) / (cs0 * cs0), off, s11);
  const el = equal ? eh : symmetricEigen22(-(1 / (r[0] + driverLow) + g1) / (cs0 * cs0), off, s11);
  const H = eh.vectors;
  const L = el.vectors;
  const hi = { rate: eh.values, out: [H[2] / cs1, H[3] / cs1] };
  const lo = equal ? hi : { rate: el.values, out: [L[2] / cs1, L[3] / cs1] };
  const d0 = equal ? G_HIGH[0] * span : G_HIGH[0] * vHigh - gLow[0] * vLow;
  const d1 = equal ? G_HIGH[1] * span : G_HIGH[1] * vHigh - gLow[1] * vLow;
  return {
    n,
    period: circuit.period,
    high: vHigh,
    low: vLow,
    symmetric: true,
    hi,
    lo,
    mix: [0 + L[0] * H[0] + L[2] * H[2], 0 + L[0] * H[1] + L[2] * H[3], 0 + L[1] * H[0] + L[3] * H[2], 0 + L[1] * H[1] + L[3] * H[3]],
    delta: [0 + H[0] * cs0 * d0 + H[2] * cs1 * d1, 0 + H[1] * cs0 * d0 + H[3] * cs1 * d1],
    outLow,
    outHigh,
    condition: 1
  };
}
function phase2(n, first) {
  G_IN[0] = 1 / first;
  S.fill(0, 0, n * n);
  for (let k = 0; k < n; k++) {
    S[k * n + k] = -(G_IN[k] + G_IN[k + 1]) / (CS[k] * CS[k]);
    if (k + 1 < n) {
      const off = G_IN[k + 1] / (CS[k] * CS[k + 1]);
      S[k * n + k + 1] = off;
      S[(k + 1) * n + k] = off;
    }
  }
  const { values, vectors } = symmetricEigen2(S, n, { vectors: true });
  const out = zeros2(n);
  for (let i = 0; i < n; i++) out[i] = vectors[(n - 1) * n + i] / CS[n - 1];
  return { modes: { rate: values, out }, basis: vectors };
}
var CS = new Float64Array(4);
var G_IN = new Float64Array(5);
var S = new Float64Array(16);
var G_HIGH = new Float64Array(4);
var G_LOW = new Float64Array(4);
var DC_DELTA = new Float64Array(4);
function grow(n) {
  CS = new Float64Array(n);
  G_IN = new Float64Array(n + 1);
  S = new Float64Array(n * n);
  G_HIGH = new Float64Array(n);
  G_LOW = new Float64Array(n);
  DC_DELTA = new Float64Array(n);
}

// src/numeric/lu.ts
function luSolve2(f, b, columns = 1) {
  const { n, lu, piv } = f;
  const x = zeros2(n * columns);
  for (let c = 0; c < columns; c++) {
    for (let i = 0; i < n; i++) {
      let s = b[piv[i] * columns + c];
      for (let k = 0; k < i; k++) s -= lu[i * n + k] * x[k * columns + c];
      x[i * columns + c] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = x[i * columns + c];
      for (let k = i + 1; k < n; k++) s -= lu[i * n + k] * x[k * columns + c];
      x[i * columns + c] = s / lu[i * n + i];
    }
  }
  return x;
}
function solveLinear(a, n, b, columns = 1) {
  const f = factor2(a, n, true);
  return f ? luSolve2(f, b, columns) : null;
}
function factor2(a, n, strict) {
  const lu = zeros2(n * n);
  for (let i = 0; i < n * n; i++) lu[i] = a[i];
  const piv = zeros2(n);
  for (let i = 0; i < n; i++) piv[i] = i;
  for (let k = 0; k < n; k++) {
    let p2 = k;
    let big = Math.abs(lu[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]);
      if (v > big) {
        big = v;
        p2 = i;
      }
    }
    if (big === 0 || strict && !Number.isFinite(big)) return null;
    if (p2 !== k) {
      for (let j = 0; j < n; j++) {
        const t2 = lu[k * n + j];
        lu[k * n + j] = lu[p2 * n + j];
        lu[p2 * n + j] = t2;
      }
      const t = piv[k];
      piv[k] = piv[p2];
      piv[p2] = t;
    }
    const pivot = lu[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const m = lu[i * n + k] / pivot;
      lu[i * n + k] = m;
      if (m === 0) continue;
      for (let j = k + 1; j < n; j++) lu[i * n + j] -= m * lu[k * n + j];
    }
  }
  return { n, lu, piv };
}
function solveTwoByTwo(a, b, c, d, e, f, out) {
  if (Math.abs(c) > Math.abs(a)) {
    let t = a;
    a = c;
    c = t;
    t = b;
    b = d;
    d = t;
    t = e;
    e = f;
    f = t;
  }
  if (a === 0) return false;
  const l = c / a;
  const pivot = d - l * b;
  if (pivot === 0) return false;
  const x1 = (f - l * e) / pivot;
  out[0] = (e - b * x1) / a;
  out[1] = x1;
  return true;
}

// src/numeric/phi.ts
function phi2(z) {
  if (Math.abs(z) >= 1) return (Math.expm1(z) - z) / (z * z);
  let term = 0.5;
  let sum = 0.5;
  for (let k = 1; k < 25; k++) {
    term *= z / (k + 2);
    sum += term;
    if (Math.abs(term) <= 1e-17 * Math.abs(sum)) break;
  }
  return sum;
}

// src/engine/modal/periodicState.ts
function periodicState(m, duty) {
  const { n, period, hi, lo, mix, delta } = m;
  const t1 = duty * period;
  const t2 = (1 - duty) * period;
  const kh = zeros2(n);
  const kl = zeros2(n);
  const el = zeros2(n);
  for (let i = 0; i < n; i++) {
    kh[i] = -Math.expm1(hi.rate[i] * t1);
    kl[i] = -Math.expm1(lo.rate[i] * t2);
    el[i] = Math.exp(lo.rate[i] * t2);
  }
  let start;
  let drive;
  if (t2 === 0) {
    start = delta.slice();
    drive = zeros2(n);
  } else if (n === 1) {
    const den = kl[0] + el[0] * kh[0];
    start = [el[0] * kh[0] * delta[0] / den];
    drive = [kl[0] * delta[0] / den];
  } else {
    const Y = zeros2(n * n);
    const rhs = zeros2(2 * n);
    for (let i = 0; i < n; i++) {
      let sHigh = 0;
      let sAll = 0;
      for (let j = 0; j < n; j++) {
        const x = mix[i * n + j];
        Y[i * n + j] = x * (kl[i] + el[i] * kh[j]);
        sHigh += x * kh[j] * delta[j];
        sAll += x * delta[j];
      }
      rhs[2 * i] = el[i] * sHigh;
      rhs[2 * i + 1] = kl[i] * sAll;
    }
    const solved = solveLinear(Y, n, rhs, 2);
    if (!solved) throw new RangeError("periodicState: singular period map (not a physical ladder)");
    start = zeros2(n);
    drive = zeros2(n);
    for (let i = 0; i < n; i++) {
      start[i] = solved[2 * i];
      drive[i] = solved[2 * i + 1];
    }
  }
  const aHigh = zeros2(n);
  const wEnd = zeros2(n);
  let yEnd = 0;
  let fromLow = 0;
  let fromHigh = 0;
  for (let i = 0; i < n; i++) {
    aHigh[i] = hi.out[i] * drive[i];
    wEnd[i] = kh[i] * drive[i];
    yEnd += aHigh[i] * kh[i];
    fromLow += hi.out[i] * start[i];
    fromHigh += hi.out[i] * drive[i];
  }
  const aLow = zeros2(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s -= mix[i * n + j] * (start[j] + wEnd[j]);
    aLow[i] = lo.out[i] * s;
  }
  let integral = t2 * yEnd;
  for (let i = 0; i < n; i++) {
    const zh = hi.rate[i] * t1;
    const zl = lo.rate[i] * t2;
    integral += aHigh[i] * -hi.rate[i] * t1 * t1 * phi2(zh);
    integral += aLow[i] * -lo.rate[i] * t2 * t2 * phi2(zl);
  }
  const meanOffset = integral / period;
  const yStart = duty > 0.5 ? m.outHigh - fromHigh : m.outLow + fromLow;
  return {
    duty,
    t1,
    t2,
    start,
    yStart,
    meanOffset,
    average: yStart + meanOffset,
    high: { offset: 0, gain: aHigh.map((a) => -a), rate: hi.rate, length: t1 },
    low: { offset: yEnd, gain: aLow.map((a) => -a), rate: lo.rate, length: t2 }
  };
}

// src/numeric/brentRoot.ts
function brentRoot2(f, a, b, xtol = 0, fa = f(a), fb = f(b)) {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa > 0 === fb > 0) throw new RangeError("brentRoot: f(a) and f(b) have the same sign");
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p2;
      let q;
      const s = fb / fa;
      if (a === c) {
        p2 = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p2 = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p2 > 0) q = -q;
      else p2 = -p2;
      if (2 * p2 < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p2 / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}

// src/numeric/expSumRoots.ts
function expSumRoots2(coef, rate, length, xtol = 1e-13 * length) {
  if (coef.length < 2 || !(length > 0)) return [];
  if (coef.length === 2) return twoTermRoot2(coef[0], rate[0], coef[1], rate[1], length);
  let largest = 0;
  for (let i = 0; i < coef.length; i++) largest = Math.max(largest, Math.abs(coef[i]));
  let top = -1;
  let kept = 0;
  for (let i = 0; i < coef.length; i++) {
    if (!keep2(coef[i], largest)) continue;
    kept++;
    if (top < 0 || rate[i] > rate[top]) top = i;
  }
  if (kept < 2) return [];
  const cs = [];
  const rs = [];
  for (let i = 0; i < coef.length; i++) {
    if (i === top || !keep2(coef[i], largest)) continue;
    cs.push(coef[i] / coef[top]);
    rs.push(rate[i] - rate[top]);
  }
  return normalizedRoots2(cs, rs, length, xtol);
}
function twoTermRoot2(c0, r0, c1, r1, length) {
  const largest = Math.max(Math.abs(c0), Math.abs(c1));
  if (!keep2(c0, largest) || !keep2(c1, largest) || !(r0 !== r1)) return [];
  const ratio = -c0 / c1;
  if (!(ratio > 0)) return [];
  const s = Math.log(ratio) / (r1 - r0);
  return s > 0 && s < length ? [s] : [];
}
function keep2(c, largest) {
  return Math.abs(c) > 1e-200 * largest && Number.isFinite(c);
}
function normalizedRoots2(cs, rs, length, xtol) {
  if (cs.length === 1) {
    if (!(cs[0] < 0)) return [];
    const s = Math.log(-1 / cs[0]) / rs[0];
    return s > 0 && s < length ? [s] : [];
  }
  const slopes = [];
  for (let i = 0; i < cs.length; i++) slopes.push(cs[i] * rs[i]);
  const turns = expSumRoots2(slopes, rs, length, xtol);
  const roots = [];
  let a = 0;
  let ga = sumAt2(cs, rs, 0);
  for (let k = 0; k <= turns.length; k++) {
    const b = k < turns.length ? turns[k] : length;
    const gb = sumAt2(cs, rs, b);
    if (ga === 0 && k > 0) roots.push(a);
    else if (ga < 0 && gb > 0 || ga > 0 && gb < 0) {
      BRENT_CS2 = cs;
      BRENT_RS2 = rs;
      roots.push(brentRoot2(brentTarget2, a, b, xtol, ga, gb));
    }
    a = b;
    ga = gb;
  }
  const inside = [];
  for (const s of roots) if (s > 0 && s < length) inside.push(s);
  return inside;
}
function sumAt2(cs, rs, s) {
  let v = 1;
  for (let i = 0; i < cs.length; i++) v += cs[i] * Math.exp(rs[i] * s);
  return v;
}
var BRENT_CS2 = [];
var BRENT_RS2 = [];
function brentTarget2(s) {
  return sumAt2(BRENT_CS2, BRENT_RS2, s);
}

// src/engine/modal/phaseCurve.ts
function curveValue(c, tau) {
  let v = c.offset;
  for (let i = 0; i < c.gain.length; i++) v += c.gain[i] * Math.expm1(c.rate[i] * tau);
  return v;
}
function curveTurningPoints(c) {
  if (c.gain.length < 2 || !(c.length > 0)) return [];
  if (c.gain.length === 2) {
    const t = twoTermTurningPoint(c);
    return t > 0 ? [t] : [];
  }
  const slope = zeros2(c.gain.length);
  for (let i = 0; i < slope.length; i++) slope[i] = c.gain[i] * c.rate[i];
  return expSumRoots2(slope, c.rate, c.length);
}
function curveExtrema(c) {
  if (c.gain.length <= 2) return smallCurveExtrema(c);
  let max = c.offset;
  let min = c.offset;
  let tMax = 0;
  let tMin = 0;
  const visit = (t) => {
    const v = curveValue(c, t);
    if (v > max) {
      max = v;
      tMax = t;
    }
    if (v < min) {
      min = v;
      tMin = t;
    }
  };
  if (c.length > 0) {
    visit(c.length);
    for (const t of curveTurningPoints(c)) visit(t);
  }
  return { max, tMax, min, tMin };
}
function twoTermTurningPoint(c) {
  const d0 = c.gain[0] * c.rate[0];
  const d1 = c.gain[1] * c.rate[1];
  if (d0 === 0 || d1 === 0) return -1;
  const ratio = -d1 / d0;
  if (!(ratio > 0)) return -1;
  const t = Math.log(ratio) / (c.rate[0] - c.rate[1]);
  return t > 0 && t < c.length ? t : -1;
}
function smallCurveExtrema(c) {
  let max = c.offset;
  let min = c.offset;
  let tMax = 0;
  let tMin = 0;
  if (c.length > 0) {
    const end = curveValue(c, c.length);
    if (end > max) [max, tMax] = [end, c.length];
    if (end < min) [min, tMin] = [end, c.length];
    if (c.gain.length === 2) {
      const t = twoTermTurningPoint(c);
      if (t > 0) {
        const v = curveValue(c, t);
        if (v > max) [max, tMax] = [v, t];
        if (v < min) [min, tMin] = [v, t];
      }
    }
  }
  return { max, tMax, min, tMin };
}

// src/engine/modal/smallState.ts
function smallState(m, duty) {
  const { period, hi, lo, mix, delta } = m;
  const two = m.n === 2;
  const t1 = duty * period;
  const t2 = (1 - duty) * period;
  const rh0 = hi.rate[0];
  const rl0 = lo.rate[0];
  const rh1 = two ? hi.rate[1] : 0;
  const rl1 = two ? lo.rate[1] : 0;
  const kh0 = -Math.expm1(rh0 * t1);
  const kl0 = -Math.expm1(rl0 * t2);
  const el0 = Math.exp(rl0 * t2);
  const kh1 = two ? -Math.expm1(rh1 * t1) : 0;
  const x00 = mix[0];
  const x01 = two ? mix[1] : 0;
  const x10 = two ? mix[2] : 0;
  const x11 = two ? mix[3] : 0;
  let u0;
  let u1 = 0;
  let v0;
  let v1 = 0;
  if (t2 === 0) {
    u0 = delta[0];
    u1 = two ? delta[1] : 0;
    v0 = 0;
  } else if (!two) {
    const den = kl0 + el0 * kh0;
    u0 = el0 * kh0 * delta[0] / den;
    v0 = kl0 * delta[0] / den;
  } else {
    const kl1 = -Math.expm1(rl1 * t2);
    const el1 = Math.exp(rl1 * t2);
    const a = x00 * (kl0 + el0 * kh0);
    const b = x01 * (kl0 + el0 * kh1);
    const c = x10 * (kl1 + el1 * kh0);
    const d = x11 * (kl1 + el1 * kh1);
    const e = el0 * (x00 * kh0 * delta[0] + x01 * kh1 * delta[1]);
    const f = el1 * (x10 * kh0 * delta[0] + x11 * kh1 * delta[1]);
    const g = kl0 * (x00 * delta[0] + x01 * delta[1]);
    const h = kl1 * (x10 * delta[0] + x11 * delta[1]);
    if (!solveTwoByTwo(a, b, c, d, e, f, SOLVED)) SOLVED[0] = SOLVED[1] = NaN;
    u0 = SOLVED[0];
    u1 = SOLVED[1];
    if (!solveTwoByTwo(a, b, c, d, g, h, SOLVED)) SOLVED[0] = SOLVED[1] = NaN;
    v0 = SOLVED[0];
    v1 = SOLVED[1];
  }
  const aHigh0 = hi.out[0] * v0;
  const aHigh1 = two ? hi.out[1] * v1 : 0;
  const w0 = kh0 * v0;
  const w1 = kh1 * v1;
  const yEnd = aHigh0 * kh0 + aHigh1 * kh1;
  const aLow0 = lo.out[0] * -(x00 * (u0 + w0) + x01 * (u1 + w1));
  const aLow1 = two ? lo.out[1] * -(x10 * (u0 + w0) + x11 * (u1 + w1)) : 0;
  let integral = t2 * yEnd - aHigh0 * rh0 * t1 * t1 * phi2(rh0 * t1) - aLow0 * rl0 * t2 * t2 * phi2(rl0 * t2);
  if (two) integral -= aHigh1 * rh1 * t1 * t1 * phi2(rh1 * t1) + aLow1 * rl1 * t2 * t2 * phi2(rl1 * t2);
  const yStart = duty > 0.5 ? m.outHigh - (hi.out[0] * v0 + (two ? hi.out[1] * v1 : 0)) : m.outLow + hi.out[0] * u0 + (two ? hi.out[1] * u1 : 0);
  const meanOffset = integral / period;
  return {
    t1,
    t2,
    yStart,
    meanOffset,
    average: yStart + meanOffset,
    yEnd,
    aHigh0,
    aHigh1,
    aLow0,
    aLow1,
    rh0,
    rh1,
    rl0,
    rl1
  };
}
function smallExtrema(s, out) {
  let max = Math.max(0, s.yEnd);
  let min = Math.min(0, s.yEnd);
  if (s.aHigh1 !== 0) {
    const t = turningPoint(s.aHigh0 * s.rh0, s.aHigh1 * s.rh1, s.rh0, s.rh1, s.t1);
    if (t > 0) {
      const v = -(s.aHigh0 * Math.expm1(s.rh0 * t) + s.aHigh1 * Math.expm1(s.rh1 * t));
      if (v > max) max = v;
      if (v < min) min = v;
    }
  }
  if (s.aLow1 !== 0) {
    const t = turningPoint(s.aLow0 * s.rl0, s.aLow1 * s.rl1, s.rl0, s.rl1, s.t2);
    if (t > 0) {
      const v = s.yEnd - (s.aLow0 * Math.expm1(s.rl0 * t) + s.aLow1 * Math.expm1(s.rl1 * t));
      if (v > max) max = v;
      if (v < min) min = v;
    }
  }
  out.max = max;
  out.min = min;
}
function turningPoint(d0, d1, r0, r1, length) {
  if (d0 === 0) return -1;
  const ratio = -d1 / d0;
  if (!(ratio > 0)) return -1;
  const t = Math.log(ratio) / (r0 - r1);
  return t > 0 && t < length ? t : -1;
}
var SOLVED = [0, 0];

// src/engine/modal/steadySwing.ts
var EXT = { max: 0, min: 0 };
function steadySwing(m, duty, state) {
  if (m.n <= 2 && state === void 0) {
    const s2 = smallState(m, duty);
    smallExtrema(s2, EXT);
    return { ripple: EXT.max - EXT.min, average: s2.average, yStart: s2.yStart, above: EXT.max - s2.meanOffset, below: s2.meanOffset - EXT.min };
  }
  const s = state ?? periodicState(m, duty);
  const h = curveExtrema(s.high);
  const l = curveExtrema(s.low);
  let max = 0;
  let min = 0;
  if (h.max > max) max = h.max;
  if (h.min < min) min = h.min;
  if (l.max > max) max = l.max;
  if (l.min < min) min = l.min;
  return { ripple: max - min, average: s.average, yStart: s.yStart, above: max - s.meanOffset, below: s.meanOffset - min };
}

// src/engine/modal/stepError.ts
function steadyError(target) {
  const { meanOffset } = target;
  const high = { offset: target.high.offset - meanOffset, gain: target.high.gain, rate: target.high.rate, length: target.high.length };
  const low = { offset: target.low.offset - meanOffset, gain: target.low.gain, rate: target.low.rate, length: target.low.length };
  const eh = curveExtrema(high);
  const el = curveExtrema(low);
  return { high, low, above: Math.max(eh.max, el.max), below: Math.min(eh.min, el.min) };
}
function stepError(m, target, source, ss) {
  if (!m.symmetric) throw new RangeError("stepError: the period map needs a follower-free ladder (orthogonal mix)");
  const { n, period, hi, lo, mix } = m;
  const { t1, t2 } = target;
  const ssHigh = ss.high;
  const ssLow = ss.low;
  const e0 = zeros2(n);
  let moved = false;
  for (let i = 0; i < n; i++) {
    e0[i] = source.start[i] - target.start[i];
    if (e0[i] !== 0) moved = true;
  }
  if (!moved) return null;
  const kh = zeros2(n);
  const half = zeros2(n);
  const kl = zeros2(n);
  const elow = zeros2(n);
  for (let i = 0; i < n; i++) {
    kh[i] = -Math.expm1(hi.rate[i] * t1);
    half[i] = Math.exp(0.5 * hi.rate[i] * t1);
    kl[i] = -Math.expm1(lo.rate[i] * t2);
    elow[i] = Math.exp(lo.rate[i] * t2);
  }
  const N = zeros2(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[k * n + i] * kl[k] * mix[k * n + j];
      N[i * n + j] = -(half[i] * s * half[j] + (i === j ? kh[i] : 0));
    }
  }
  const { values: nu, vectors: Z } = symmetricEigen2(N, n, { vectors: true });
  const logMu = zeros2(n);
  for (let j = 0; j < n; j++) logMu[j] = nu[j] > -1 ? Math.log1p(nu[j]) : -Infinity;
  const highWeights = (w, out) => {
    for (let i = 0; i < n; i++) out[i] = hi.out[i] * w[i];
  };
  const lowWeights = (w, out) => {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * half[k] * w[k];
      out[i] = lo.out[i] * s;
    }
  };
  const zeta = zeros2(n);
  const etaHigh = zeros2(n * n);
  const etaLow = zeros2(n * n);
  const bound = zeros2(n);
  const lead = zeros2(n);
  const r = zeros2(n);
  const xr = zeros2(n);
  const wh = zeros2(n);
  const wl = zeros2(n);
  for (let j = 0; j < n; j++) {
    let z = 0;
    for (let i = 0; i < n; i++) z += half[i] * Z[i * n + j] * e0[i];
    zeta[j] = z;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * Z[k * n + j];
      xr[i] = elow[i] * s;
    }
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[k * n + i] * xr[k];
      r[i] = s;
    }
    highWeights(r, wh);
    lowWeights(r, wl);
    let sumHigh = 0;
    let sumLow = 0;
    let sum = 0;
    for (let i = 0; i < n; i++) {
      etaHigh[j * n + i] = wh[i];
      etaLow[j * n + i] = wl[i];
      sumHigh += Math.abs(wh[i]);
      sumLow += Math.abs(wl[i]);
      sum += wh[i];
    }
    bound[j] = Math.max(sumHigh, sumLow);
    lead[j] = sum;
  }
  const errHigh = { offset: 0, gain: zeros2(n), rate: hi.rate, length: t1 };
  const errLow = { offset: 0, gain: zeros2(n), rate: lo.rate, length: t2 };
  const bh = zeros2(n);
  const bl = zeros2(n);
  const fillHigh = () => {
    let o = ssHigh.offset;
    for (let i = 0; i < n; i++) {
      errHigh.gain[i] = ssHigh.gain[i] + bh[i];
      o += bh[i];
    }
    errHigh.offset = o;
  };
  const fillLow = () => {
    let o = ssLow.offset;
    for (let i = 0; i < n; i++) {
      errLow.gain[i] = ssLow.gain[i] + bl[i];
      o += bl[i];
    }
    errLow.offset = o;
  };
  return {
    n,
    zeta,
    logMu,
    bound,
    lead,
    power: (j, k) => k === 1 ? 1 : Math.exp((k - 1) * logMu[j]),
    setFirstPeriod: () => {
      highWeights(e0, bh);
      lowWeights(e0, bl);
    },
    setModes: (c) => {
      for (let i = 0; i < n; i++) {
        let h = 0;
        let l = 0;
        for (let j = 0; j < n; j++) {
          h += c[j] * etaHigh[j * n + i];
          l += c[j] * etaLow[j * n + i];
        }
        bh[i] = h;
        bl[i] = l;
      }
    },
    // the low phase first: in a violating period it is usually the one that leaves
    leaves: (band, slack) => {
      fillLow();
      const xl = curveExtrema(errLow);
      if (xl.max + slack > band || xl.min - slack < -band) return true;
      fillHigh();
      const xh = curveExtrema(errHigh);
      return xh.max + slack > band || xh.min - slack < -band;
    },
    lastExit: (k, band) => {
      fillLow();
      const inLow = curveLastExit(errLow, band, period);
      if (inLow >= 0) return k * period + t1 + inLow;
      fillHigh();
      const inHigh = curveLastExit(errHigh, band, period);
      return k * period + Math.max(inHigh, 0);
    }
  };
}
function curveLastExit(c, band, period) {
  if (!(c.length > 0)) return -1;
  const ends = [0, ...curveTurningPoints(c), c.length];
  const values = ends.map((t) => curveValue(c, t));
  for (let k = ends.length - 1; k > 0; k--) {
    const va = values[k - 1];
    const vb = values[k];
    if (Math.abs(vb) > band) return ends[k];
    if (Math.abs(va) > band) {
      const level = va > 0 ? band : -band;
      return brentRoot2((t) => curveValue(c, t) - level, ends[k - 1], ends[k], 1e-12 * period);
    }
  }
  return -1;
}

// src/engine/modal/settlingLowerBound.ts
var MAX_PERIODS2 = 2 ** 52;
function settlingLowerBound(m, from2, to2, band, source = periodicState(m, from2), target = periodicState(m, to2)) {
  if (!m.symmetric) throw new RangeError("settlingLowerBound: follower-free ladders only");
  const ss = steadyError(target);
  if (ss.above > band || ss.below < -band) return Infinity;
  const err = stepError(m, target, source, ss);
  if (err === null) return 0;
  const { n } = m;
  const { zeta, logMu, lead, power } = err;
  const margin = band - Math.max(ss.above, -ss.below, 0);
  const coef = zeros2(n);
  const setPeriod = (k) => {
    if (k === 0) {
      err.setFirstPeriod();
      return;
    }
    for (let j = 0; j < n; j++) coef[j] = zeta[j] * power(j, k);
    err.setModes(coef);
  };
  const leaves = (k) => {
    setPeriod(k);
    return err.leaves(band, 0);
  };
  let slow = 0;
  for (let j = 1; j < n; j++) if (logMu[j] > logMu[slow]) slow = j;
  const slowOut = lead[slow] * zeta[slow];
  let kEst = 0;
  if (Math.abs(slowOut) > margin && logMu[slow] < 0) {
    kEst = Math.min(MAX_PERIODS2, Math.max(0, Math.floor(1 + Math.log(margin / Math.abs(slowOut)) / logMu[slow])));
  }
  let kv = -1;
  let kn = MAX_PERIODS2;
  if (leaves(kEst)) {
    kv = kEst;
    for (let step = 1; ; step *= 2) {
      const k = kv + step;
      if (k >= MAX_PERIODS2) break;
      if (leaves(k)) kv = k;
      else {
        kn = k;
        break;
      }
    }
  } else {
    kn = kEst;
    for (let step = 1; kn > 0; step *= 2) {
      const k = Math.max(0, kn - step);
      if (leaves(k)) {
        kv = k;
        break;
      }
      kn = k;
    }
  }
  if (kv < 0) return 0;
  while (kn - kv > 1) {
    const mid = Math.floor((kv + kn) / 2);
    if (leaves(mid)) kv = mid;
    else kn = mid;
  }
  setPeriod(kv);
  return err.lastExit(kv, band);
}

// src/project/loadProject.ts
import { readFileSync, statSync } from "node:fs";

// src/project/firstInvalidUtf8.ts
function firstInvalidUtf8(bytes) {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    let length;
    let low = 128;
    let high = 191;
    if (b < 128) length = 1;
    else if (b >= 194 && b <= 223) length = 2;
    else if (b >= 224 && b <= 239) {
      length = 3;
      if (b === 224) low = 160;
      if (b === 237) high = 159;
    } else if (b >= 240 && b <= 244) {
      length = 4;
      if (b === 240) low = 144;
      if (b === 244) high = 143;
    } else return i;
    for (let k = 1; k < length; k++) {
      const c = bytes[i + k];
      if (c === void 0) return i;
      const [lo, hi] = k === 1 ? [low, high] : [128, 191];
      if (c < lo || c > hi) return i + k;
    }
    i += length;
  }
  return -1;
}

// src/project/locate.ts
import { isAlias, isMap, isScalar, isSeq } from "yaml";
function startOf(node) {
  const range = node?.range;
  return range ? range[0] : void 0;
}
function locate(doc, lineCounter, path, at = "value") {
  let node = doc.contents;
  let offset = startOf(node) ?? 0;
  for (let i = 0; i < path.length; i++) {
    const segment = path[i];
    const last = i === path.length - 1;
    if (isMap(node)) {
      const pair = node.items.find((p2) => isScalar(p2.key) && String(p2.key.value) === String(segment));
      if (!pair) break;
      const keyStart = startOf(pair.key);
      const valueStart = isScalar(pair.value) && pair.value.value === null ? void 0 : startOf(pair.value);
      offset = last && at === "key" || !last ? keyStart ?? offset : valueStart ?? keyStart ?? offset;
      node = pair.value;
    } else if (isSeq(node) && typeof segment === "number" && segment < node.items.length) {
      node = node.items[segment];
      offset = startOf(node) ?? offset;
    } else {
      break;
    }
    if (isAlias(node)) {
      offset = startOf(node) ?? offset;
      break;
    }
  }
  const { line, col } = lineCounter.linePos(offset);
  return { line, column: col };
}

// src/project/keyPath.ts
var MAX_KEY_PATH_LENGTH = 80;
function formatKeyPath(segments) {
  let text = "";
  for (const segment of segments) {
    if (typeof segment === "number") text += `[${segment}]`;
    else {
      const name = /[\u0000-\u001f\u007f]/.test(segment) ? JSON.stringify(segment).slice(1, -1) : segment;
      text += text === "" ? name : `.${name}`;
    }
  }
  if (text.length <= MAX_KEY_PATH_LENGTH) return text;
  const keep3 = (MAX_KEY_PATH_LENGTH - 3) / 2;
  return `${text.slice(0, Math.ceil(keep3))}...${text.slice(text.length - Math.floor(keep3))}`;
}

// src/units/parseQuantity.ts
import { create, unitDependencies } from "mathjs";

// src/units/dimension.ts
var DIMENSIONS = {
  resistance: { phrase: "a resistance", unit: "ohm", mathjsUnit: "ohm", codeSuffixes: ["ohm"], example: "'10 kohm', '10k' or '4k7'" },
  capacitance: { phrase: "a capacitance", unit: "F", mathjsUnit: "F", codeSuffixes: ["F"], example: "'100 nF', '100n' or '4u7'" },
  voltage: { phrase: "a voltage", unit: "V", mathjsUnit: "V", codeSuffixes: ["V"], example: "'3.3 V', '500 mV' or '3V3'" },
  frequency: { phrase: "a frequency", unit: "Hz", mathjsUnit: "Hz", codeSuffixes: ["Hz"], example: "'20 kHz' or '20k'" },
  time: { phrase: "a time", unit: "s", mathjsUnit: "s", codeSuffixes: ["s"], example: "'20 ms' or '20m'" },
  current: { phrase: "a current", unit: "A", mathjsUnit: "A", codeSuffixes: ["A"], example: "'10 mA' or '10m'" },
  fraction: { phrase: "a fraction", unit: "0 to 1, or %", mathjsUnit: "", codeSuffixes: [], example: "'5 %' or 0.05" }
};
function describeDimension(dimension) {
  const info = DIMENSIONS[dimension];
  return `${info.phrase} (${info.unit})`;
}

// src/units/inputError.ts
var InputError = class extends Error {
  constructor(detail, key, file) {
    super([file, key, detail].filter((part) => part !== void 0 && part !== "").join(": "));
    this.key = key;
    this.file = file;
    this.detail = detail;
  }
  key;
  file;
  name = "InputError";
  /** The message without the file and key in front. */
  detail;
};

// src/units/quantityError.ts
var QuantityError = class extends InputError {
  constructor(message, input, expected) {
    super(message);
    this.input = input;
    this.expected = expected;
  }
  input;
  expected;
  name = "QuantityError";
};

// src/units/siPrefixes.ts
var PREFIX_BY_EXPONENT = {
  [-30]: "q",
  [-27]: "r",
  [-24]: "y",
  [-21]: "z",
  [-18]: "a",
  [-15]: "f",
  [-12]: "p",
  [-9]: "n",
  [-6]: "\xB5",
  [-3]: "m",
  0: "",
  3: "k",
  6: "M",
  9: "G",
  12: "T",
  15: "P",
  18: "E",
  21: "Z",
  24: "Y",
  27: "R",
  30: "Q"
};
var SHORTHAND_PREFIX_EXPONENT = {
  p: -12,
  n: -9,
  u: -6,
  "\xB5": -6,
  "\u03BC": -6,
  m: -3,
  k: 3,
  K: 3,
  M: 6,
  G: 9,
  T: 12
};

// src/units/parseQuantity.ts
var NUMBER = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
var PLAIN_NUMBER = new RegExp(`^${NUMBER}$`);
var PERCENT = new RegExp(`^(${NUMBER})\\s*%$`);
var RESISTANCE_CODE = /^[+-]?\d*[Rr]\d*(?:ohm)?$/;
var VOLTAGE_CODE = /^[+-]?\d*V\d*$/;
var NOT_FINITE = /^[+-]?(?:\.?inf(?:inity)?|\.?nan)$/i;
var math;
function mathjs() {
  math ??= create({ unitDependencies });
  return math;
}
function parseQuantity(input, expected, opts = {}) {
  const value = readValue(input, expected);
  if (!Number.isFinite(value)) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got ${quoted(input)}, which is not a finite number`, input, expected);
  }
  if (expected === "fraction" && (value < 0 || value > 1)) {
    const hint = typeof input === "number" || PLAIN_NUMBER.test(String(input).trim()) ? value > 1 && value <= 100 ? `; write '${value} %' if you mean ${value} percent` : "" : "";
    throw new QuantityError(`expected a fraction from 0 to 1 or a percentage from 0 % to 100 %, got ${quoted(input)}${hint}`, input, expected);
  }
  if (opts.sign === "positive" && !(value > 0)) {
    throw new QuantityError(`expected ${describeDimension(expected)} greater than 0, got ${quoted(input)}`, input, expected);
  }
  if (opts.sign === "nonNegative" && !(value >= 0)) {
    throw new QuantityError(`expected ${describeDimension(expected)} of 0 or more, got ${quoted(input)}`, input, expected);
  }
  return value === 0 ? 0 : value;
}
function readValue(input, expected) {
  if (typeof input === "number") return input;
  if (typeof input !== "string") {
    throw new QuantityError(`expected ${describeDimension(expected)}, got ${JSON.stringify(input) ?? String(input)}`, String(input), expected);
  }
  const text = normalizeSymbols(input.trim());
  if (text === "") {
    throw new QuantityError(`expected ${describeDimension(expected)}, got an empty value`, input, expected);
  }
  if (PLAIN_NUMBER.test(text)) return Number(text);
  if (NOT_FINITE.test(text)) return NaN;
  const percent2 = PERCENT.exec(text);
  if (expected === "fraction") {
    if (percent2) return roundNoise(Number(percent2[1]) / 100);
    throw wrongOrUnreadable(input, text, expected);
  }
  if (percent2) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got '${input}' (a percentage)`, input, expected);
  }
  const coded = readShorthandOrCode(text, expected);
  if (coded !== void 0) return coded;
  return readWithUnit(input, text, expected);
}
function normalizeSymbols(text) {
  return text.replace(/[\u00b5\u03bc]/g, "u").replace(/[\u03a9\u2126]/g, "ohm").replace(/ohms?$/i, "ohm");
}
var codeForms = /* @__PURE__ */ new Map();
function formsFor(expected) {
  let forms = codeForms.get(expected);
  if (!forms) {
    const markers = Object.keys(SHORTHAND_PREFIX_EXPONENT).filter((m) => m !== "\xB5" && m !== "\u03BC");
    if (expected === "resistance") markers.push("R", "r");
    if (expected === "voltage") markers.push("V");
    if (expected === "capacitance") markers.push("F");
    const marker = `[${markers.join("")}]`;
    const unit = DIMENSIONS[expected].codeSuffixes.join("|");
    forms = {
      shorthand: new RegExp(`^(${NUMBER})\\s*(${marker})(?:\\s*(?:${unit}))?$`),
      bareUnit: new RegExp(`^(${NUMBER})\\s*(?:${unit})$`),
      code: new RegExp(`^([+-]?)(\\d*)(${marker})(\\d+)(?:\\s*(?:${unit}))?$`)
    };
    codeForms.set(expected, forms);
  }
  return forms;
}
function readShorthandOrCode(text, expected) {
  const forms = formsFor(expected);
  const shorthand = forms.shorthand.exec(text);
  if (shorthand) return scaled2(shorthand[1], markerExponent(shorthand[2]));
  const bare = forms.bareUnit.exec(text);
  if (bare) return roundNoise(Number(bare[1]));
  const code = forms.code.exec(text);
  if (code) return scaled2(`${code[1]}${code[2] || "0"}.${code[4]}`, markerExponent(code[3]));
  return void 0;
}
function markerExponent(marker) {
  return marker === "R" || marker === "r" || marker === "V" || marker === "F" ? 0 : SHORTHAND_PREFIX_EXPONENT[marker];
}
function scaled2(decimal, exponent) {
  return roundNoise(Number(decimal) * 10 ** exponent);
}
function roundNoise(value) {
  return Number.isFinite(value) ? Number(value.toPrecision(15)) : value;
}
function readWithUnit(input, text, expected) {
  let unit;
  try {
    unit = mathjs().unit(text);
  } catch {
    throw wrongOrUnreadable(input, text, expected);
  }
  const reference = mathjs().unit(DIMENSIONS[expected].mathjsUnit);
  if (unit.value === null || unit.value === void 0) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got '${input}', a unit without a number`, input, expected);
  }
  if (!unit.equalBase(reference)) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got '${input}' (${dimensionOfUnit(unit)})`, input, expected);
  }
  return roundNoise(Number(unit.value));
}
function wrongOrUnreadable(input, text, expected) {
  let other;
  if (expected !== "resistance" && RESISTANCE_CODE.test(text)) other = DIMENSIONS.resistance.phrase;
  else if (expected !== "voltage" && VOLTAGE_CODE.test(text)) other = DIMENSIONS.voltage.phrase;
  else if (expected === "fraction") {
    try {
      other = dimensionOfUnit(mathjs().unit(text));
    } catch {
      other = void 0;
    }
  }
  if (other) return new QuantityError(`expected ${describeDimension(expected)}, got '${input}' (${other})`, input, expected);
  const comma = /\d,\d/.test(text) ? "; use a point as the decimal marker" : "";
  return new QuantityError(
    `expected ${describeDimension(expected)} such as ${DIMENSIONS[expected].example}, got '${input}'${comma}`,
    input,
    expected
  );
}
function dimensionOfUnit(unit) {
  for (const [name, info] of Object.entries(DIMENSIONS)) {
    if (name !== "fraction" && unit.equalBase(mathjs().unit(info.mathjsUnit))) return info.phrase;
  }
  const units = unit.formatUnits();
  return units ? `a quantity in ${units}` : "a plain number";
}
function quoted(input) {
  return typeof input === "string" ? `'${input}'` : String(input);
}

// src/units/roundSignificant.ts
function roundSignificant(value, digits) {
  const [mantissa, exponentText] = value.toExponential().split("e");
  let exponent = Number(exponentText);
  const all = mantissa.replace(".", "");
  let figures = all.slice(0, digits).padEnd(digits, "0");
  if (all.length > digits && all[digits] >= "5") {
    const carried = (BigInt(figures) + 1n).toString();
    if (carried.length > digits) {
      exponent += 1;
      figures = carried.slice(0, digits);
    } else {
      figures = carried.padStart(digits, "0");
    }
  }
  return { figures, exponent };
}

// src/units/formatEng.ts
function formatEng(value, unit, digits = 3) {
  if (!Number.isInteger(digits) || digits < 1 || digits > 21) {
    throw new RangeError(`formatEng: digits must be a whole number from 1 to 21, got ${digits}`);
  }
  const join = (number2, prefix2) => unit === "" ? `${number2}${prefix2}` : `${number2} ${prefix2}${unit}`;
  if (Number.isNaN(value)) return join("NaN", "");
  if (!Number.isFinite(value)) return join(value > 0 ? "\u221E" : "-\u221E", "");
  if (value === 0) return join("0", "");
  const sign = value < 0 ? "-" : "";
  const { figures, exponent } = roundSignificant(Math.abs(value), digits);
  const engExponent = Math.floor(exponent / 3) * 3;
  const integerDigits = exponent - engExponent + 1;
  const padded = figures.padEnd(integerDigits, "0");
  const fraction = padded.slice(integerDigits).replace(/0+$/, "");
  const number = `${sign}${padded.slice(0, integerDigits)}${fraction ? `.${fraction}` : ""}`;
  const prefix = PREFIX_BY_EXPONENT[engExponent];
  if (prefix === void 0) return join(`${number}e${engExponent}`, "");
  return join(number, prefix);
}

// src/units/eSeries.ts
var E_SERIES_NAMES = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"];
var E24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];
var E192 = [
  100,
  101,
  102,
  104,
  105,
  106,
  107,
  109,
  110,
  111,
  113,
  114,
  115,
  117,
  118,
  120,
  121,
  123,
  124,
  126,
  127,
  129,
  130,
  132,
  133,
  135,
  137,
  138,
  140,
  142,
  143,
  145,
  147,
  149,
  150,
  152,
  154,
  156,
  158,
  160,
  162,
  164,
  165,
  167,
  169,
  172,
  174,
  176,
  178,
  180,
  182,
  184,
  187,
  189,
  191,
  193,
  196,
  198,
  200,
  203,
  205,
  208,
  210,
  213,
  215,
  218,
  221,
  223,
  226,
  229,
  232,
  234,
  237,
  240,
  243,
  246,
  249,
  252,
  255,
  258,
  261,
  264,
  267,
  271,
  274,
  277,
  280,
  284,
  287,
  291,
  294,
  298,
  301,
  305,
  309,
  312,
  316,
  320,
  324,
  328,
  332,
  336,
  340,
  344,
  348,
  352,
  357,
  361,
  365,
  370,
  374,
  379,
  383,
  388,
  392,
  397,
  402,
  407,
  412,
  417,
  422,
  427,
  432,
  437,
  442,
  448,
  453,
  459,
  464,
  470,
  475,
  481,
  487,
  493,
  499,
  505,
  511,
  517,
  523,
  530,
  536,
  542,
  549,
  556,
  562,
  569,
  576,
  583,
  590,
  597,
  604,
  612,
  619,
  626,
  634,
  642,
  649,
  657,
  665,
  673,
  681,
  690,
  698,
  706,
  715,
  723,
  732,
  741,
  750,
  759,
  768,
  777,
  787,
  796,
  806,
  816,
  825,
  835,
  845,
  856,
  866,
  876,
  887,
  898,
  909,
  920,
  931,
  942,
  953,
  965,
  976,
  988
];
var E96 = [
  100,
  102,
  105,
  107,
  110,
  113,
  115,
  118,
  121,
  124,
  127,
  130,
  133,
  137,
  140,
  143,
  147,
  150,
  154,
  158,
  162,
  165,
  169,
  174,
  178,
  182,
  187,
  191,
  196,
  200,
  205,
  210,
  215,
  221,
  226,
  232,
  237,
  243,
  249,
  255,
  261,
  267,
  274,
  280,
  287,
  294,
  301,
  309,
  316,
  324,
  332,
  340,
  348,
  357,
  365,
  374,
  383,
  392,
  402,
  412,
  422,
  432,
  442,
  453,
  464,
  475,
  487,
  499,
  511,
  523,
  536,
  549,
  562,
  576,
  590,
  604,
  619,
  634,
  649,
  665,
  681,
  698,
  715,
  732,
  750,
  768,
  787,
  806,
  825,
  845,
  866,
  887,
  909,
  931,
  953,
  976
];
var E48 = [
  100,
  105,
  110,
  115,
  121,
  127,
  133,
  140,
  147,
  154,
  162,
  169,
  178,
  187,
  196,
  205,
  215,
  226,
  237,
  249,
  261,
  274,
  287,
  301,
  316,
  332,
  348,
  365,
  383,
  402,
  422,
  442,
  464,
  487,
  511,
  536,
  562,
  590,
  619,
  649,
  681,
  715,
  750,
  787,
  825,
  866,
  909,
  953
];
var E_SERIES = {
  E3: [10, 22, 47],
  E6: [10, 15, 22, 33, 47, 68],
  E12: [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82],
  E24,
  E48,
  E96,
  E192
};
function figuresOf(series) {
  return E_SERIES[series][0] >= 100 ? 3 : 2;
}
function valueOf(figures, count, decade) {
  return Number(`${figures}e${decade - count + 1}`);
}
function decadeOf(value) {
  return Number(value.toExponential().split("e")[1]);
}
function seriesValues(series, min, max) {
  const table = E_SERIES[series];
  if (!table) throw new RangeError(`unknown series '${series}'; expected one of ${E_SERIES_NAMES.join(", ")}`);
  if (!(Number.isFinite(min) && Number.isFinite(max) && min > 0 && max >= min)) {
    throw new RangeError(`seriesValues: need 0 < min <= max, got min ${min}, max ${max}`);
  }
  const count = figuresOf(series);
  const low = min * (1 - 1e-9);
  const high = max * (1 + 1e-9);
  const values = [];
  for (let decade = decadeOf(min) - 1; decade <= decadeOf(max); decade++) {
    for (const figures of table) {
      const value = valueOf(figures, count, decade);
      if (value >= low && value <= high) values.push(value);
    }
  }
  return values;
}

// src/project/agreesAsWritten.ts
function agreesAsWritten(written, value, computed) {
  if (Math.abs(value - computed) <= 1e-6 * Math.abs(computed)) return true;
  const digits = significantDigitsWritten(written);
  return value.toPrecision(digits) === computed.toPrecision(digits);
}
function significantDigitsWritten(written) {
  const text = typeof written === "number" ? String(written).replace(/e.*$/i, "") : written.trim();
  const match = /^[+-]?(\d*)(?:\.|[RrpnumkKMGTVF\u00b5\u03bc](?=\d))?(\d*)/.exec(text);
  const digits = `${match?.[1] ?? ""}${match?.[2] ?? ""}`.replace(/^0+/, "");
  return Math.min(21, Math.max(1, digits.length));
}

// src/project/derivePwmFrequency.ts
function derivePwmFrequency(timer) {
  const { clock, bits, prescaler = 1, alignment = "edge" } = timer;
  if (!(clock > 0 && Number.isFinite(clock)) || !Number.isInteger(bits) || bits < 1 || !Number.isInteger(prescaler) || prescaler < 1) {
    throw new RangeError(`derivePwmFrequency: need clock > 0, whole bits >= 1 and prescaler >= 1, got ${clock}, ${bits}, ${prescaler}`);
  }
  const counts = prescaler * 2 ** bits * (alignment === "center" ? 2 : 1);
  return clock / counts;
}

// src/project/parseSpecLevel.ts
var NUMBER2 = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
var IN_LSB = new RegExp(`^(${NUMBER2})\\s*LSBs?$`, "i");
var IN_PERCENT = new RegExp(`^(${NUMBER2})\\s*%$`);
var VOLTAGE_PHRASE = "expected a voltage (V)";
var LEVEL_PHRASE = "expected a level in V, mV, LSB or % of full scale";
function parseSpecLevel(input, scale) {
  const text = typeof input === "string" ? input.trim() : "";
  let level;
  const lsb = IN_LSB.exec(text);
  const percent2 = IN_PERCENT.exec(text);
  if (lsb) {
    if (scale.lsb === void 0) {
      throw new QuantityError(
        `'${input}' needs pwm.bits: one LSB is (high - low) / 2^bits; give pwm.bits or write the limit in V or %`,
        input,
        "voltage"
      );
    }
    level = { volts: Number(lsb[1]) * scale.lsb, lsb: Number(lsb[1]) };
  } else if (percent2) {
    level = { volts: Number(percent2[1]) / 100 * scale.fullScale };
  } else {
    try {
      level = { volts: parseQuantity(input, "voltage") };
    } catch (error) {
      if (error instanceof QuantityError && error.message.startsWith(VOLTAGE_PHRASE)) {
        throw new QuantityError(LEVEL_PHRASE + error.message.slice(VOLTAGE_PHRASE.length), input, "voltage");
      }
      throw error;
    }
  }
  if (!(level.volts > 0) || !Number.isFinite(level.volts)) {
    const shown = typeof input === "string" ? `'${input}'` : String(input);
    throw new QuantityError(`a limit must be greater than 0, got ${shown}`, input, "voltage");
  }
  return level;
}

// src/project/normalizeProject.ts
var DEFAULT_GAIN_LIMIT = 0.02;
var DEFAULT_SEARCH_MARGIN = 0.1;
var percent = (fraction) => `${Number((fraction * 100).toPrecision(6))} %`;
var Reader = class {
  constructor(root) {
    this.root = root;
  }
  root;
  issues = [];
  raw(path) {
    let node = this.root;
    for (const segment of path) {
      if (node === null || typeof node !== "object") return void 0;
      node = node[segment];
    }
    return node;
  }
  has(path) {
    return this.raw(path) !== void 0 && this.raw(path) !== null;
  }
  fail(path, message, at = "value") {
    this.issues.push({ path, message, at });
  }
  /** The quantity at `path` in SI, undefined when absent or wrong (then an issue is recorded). */
  quantity(path, dimension, opts) {
    const value = this.raw(path);
    if (value === void 0 || value === null) return void 0;
    try {
      return parseQuantity(value, dimension, opts);
    } catch (error) {
      if (!(error instanceof QuantityError)) throw error;
      this.fail(path, error.message);
      return void 0;
    }
  }
  level(path, scale) {
    const value = this.raw(path);
    if (value === void 0 || value === null) return void 0;
    try {
      return parseSpecLevel(value, scale);
    } catch (error) {
      if (!(error instanceof QuantityError)) throw error;
      this.fail(path, error.message);
      return void 0;
    }
  }
  /** {min, max} with min <= max (or < when `strict`). */
  range(path, dimension, unit, opts, strict) {
    const min = this.quantity([...path, "min"], dimension, opts);
    const max = this.quantity([...path, "max"], dimension, opts);
    if (min === void 0 || max === void 0) return void 0;
    if (strict ? !(min < max) : !(min <= max)) {
      this.fail([...path, "min"], `min (${formatEng(min, unit)}) must be ${strict ? "below" : "at most"} max (${formatEng(max, unit)})`);
      return void 0;
    }
    return { min, max };
  }
  /** A relative tolerance: a fraction below 1 (100 %). */
  tolerance(path) {
    const value = this.quantity(path, "fraction");
    if (value !== void 0 && value >= 1) {
      this.fail(path, `a tolerance must be below 100 %, got '${String(this.raw(path))}'`);
      return void 0;
    }
    return value;
  }
};
function normalizeProject(data, file) {
  const read = new Reader(data);
  const pwm = readPwm(read);
  const load = readLoad(read);
  const filter = readStages(read);
  const second = readSecondPwm(read, pwm);
  const fineBits = second?.role === "fine" && second.bits !== null ? second.bits : 0;
  const lsb = pwm && pwm.bits !== void 0 ? (pwm.high - pwm.low) / 2 ** (pwm.bits + fineBits) : void 0;
  const { spec, specInLsb } = readSpec(read, pwm, lsb);
  const search = read.has(["search"]) ? readSearch(read, pwm) : void 0;
  const tolerance = read.has(["tolerance"]) ? readTolerance(read, pwm) : void 0;
  const stageCount = filter?.all.length ?? 0;
  const overrides = tolerance?.stages?.length ?? 0;
  if (stageCount > 0 && overrides > stageCount) {
    read.fail(
      ["tolerance", "stages", stageCount],
      `the filter has ${stageCount} stage${stageCount > 1 ? "s" : ""}, so this override has no stage to apply to; remove it or add the stage`,
      "key"
    );
  }
  if (read.issues.length > 0 || !pwm || !filter || second === void 0) return { issues: read.issues };
  const network = second !== null || filter.all.some((s) => s.kind !== "rc") ? { stages: filter.all, second } : void 0;
  const project = {
    file,
    pwm,
    load,
    filter: { stages: filter.rc },
    ...network && { network },
    spec,
    ...search && { search },
    ...tolerance && { tolerance },
    ...lsb !== void 0 && { lsb },
    ...Object.keys(specInLsb).length > 0 && { specInLsb }
  };
  return { project, issues: [] };
}
function readPwm(read) {
  const high = read.quantity(["pwm", "high"], "voltage");
  const low = read.quantity(["pwm", "low"], "voltage") ?? (read.has(["pwm", "low"]) ? void 0 : 0);
  if (high !== void 0 && low !== void 0 && !(high > low)) {
    read.fail(["pwm", "high"], `the high level (${formatEng(high, "V")}) must be above the low level (${formatEng(low, "V")})`);
  }
  const driver = readDriver(read, ["pwm", "driver"], { high: 0, low: 0 });
  const dutyMin = read.has(["pwm", "duty", "min"]) ? read.quantity(["pwm", "duty", "min"], "fraction") : 0;
  const dutyMax = read.has(["pwm", "duty", "max"]) ? read.quantity(["pwm", "duty", "max"], "fraction") : 1;
  if (dutyMin !== void 0 && dutyMax !== void 0 && !(dutyMin < dutyMax)) {
    read.fail(["pwm", "duty", "min"], `min (${percent(dutyMin)}) must be below max (${percent(dutyMax)})`);
  }
  const bits = read.raw(["pwm", "bits"]);
  const prescaler = read.raw(["pwm", "prescaler"]) ?? 1;
  const alignment = read.raw(["pwm", "alignment"]) ?? "edge";
  const clock = read.quantity(["pwm", "clock"], "frequency", { sign: "positive" });
  const given = read.quantity(["pwm", "frequency"], "frequency", { sign: "positive" });
  let frequency = given;
  if (clock !== void 0 && bits !== void 0) {
    const derived = derivePwmFrequency({ clock, bits, prescaler, alignment });
    const written = read.raw(["pwm", "frequency"]);
    if (given !== void 0 && written !== void 0 && !agreesAsWritten(written, given, derived)) {
      read.fail(
        ["pwm", "frequency"],
        `${formatEng(given, "Hz", 6)} does not match the timer: clock / (${alignment === "center" ? "2 * " : ""}prescaler * 2^bits) = ${formatEng(clock, "Hz", 6)} / (${alignment === "center" ? "2 * " : ""}${prescaler} * 2^${bits}) = ${formatEng(derived, "Hz", 6)}; correct one of them, or give only one`
      );
    }
    frequency = derived;
  } else if (given === void 0 && !read.has(["pwm", "frequency"])) {
    const message = read.has(["pwm", "clock"]) ? "missing; with pwm.clock, give pwm.bits (and pwm.prescaler) so that the frequency follows, or give pwm.frequency" : "missing; give pwm.frequency (e.g. '19.5 kHz'), or pwm.clock and pwm.bits (and pwm.prescaler)";
    read.fail(["pwm", "frequency"], message, "key");
  }
  if (high === void 0 || low === void 0 || !(high > low) || !driver || frequency === void 0) return void 0;
  if (dutyMin === void 0 || dutyMax === void 0 || !(dutyMin < dutyMax)) return void 0;
  return {
    frequency,
    ...clock !== void 0 && { clock },
    ...bits !== void 0 && { bits },
    prescaler,
    alignment,
    high,
    low,
    driver,
    duty: { min: dutyMin, max: dutyMax }
  };
}
function readDriver(read, path, fallback) {
  const raw = read.raw(path);
  if (raw !== null && typeof raw === "object") {
    const high = read.quantity([...path, "high"], "resistance", { sign: "nonNegative" });
    const low = read.quantity([...path, "low"], "resistance", { sign: "nonNegative" });
    return high !== void 0 && low !== void 0 ? { high, low } : void 0;
  }
  if (raw === void 0 || raw === null) return { ...fallback };
  const both = read.quantity(path, "resistance", { sign: "nonNegative" });
  return both !== void 0 ? { high: both, low: both } : void 0;
}
function readLoad(read) {
  const resistance = read.quantity(["load", "resistance"], "resistance", { sign: "positive" });
  const capacitance = read.quantity(["load", "capacitance"], "capacitance", { sign: "nonNegative" }) ?? 0;
  return { ...resistance !== void 0 && { resistance }, capacitance };
}
var RC_KEYS = ["r", "c"];
var SALLEN_KEY_KEYS = ["r1", "r2", "c1", "c2"];
var PART_OF = {
  r: "series resistor of the RC stage",
  c: "capacitor from the node of the RC stage to ground",
  r1: "resistor from the previous node to the middle node",
  r2: "resistor from the middle node to the op-amp input",
  c1: "capacitor from the middle node to the op-amp output",
  c2: "capacitor from the op-amp input to ground"
};
function readStages(read) {
  const list = read.raw(["filter", "stages"]);
  if (!Array.isArray(list)) {
    if (!read.has(["search"])) {
      read.fail(["filter"], "missing; give filter.stages (1 to 4 RC stages), or a search section to design a filter", "key");
      return void 0;
    }
    return { all: [], rc: [] };
  }
  const all = [];
  let complete = true;
  list.forEach((_, i) => {
    const at = (key) => ["filter", "stages", i, key];
    const part = (key, dimension) => {
      if (!read.has(at(key))) {
        read.fail(at(key), `missing; ${PART_OF[key]}, e.g. '${dimension === "resistance" ? "10k" : "100n"}'`, "key");
        return void 0;
      }
      return read.quantity(at(key), dimension, { sign: "positive" });
    };
    const dimensionOf = (key) => key.startsWith("r") ? "resistance" : "capacitance";
    if (read.has(at("active"))) {
      for (const key of RC_KEYS) {
        if (read.has(at(key))) read.fail(at(key), `'${key}' belongs to an RC stage; an active (sallen-key) stage takes r1, r2, c1 and c2`, "key");
      }
      if (read.has(at("buffered"))) {
        read.fail(
          at("buffered"),
          "not allowed on an active stage: its output is already an op-amp output, which nothing after it loads; remove 'buffered'",
          "key"
        );
      }
      const [r1, r2, c1, c2] = SALLEN_KEY_KEYS.map((key) => part(key, dimensionOf(key)));
      if (r1 === void 0 || r2 === void 0 || c1 === void 0 || c2 === void 0) complete = false;
      else all.push({ kind: "sallen-key", r1, r2, c1, c2 });
      return;
    }
    for (const key of SALLEN_KEY_KEYS) {
      if (read.has(at(key))) {
        read.fail(at(key), `'${key}' belongs to an active stage; add 'active: sallen-key', or give r and c for an RC stage`, "key");
        complete = false;
      }
    }
    const [r, c] = RC_KEYS.map((key) => part(key, dimensionOf(key)));
    const buffered = read.raw(at("buffered")) ?? false;
    if (r === void 0 || c === void 0) complete = false;
    else all.push({ kind: "rc", r, c, buffered });
  });
  if (!complete) return void 0;
  const rc = all.flatMap((s) => s.kind === "rc" ? [{ r: s.r, c: s.c, buffered: s.buffered }] : []);
  return { all, rc };
}
function readSecondPwm(read, pwm) {
  if (!read.has(["second_pwm"])) return null;
  const role = read.raw(["second_pwm", "role"]);
  const bitsPath = ["second_pwm", "bits"];
  const bits = read.has(bitsPath) ? read.raw(bitsPath) : null;
  let valid = true;
  const fail = (path, message, at = "value") => {
    read.fail(path, message, at);
    valid = false;
  };
  if (role === "complement" && bits !== null) {
    fail(bitsPath, "only role fine has bits of its own: a complement output is the inverted copy of pwm; remove bits, or write 'role: fine'", "key");
  } else if (role === "fine" && bits === null) {
    fail(bitsPath, "missing; role fine needs the resolution of the fine channel (code = coarse * 2^bits + fine), e.g. 8", "key");
  } else if (role === "fine" && !read.has(["pwm", "bits"])) {
    fail(bitsPath, "needs pwm.bits: the code is coarse * 2^bits + fine, so the coarse resolution must be known; give pwm.bits", "key");
  }
  const stagePath = ["second_pwm", "into", "stage"];
  const stage = read.raw(stagePath);
  const list = read.raw(["filter", "stages"]);
  const stages2 = Array.isArray(list) ? list : [];
  const rcNumbers = stages2.flatMap((s, i) => s !== null && typeof s === "object" && "active" in s ? [] : [i + 1]);
  const choice = rcNumbers.length > 0 ? `name an RC stage (${rcNumbers.join(", ")})` : "the filter has no RC stage to inject into";
  if (stages2.length === 0) {
    fail(stagePath, "needs filter.stages: the second output enters the node of an RC stage of the filter");
  } else if (stage > stages2.length) {
    fail(stagePath, `the filter has ${stages2.length} stage${stages2.length > 1 ? "s" : ""}, so there is no stage ${stage}; ${choice}`);
  } else if (!rcNumbers.includes(stage)) {
    fail(stagePath, `stage ${stage} is an active (sallen-key) stage; the second output enters the node of an RC stage; ${choice}`);
  }
  const r = read.quantity(["second_pwm", "into", "r"], "resistance", { sign: "positive" });
  const c = read.quantity(["second_pwm", "into", "c"], "capacitance", { sign: "positive" });
  const high = read.has(["second_pwm", "high"]) ? read.quantity(["second_pwm", "high"], "voltage") : pwm?.high;
  const low = read.has(["second_pwm", "low"]) ? read.quantity(["second_pwm", "low"], "voltage") : pwm?.low;
  if (high !== void 0 && low !== void 0 && !(high > low)) {
    const side = read.has(["second_pwm", "high"]) ? "high" : "low";
    fail(["second_pwm", side], `the high level (${formatEng(high, "V")}) must be above the low level (${formatEng(low, "V")})`);
  }
  const driver = readDriver(read, ["second_pwm", "driver"], pwm?.driver ?? { high: 0, low: 0 });
  const partsRead = r !== void 0 && (c !== void 0 || !read.has(["second_pwm", "into", "c"]));
  if (!valid || !pwm || !partsRead || high === void 0 || low === void 0 || !driver) return void 0;
  const pin = { high, low, driverHigh: driver.high, driverLow: driver.low };
  return { role, bits: role === "fine" ? bits : null, coarseBits: role === "fine" ? pwm.bits ?? null : null, pin, stage: stage - 1, r, c: c ?? null };
}
function readSpec(read, pwm, lsb) {
  const spec = {};
  const specInLsb = {};
  if (!read.has(["spec"])) return { spec: { gain: DEFAULT_GAIN_LIMIT }, specInLsb };
  const scale = pwm ? { fullScale: pwm.high - pwm.low, lsb } : { fullScale: 1, lsb: 1 };
  for (const key of ["ripple", "droop", "inl"]) {
    const level = read.level(["spec", key], scale);
    if (level) {
      spec[key] = level.volts;
      if (level.lsb !== void 0) specInLsb[key] = level.lsb;
    }
  }
  const gainRaw = read.raw(["spec", "gain"]);
  if (typeof gainRaw === "string" && gainRaw.trim().toLowerCase() === "none") {
  } else if (gainRaw !== void 0 && gainRaw !== null) {
    const gain = read.quantity(["spec", "gain"], "fraction");
    if (gain !== void 0 && !(gain > 0)) read.fail(["spec", "gain"], `a limit must be greater than 0, got '${String(gainRaw)}'; write 'none' to turn the gain check off`);
    else if (gain !== void 0) spec.gain = gain;
  } else if (spec.droop === void 0) {
    spec.gain = DEFAULT_GAIN_LIMIT;
  }
  if (read.has(["spec", "settling"])) {
    const band = read.level(["spec", "settling", "band"], scale);
    const time = read.quantity(["spec", "settling", "time"], "time", { sign: "positive" });
    const from2 = read.quantity(["spec", "settling", "from"], "fraction");
    const to2 = read.quantity(["spec", "settling", "to"], "fraction");
    if (from2 !== void 0 && to2 !== void 0 && from2 === to2) {
      read.fail(["spec", "settling", "to"], `from and to are the same duty (${percent(from2)}); a step needs two different duties`);
    }
    if (band) {
      const settling = {
        band: band.volts,
        ...time !== void 0 && { time },
        ...from2 !== void 0 && to2 !== void 0 && { from: from2, to: to2 }
      };
      spec.settling = settling;
      if (band.lsb !== void 0) specInLsb.band = band.lsb;
    }
  }
  return { spec, specInLsb };
}
function readSearch(read, pwm) {
  const stages2 = read.raw(["search", "stages"]) ?? [1, 2];
  const seriesRaw = read.raw(["search", "series"]);
  const series = seriesRaw === void 0 || seriesRaw === null ? { resistor: "E24", capacitor: "E24" } : typeof seriesRaw === "string" ? { resistor: seriesRaw, capacitor: seriesRaw } : { resistor: seriesRaw.resistor, capacitor: seriesRaw.capacitor ?? "E12" };
  const margin = read.has(["search", "margin"]) ? read.quantity(["search", "margin"], "fraction") : DEFAULT_SEARCH_MARGIN;
  if (margin !== void 0 && !(margin >= 0 && margin < 1)) {
    read.fail(["search", "margin"], `a margin must lie from 0 % up to (not including) 100 %, got '${String(read.raw(["search", "margin"]))}'`);
  }
  const buffered = [...read.raw(["search", "buffered"]) ?? [false]];
  const resistance = read.range(["search", "resistance"], "resistance", "ohm", { sign: "positive" }, true);
  const capacitance = read.range(["search", "capacitance"], "capacitance", "F", { sign: "positive" }, true);
  const pinCurrent = read.quantity(["search", "pin_current"], "current", { sign: "positive" });
  let bits;
  if (read.has(["search", "bits"])) {
    const min = read.raw(["search", "bits", "min"]);
    const max = read.raw(["search", "bits", "max"]);
    if (!(min <= max)) read.fail(["search", "bits", "min"], `min (${min}) must be at most max (${max})`);
    else bits = { min, max };
    if (!read.has(["pwm", "clock"])) {
      read.fail(["search", "bits"], "needs pwm.clock: the frequency at each resolution follows from the timer clock", "key");
    }
  }
  if (!resistance || !capacitance || !pwm || margin === void 0 || !(margin >= 0 && margin < 1)) return void 0;
  return {
    stages: [...stages2],
    series,
    margin,
    buffered,
    resistance,
    capacitance,
    ...pinCurrent !== void 0 && { pinCurrent },
    ...bits && { bits }
  };
}
function readTolerance(read, pwm) {
  const resistor = read.tolerance(["tolerance", "resistor"]);
  const capacitor = read.tolerance(["tolerance", "capacitor"]);
  let stages2;
  const stageList = read.raw(["tolerance", "stages"]);
  if (Array.isArray(stageList)) {
    stages2 = stageList.map((entry, i) => {
      if (entry === null || entry === void 0) return void 0;
      const r = read.tolerance(["tolerance", "stages", i, "resistor"]);
      const c = read.tolerance(["tolerance", "stages", i, "capacitor"]);
      return { ...r !== void 0 && { resistor: r }, ...c !== void 0 && { capacitor: c } };
    });
  }
  let driver;
  if (read.has(["tolerance", "driver"])) {
    const nominal = pwm?.driver ?? { high: 0, low: 0 };
    const side = (name) => read.has(["tolerance", "driver", name]) ? read.range(["tolerance", "driver", name], "resistance", "ohm", { sign: "nonNegative" }, false) : { min: nominal[name], max: nominal[name] };
    const high = side("high");
    const low = side("low");
    if (high && low) driver = { high, low };
  }
  const supply = read.tolerance(["tolerance", "supply"]);
  const load = read.tolerance(["tolerance", "load"]);
  const yieldRequired = read.quantity(["tolerance", "yield"], "fraction");
  const distribution = read.raw(["tolerance", "distribution"]) ?? "normal";
  const samples = read.raw(["tolerance", "samples"]) ?? 1e4;
  const seed2 = read.raw(["tolerance", "seed"]) ?? 1;
  if (resistor === void 0 || capacitor === void 0) return void 0;
  return {
    resistor,
    capacitor,
    ...stages2 && { stages: stages2 },
    ...driver && { driver },
    ...supply !== void 0 && { supply },
    ...load !== void 0 && { load },
    distribution,
    samples,
    seed: seed2,
    ...yieldRequired !== void 0 && { yield: yieldRequired }
  };
}

// src/project/projectError.ts
function formatIssue(issue) {
  const where = issue.line === void 0 ? issue.file : `${issue.file}:${issue.line}:${issue.column ?? 1}`;
  return issue.path ? `${where}: ${issue.path}: ${issue.message}` : `${where}: ${issue.message}`;
}
var ProjectError = class extends InputError {
  name = "ProjectError";
  file;
  path;
  line;
  column;
  issues;
  constructor(issues) {
    if (issues.length === 0) throw new RangeError("ProjectError needs at least one issue");
    const sorted = [...issues].sort(
      (a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0)
    );
    super(sorted[0].message);
    this.issues = sorted;
    this.file = sorted[0].file;
    this.path = sorted[0].path;
    this.line = sorted[0].line;
    this.column = sorted[0].column;
  }
  /** One line per problem: `FILE:LINE:COL: key.path: message`. */
  format() {
    return this.issues.map(formatIssue).join("\n");
  }
};

// src/project/readYamlDocument.ts
import {
  isAlias as isAlias2,
  isMap as isMap3,
  isScalar as isScalar3,
  isSeq as isSeq3,
  LineCounter,
  parseDocument
} from "yaml";

// src/project/keyPathAt.ts
import { isMap as isMap2, isScalar as isScalar2, isSeq as isSeq2 } from "yaml";
var startOf2 = (node) => node?.range?.[0];
var endOf = (node) => node?.range?.[2];
function keyPathAt(doc, offset) {
  const path = [];
  let node = doc.contents;
  for (; ; ) {
    let next;
    if (isMap2(node)) {
      for (const pair of node.items) {
        if (!isScalar2(pair.key)) continue;
        const start = startOf2(pair.key);
        const end = endOf(pair.value) ?? endOf(pair.key);
        if (start === void 0 || end === void 0 || offset < start || offset >= Math.max(end, start + 1)) continue;
        path.push(String(pair.key.value));
        const keyEnd = endOf(pair.key) ?? start;
        next = offset < keyEnd ? void 0 : pair.value;
        if (next === void 0 || next === null) return path;
        break;
      }
    } else if (isSeq2(node)) {
      const index = node.items.findIndex((item) => {
        const start = startOf2(item);
        const end = endOf(item);
        return start !== void 0 && end !== void 0 && offset >= start && offset < Math.max(end, start + 1);
      });
      if (index >= 0) {
        path.push(index);
        next = node.items[index];
      }
    }
    if (next === void 0 || next === null) return path;
    node = next;
  }
}

// src/project/openFlowCollections.ts
function openFlowCollections(text, end = text.length) {
  const open = [];
  let deepest = 0;
  for (let i = 0; i < end; i++) {
    const ch = text[i];
    if (ch === "#" && (i === 0 || text[i - 1] === " " || text[i - 1] === "	" || text[i - 1] === "\n")) {
      const eol = text.indexOf("\n", i);
      if (eol < 0) break;
      i = eol;
    } else if (ch === '"' || ch === "'") {
      const prev = i === 0 ? "\n" : text[i - 1];
      if (!" 	\n[{,:-?".includes(prev)) continue;
      for (i++; i < end; i++) {
        if (ch === '"' && text[i] === "\\") i++;
        else if (text[i] === ch) {
          if (ch === "'" && text[i + 1] === "'") i++;
          else break;
        }
      }
    } else if (ch === "[" || ch === "{") {
      open.push(i);
      if (open.length > deepest) deepest = open.length;
    } else if ((ch === "]" || ch === "}") && open.length > 0) {
      open.pop();
    }
  }
  return { open, deepest };
}

// src/project/readYamlDocument.ts
var MAX_PROJECT_BYTES = 1 << 20;
var MAX_PROJECT_LINES = 5e3;
var MAX_PROJECT_NODES = 5e3;
var MAX_NESTING_DEPTH = 12;
var MAX_STRING_LENGTH = 1e3;
var MAX_ALIAS_COUNT = 20;
var RESERVED_KEYS = /* @__PURE__ */ new Set(["__proto__", "constructor", "prototype"]);
function readYamlDocument(text, file) {
  const fileIssue = (message, line, column) => new ProjectError([{ file, path: "", message, ...line !== void 0 && { line, column } }]);
  if (text.length > MAX_PROJECT_BYTES) {
    throw fileIssue(`the file holds ${text.length} characters; a project file is at most ${MAX_PROJECT_BYTES} bytes`);
  }
  if (text.includes("\r")) text = text.replace(/\r(?!\n)/g, "\n");
  let lines = 1;
  for (let i = text.indexOf("\n"); i >= 0 && lines <= MAX_PROJECT_LINES; i = text.indexOf("\n", i + 1)) lines++;
  if (lines > MAX_PROJECT_LINES) {
    throw fileIssue(`the file has more than ${MAX_PROJECT_LINES} lines; a project file is a few dozen (is this the right file?)`, MAX_PROJECT_LINES + 1, 1);
  }
  const flow2 = openFlowCollections(text);
  if (flow2.deepest > MAX_NESTING_DEPTH) {
    const { open } = openFlowCollections(text, deepestOpening(text));
    const at = open[open.length - 1] ?? 0;
    const line = text.slice(0, at).split("\n").length;
    throw fileIssue(`brackets nested more than ${MAX_NESTING_DEPTH} levels deep; a project file nests at most 4`, line, at - text.lastIndexOf("\n", at - 1));
  }
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, uniqueKeys: false, prettyErrors: false, version: "1.2" });
  const issueAt = (offset, path, message) => {
    const { line, col } = lineCounter.linePos(offset);
    return { file, path: formatKeyPath(path), line, column: col, message };
  };
  const syntax = [...doc.errors, ...doc.warnings].map((e) => {
    const open = openFlowCollections(text, e.pos[0]).open;
    const at = open.length > 0 && /flow (sequence|mapping|collection)/i.test(e.message) ? open[0] : e.pos[0];
    const path = keyPathAt(doc, at);
    const message = yamlMessage(e, text, path);
    return issueAt(at, path, at === e.pos[0] ? message : `${message} (this bracket is not closed)`);
  });
  if (syntax.length > 0) throw new ProjectError(syntax);
  const contents = doc.contents;
  if (contents === null || isScalar3(contents) && contents.value === null) {
    throw fileIssue("the file is empty; a project needs at least a pwm section and a filter (or search) section", 1, 1);
  }
  if (!isMap3(contents)) {
    const { line, col } = lineCounter.linePos(contents.range?.[0] ?? 0);
    const what = isSeq3(contents) ? "a list" : isAlias2(contents) ? "an alias" : `the single value '${String(contents)}'`;
    throw fileIssue(`a project file is a mapping of sections (pwm, load, filter, spec, search, tolerance), but this one holds ${what}`, line, col);
  }
  const issues = [];
  const aliases = [];
  let nodes = 0;
  const startOf3 = (node, fallback) => node?.range?.[0] ?? fallback;
  const walk = (node, path) => {
    if ((isMap3(node) || isSeq3(node)) && path.length >= MAX_NESTING_DEPTH) {
      throw new ProjectError([issueAt(startOf3(node, 0), path, `nested more than ${MAX_NESTING_DEPTH} levels deep; a project file nests at most 4`)]);
    }
    if (isMap3(node)) {
      const seen = /* @__PURE__ */ new Set();
      for (const pair of node.items) {
        if (++nodes > MAX_PROJECT_NODES) {
          throw new ProjectError([issueAt(startOf3(pair.key, 0), path, `more than ${MAX_PROJECT_NODES} keys and list items; a project file has a few dozen`)]);
        }
        const keyStart = startOf3(pair.key, node.range?.[0] ?? 0);
        if (!isScalar3(pair.key) || pair.key.value === null || typeof pair.key.value === "object") {
          issues.push(issueAt(keyStart, path, "a key must be a plain name, not a list, a mapping or nothing"));
          continue;
        }
        const name = String(pair.key.value);
        if (name.length > MAX_STRING_LENGTH) {
          issues.push(issueAt(keyStart, path, `a key of ${name.length} characters; a key is a short name`));
          continue;
        }
        if (RESERVED_KEYS.has(name)) {
          issues.push(issueAt(keyStart, [...path, name], `the key '${name}' is not allowed (a reserved name in JavaScript objects)`));
          continue;
        }
        if (seen.has(name)) {
          issues.push(issueAt(keyStart, [...path, name], `duplicate key '${printable(name)}'; a key may appear only once in a mapping`));
          continue;
        }
        seen.add(name);
        walk(pair.value, [...path, name]);
      }
    } else if (isSeq3(node)) {
      node.items.forEach((item, index) => {
        if (++nodes > MAX_PROJECT_NODES) {
          throw new ProjectError([issueAt(startOf3(item, 0), path, `more than ${MAX_PROJECT_NODES} keys and list items; a project file has a few dozen`)]);
        }
        walk(item, [...path, index]);
      });
    } else if (isScalar3(node)) {
      if (typeof node.value === "string" && node.value.length > MAX_STRING_LENGTH) {
        issues.push(issueAt(node.range?.[0] ?? 0, path, `a value of ${node.value.length} characters; a value is at most ${MAX_STRING_LENGTH}`));
      }
      if (typeof node.value === "number" && !Number.isFinite(node.value)) {
        const written = node.source ?? String(node.value);
        issues.push(issueAt(node.range?.[0] ?? 0, path, `'${written}' is not a finite number; write a finite value`));
      }
    } else if (isAlias2(node)) {
      const offset = node.range?.[0] ?? 0;
      if (!node.resolve(doc)) {
        issues.push(issueAt(offset, path, `the alias *${node.source} has no anchor &${node.source} before it`));
      } else {
        aliases.push({ offset, path });
      }
    }
  };
  walk(contents, []);
  if (issues.length > 0) throw new ProjectError(issues);
  let data;
  try {
    data = doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (error) {
    const first = aliases[0] ?? { offset: 0, path: [] };
    const excessive = /alias count/i.test(error.message);
    throw new ProjectError([
      issueAt(
        first.offset,
        first.path,
        excessive ? `the aliases in this file expand too far (more than ${MAX_ALIAS_COUNT} copies, as in an alias bomb); write the values out` : `cannot read the file: ${error.message}`
      )
    ]);
  }
  return { file, doc, lineCounter, data };
}
function deepestOpening(text) {
  let lo = 0;
  let hi = text.length;
  while (lo < hi) {
    const mid = lo + hi >> 1;
    if (openFlowCollections(text, mid).deepest > MAX_NESTING_DEPTH) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}
function printable(name) {
  const escaped = JSON.stringify(name).slice(1, -1);
  return escaped.length > 60 ? `${escaped.slice(0, 57)}...` : escaped;
}
function yamlMessage(error, text, path) {
  const at = text.slice(error.pos[0], error.pos[1]);
  switch (error.code) {
    case "DUPLICATE_KEY": {
      const key = path.length > 0 ? String(path[path.length - 1]) : at;
      return `duplicate key '${printable(key)}'; a key may appear only once in a mapping`;
    }
    case "MULTIPLE_DOCS":
      return "more than one YAML document (a second '---'); a project file holds one";
    case "TAB_AS_INDENT":
      return "a tab is used for indentation; YAML indents with spaces";
    case "TAG_RESOLVE_FAILED":
      return `unknown tag ${at.split(/\s/)[0]}; write plain values without tags`;
    default:
      return `YAML syntax error: ${error.message.split("\n")[0]}`;
  }
}

// schemas/project.schema.json
var project_schema_default = {
  $schema: "https://json-schema.org/draft/2020-12/schema",
  $id: "urn:dacsmith:schema:project:1",
  title: "dacsmith project file, version 1",
  description: "The RC smoothing filter behind a PWM output used as a DAC: the PWM source, the filter stages, the load, the limits to meet, the design space and the tolerances. Quantities are strings with units and SI prefixes ('4.7 uF', '10 kohm', '3.3 V', '20 kHz'), shorthand with a prefix letter ('10k', '100n'), IEC 60062 letter-and-digit codes ('4k7', '2R2', '100n') or plain numbers in SI base units; fractions are numbers from 0 to 1 or percentages ('5 %'). A prefix letter is always an SI prefix: '1M' is mega, '1m' is milli.",
  type: "object",
  additionalProperties: false,
  required: ["pwm"],
  properties: {
    $schema: {
      description: "Where an editor finds this schema. Ignored by dacsmith.",
      type: "string",
      examples: ["../schemas/project.schema.json"]
    },
    version: {
      description: "Version of the project file format. Only 1 exists; it may be left out.",
      const: 1,
      default: 1,
      examples: [1]
    },
    pwm: {
      description: "The PWM output: its frequency (given, or from the timer clock and resolution), levels, driver resistance and the duty range in use.",
      type: "object",
      examples: [{ frequency: "19.5 kHz", bits: 10, high: "3.3 V" }, { clock: "16 MHz", bits: 10, high: "5 V" }],
      additionalProperties: false,
      required: ["high"],
      properties: {
        frequency: {
          description: "PWM frequency. Give it, or give clock and bits (and prescaler). When both are given they must agree to the digits written.",
          type: ["string", "number"],
          "x-unit": "Hz",
          examples: ["19.5 kHz", "31.25 kHz", 2e4]
        },
        clock: {
          description: "Timer input clock. With bits and prescaler it fixes the frequency: edge-aligned clock / (prescaler * 2^bits), center-aligned clock / (2 * prescaler * 2^bits).",
          type: ["string", "number"],
          "x-unit": "Hz",
          examples: ["20 MHz", "16 MHz"]
        },
        bits: {
          description: "PWM resolution in bits (the timer counts 2^bits steps per period). Needed for the LSB and for limits written in LSB.",
          type: "integer",
          minimum: 1,
          maximum: 32,
          "x-unit": "bit",
          examples: [10, 8, 12]
        },
        prescaler: {
          description: "Timer clock divider between clock and counter.",
          type: "integer",
          minimum: 1,
          default: 1,
          "x-unit": "1",
          examples: [1, 8]
        },
        alignment: {
          description: "Edge-aligned (counter counts up) or center-aligned (up and down, half the frequency for the same clock and bits).",
          enum: ["edge", "center"],
          default: "edge",
          examples: ["edge", "center"]
        },
        high: {
          description: "Open-circuit pin level during the high phase (the supply of the output stage).",
          type: ["string", "number"],
          "x-unit": "V",
          examples: ["3.3 V", "5 V", "3V3"]
        },
        low: {
          description: "Open-circuit pin level during the low phase.",
          type: ["string", "number"],
          default: "0 V",
          "x-unit": "V",
          examples: ["0 V"]
        },
        driver: {
          description: "Output resistance of the pin driver: one value for both phases, or {high, low} for the high-side and low-side switch. Leave out for an ideal pin (0 ohm).",
          type: ["string", "number", "object"],
          additionalProperties: false,
          required: ["high", "low"],
          default: "0 ohm",
          "x-unit": "ohm",
          examples: ["30 ohm", { high: "40 ohm", low: "25 ohm" }],
          properties: {
            high: {
              description: "Driver resistance while the pin is high (high-side switch).",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["40 ohm"]
            },
            low: {
              description: "Driver resistance while the pin is low (low-side switch).",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["25 ohm"]
            }
          }
        },
        duty: {
          description: "The duty range in use; ripple, DC error and settling are judged over it.",
          type: "object",
          additionalProperties: false,
          default: { min: "0 %", max: "100 %" },
          examples: [{ min: "5 %", max: "95 %" }],
          properties: {
            min: {
              description: "Lowest duty in use, a fraction or a percentage; below max.",
              type: ["string", "number"],
              default: "0 %",
              "x-unit": "1",
              examples: ["5 %", 0.05]
            },
            max: {
              description: "Highest duty in use, a fraction or a percentage; above min.",
              type: ["string", "number"],
              default: "100 %",
              "x-unit": "1",
              examples: ["95 %", 0.95]
            }
          }
        }
      }
    },
    load: {
      description: "What the filter output drives.",
      type: "object",
      additionalProperties: false,
      examples: [{ resistance: "100 kohm", capacitance: "47 pF" }],
      properties: {
        resistance: {
          description: "Load resistance from the output to ground. Leave out for an open output.",
          type: ["string", "number"],
          "x-unit": "ohm",
          examples: ["100 kohm", "1M"]
        },
        capacitance: {
          description: "Load capacitance, in parallel with the last filter capacitor.",
          type: ["string", "number"],
          default: 0,
          "x-unit": "F",
          examples: ["47 pF", "100p"]
        }
      }
    },
    filter: {
      description: "The filter to analyse: RC stages and (version 1.1) active second-order stages. May be left out when a search section asks for a design.",
      type: "object",
      additionalProperties: false,
      required: ["stages"],
      examples: [{ stages: [{ r: "4.7k", c: "100n" }] }],
      properties: {
        stages: {
          description: "1 to 4 stages, pin side first: an RC stage (a series resistor from the previous node and a capacitor to ground) or an active stage (active: sallen-key).",
          type: "array",
          minItems: 1,
          maxItems: 4,
          examples: [
            [{ r: "4.7k", c: "100n" }, { r: "47k", c: "10n", buffered: true }],
            [{ r: "10k", c: "100n" }, { active: "sallen-key", r1: "10k", r2: "10k", c1: "22n", c2: "10n" }]
          ],
          items: {
            description: "One stage: { r, c } (and buffered) for an RC stage, or { active: sallen-key, r1, r2, c1, c2 } for an active stage. Which keys a kind needs is checked after the schema.",
            type: "object",
            additionalProperties: false,
            examples: [{ r: "4k7", c: "100n" }, { active: "sallen-key", r1: "10k", r2: "10k", c1: "22n", c2: "10n" }],
            properties: {
              r: {
                description: "Series resistor of the RC stage.",
                type: ["string", "number"],
                "x-unit": "ohm",
                examples: ["4.7k", "4k7", "10 kohm"]
              },
              c: {
                description: "Capacitor from the node of the RC stage to ground.",
                type: ["string", "number"],
                "x-unit": "F",
                examples: ["100n", "4u7", "10 nF"]
              },
              buffered: {
                description: "An ideal unity-gain follower drives what comes after this RC stage, so the next stage does not load it. Not for an active stage, whose output is already an op-amp.",
                type: "boolean",
                default: false,
                examples: [true]
              },
              active: {
                description: "Makes the stage active: sallen-key is a unity-gain Sallen-Key low-pass with an ideal op-amp, f0 = 1 / (2 pi sqrt(r1 r2 c1 c2)), Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)). It takes r1, r2, c1 and c2 instead of r and c.",
                enum: ["sallen-key"],
                examples: ["sallen-key"]
              },
              r1: {
                description: "Active stage: resistor from the previous node to the middle node.",
                type: ["string", "number"],
                "x-unit": "ohm",
                examples: ["10k", "10 kohm"]
              },
              r2: {
                description: "Active stage: resistor from the middle node to the op-amp input.",
                type: ["string", "number"],
                "x-unit": "ohm",
                examples: ["10k", "22 kohm"]
              },
              c1: {
                description: "Active stage: capacitor from the middle node to the op-amp output (the feedback capacitor).",
                type: ["string", "number"],
                "x-unit": "F",
                examples: ["22n", "22 nF"]
              },
              c2: {
                description: "Active stage: capacitor from the op-amp input to ground.",
                type: ["string", "number"],
                "x-unit": "F",
                examples: ["10n", "10 nF"]
              }
            }
          }
        }
      }
    },
    second_pwm: {
      description: "A second PWM output of the same timer (same period and alignment as pwm), injected into the node of an RC stage. role fine: its own duty, set by the low bits of the code; role complement: the inverted copy of pwm (ripple cancellation).",
      type: "object",
      additionalProperties: false,
      required: ["role", "into"],
      examples: [{ role: "fine", bits: 8, into: { stage: 1, r: "2.56 Mohm" } }, { role: "complement", into: { stage: 1, r: "10k", c: "100n" } }],
      properties: {
        role: {
          description: "fine: its own duty, set by the low bits of the code (code = coarse * 2^bits + fine); complement: high exactly when pwm is low.",
          enum: ["fine", "complement"],
          examples: ["fine", "complement"]
        },
        bits: {
          description: "Resolution of the fine channel (role fine only, needs pwm.bits). One LSB is then full scale / 2^(pwm.bits + bits).",
          type: "integer",
          minimum: 1,
          maximum: 16,
          "x-unit": "bit",
          examples: [8, 4]
        },
        into: {
          description: "Where the second output enters: the node of an RC stage, through a resistor and optionally a capacitor in series.",
          type: "object",
          additionalProperties: false,
          required: ["stage", "r"],
          examples: [{ stage: 1, r: "2.56 Mohm" }, { stage: 1, r: "10k", c: "100n" }],
          properties: {
            stage: {
              description: "Number of the stage in filter.stages (1 = pin side); it must be an RC stage.",
              type: "integer",
              minimum: 1,
              "x-unit": "1",
              examples: [1, 2]
            },
            r: {
              description: "Injection resistor from the second pin to the stage node.",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["2.56 Mohm", "10k"]
            },
            c: {
              description: "Capacitor in series with the injection resistor; leave out for a resistor alone.",
              type: ["string", "number"],
              "x-unit": "F",
              examples: ["100n", "1 uF"]
            }
          }
        },
        high: {
          description: "Open-circuit level of the second pin while high. Defaults to pwm.high.",
          type: ["string", "number"],
          "x-unit": "V",
          examples: ["3.3 V", "5 V"]
        },
        low: {
          description: "Open-circuit level of the second pin while low. Defaults to pwm.low.",
          type: ["string", "number"],
          "x-unit": "V",
          examples: ["0 V"]
        },
        driver: {
          description: "Output resistance of the second pin's driver: one value for both phases, or {high, low}. Defaults to pwm.driver.",
          type: ["string", "number", "object"],
          additionalProperties: false,
          required: ["high", "low"],
          "x-unit": "ohm",
          examples: ["30 ohm", { high: "40 ohm", low: "25 ohm" }],
          properties: {
            high: {
              description: "Driver resistance while the second pin is high.",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["40 ohm"]
            },
            low: {
              description: "Driver resistance while the second pin is low.",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["25 ohm"]
            }
          }
        }
      }
    },
    spec: {
      description: "Limits the filter must meet. Levels are written in V, mV, LSB (needs pwm.bits) or % of full scale (pwm.high - pwm.low).",
      type: "object",
      additionalProperties: false,
      examples: [{ ripple: "0.5 LSB", droop: "1 LSB" }],
      properties: {
        ripple: {
          description: "Largest peak-to-peak ripple of the output over the used duty range.",
          type: ["string", "number"],
          "x-unit": "V",
          examples: ["0.5 LSB", "2 mV", "0.1 %"]
        },
        droop: {
          description: "Largest DC error (ideal minus average output) over the used duty range.",
          type: ["string", "number"],
          "x-unit": "V",
          examples: ["1 LSB", "10 mV"]
        },
        inl: {
          description: "Largest integral non-linearity of the DC transfer (endpoint fit).",
          type: ["string", "number"],
          "x-unit": "V",
          examples: ["0.5 LSB", "1 mV"]
        },
        gain: {
          description: "Largest endpoint-fit gain error of the DC transfer, as a fraction of full scale; 'none' turns the check off. Default 2 % when droop is not given (an inl limit does not bound the full scale), so that a divided-down output never passes unnoticed.",
          type: ["string", "number"],
          "x-unit": "1",
          examples: ["2 %", "none", 0.01]
        },
        settling: {
          description: "Settling after a duty step: the output must stay within band of its new average from time on. Without from and to, the full used range is stepped rising and falling.",
          type: "object",
          additionalProperties: false,
          required: ["band"],
          dependentRequired: { from: ["to"], to: ["from"] },
          examples: [{ band: "0.5 LSB", time: "20 ms", from: "10 %", to: "90 %" }],
          properties: {
            band: {
              description: "Half-width of the band around the final average.",
              type: ["string", "number"],
              "x-unit": "V",
              examples: ["0.5 LSB", "1 mV"]
            },
            time: {
              description: "Time allowed to enter the band and stay in it.",
              type: ["string", "number"],
              "x-unit": "s",
              examples: ["20 ms", "500 us"]
            },
            from: {
              description: "Duty before the step (give to as well).",
              type: ["string", "number"],
              "x-unit": "1",
              examples: ["10 %", 0.1]
            },
            to: {
              description: "Duty after the step (give from as well).",
              type: ["string", "number"],
              "x-unit": "1",
              examples: ["90 %", 0.9]
            }
          }
        }
      }
    },
    search: {
      description: "Design space for recommended filters.",
      type: "object",
      additionalProperties: false,
      required: ["resistance", "capacitance"],
      examples: [{ stages: [1, 2], series: "E24", resistance: { min: "1 kohm", max: "1 Mohm" }, capacitance: { min: "1 nF", max: "10 uF" } }],
      properties: {
        stages: {
          description: "Numbers of RC stages to try, each 1 to 3.",
          type: "array",
          minItems: 1,
          maxItems: 3,
          uniqueItems: true,
          default: [1, 2],
          examples: [[1, 2], [2]],
          items: {
            description: "A number of RC stages.",
            type: "integer",
            minimum: 1,
            maximum: 3,
            examples: [2]
          }
        },
        series: {
          description: "IEC 60063 preferred-number series the parts are taken from: one series for resistors and capacitors, or one each (capacitors default to E12 in that form).",
          default: "E24",
          examples: ["E24", { resistor: "E24", capacitor: "E6" }],
          oneOf: [
            {
              description: "One series for resistors and capacitors.",
              enum: ["E3", "E6", "E12", "E24", "E48", "E96", "E192"],
              examples: ["E24"]
            },
            {
              description: "A series for the resistors and one for the capacitors.",
              type: "object",
              additionalProperties: false,
              required: ["resistor"],
              examples: [{ resistor: "E96", capacitor: "E12" }],
              properties: {
                resistor: {
                  description: "Series of the resistors.",
                  enum: ["E3", "E6", "E12", "E24", "E48", "E96", "E192"],
                  examples: ["E24"]
                },
                capacitor: {
                  description: "Series of the capacitors (default E12: most boards buy capacitors from E6 or E12, common practice).",
                  enum: ["E3", "E6", "E12", "E24", "E48", "E96", "E192"],
                  default: "E12",
                  examples: ["E6"]
                }
              }
            }
          ]
        },
        margin: {
          description: "Headroom every recommended design keeps below each limit, as a fraction of the limit.",
          type: ["string", "number"],
          "x-unit": "1",
          default: "10 %",
          examples: ["10 %", "0 %", 0.2]
        },
        buffered: {
          description: "Whether the search tries the ladder without (false) and with (true) an ideal follower (op-amp) after the last stage.",
          type: "array",
          minItems: 1,
          maxItems: 2,
          uniqueItems: true,
          default: [false],
          examples: [[false, true], [true]],
          items: {
            description: "false: no follower; true: an ideal follower after the last stage.",
            type: "boolean",
            examples: [true]
          }
        },
        resistance: {
          description: "Range of resistor values to use.",
          type: "object",
          additionalProperties: false,
          required: ["min", "max"],
          examples: [{ min: "1 kohm", max: "1 Mohm" }],
          properties: {
            min: {
              description: "Smallest resistor.",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["1 kohm", "1k"]
            },
            max: {
              description: "Largest resistor.",
              type: ["string", "number"],
              "x-unit": "ohm",
              examples: ["1 Mohm", "1M"]
            }
          }
        },
        capacitance: {
          description: "Range of capacitor values to use.",
          type: "object",
          additionalProperties: false,
          required: ["min", "max"],
          examples: [{ min: "1 nF", max: "10 uF" }],
          properties: {
            min: {
              description: "Smallest capacitor.",
              type: ["string", "number"],
              "x-unit": "F",
              examples: ["1 nF", "1n"]
            },
            max: {
              description: "Largest capacitor.",
              type: ["string", "number"],
              "x-unit": "F",
              examples: ["10 uF", "10u"]
            }
          }
        },
        pin_current: {
          description: "Largest pin peak current allowed: (high - low) / (driver + R1) must stay below it.",
          type: ["string", "number"],
          "x-unit": "A",
          examples: ["10 mA", "20m"]
        },
        bits: {
          description: "Resolutions the search may choose (needs pwm.clock): each gives its own frequency.",
          type: "object",
          additionalProperties: false,
          required: ["min", "max"],
          examples: [{ min: 8, max: 12 }],
          properties: {
            min: {
              description: "Lowest resolution to try.",
              type: "integer",
              minimum: 1,
              maximum: 32,
              "x-unit": "bit",
              examples: [8]
            },
            max: {
              description: "Highest resolution to try.",
              type: "integer",
              minimum: 1,
              maximum: 32,
              "x-unit": "bit",
              examples: [12]
            }
          }
        }
      }
    },
    tolerance: {
      description: "Component and source tolerances for the yield estimate (Monte Carlo).",
      type: "object",
      additionalProperties: false,
      required: ["resistor", "capacitor"],
      examples: [{ resistor: "1 %", capacitor: "10 %" }],
      properties: {
        resistor: {
          description: "Relative tolerance of every resistor.",
          type: ["string", "number"],
          "x-unit": "1",
          examples: ["1 %", 0.01]
        },
        capacitor: {
          description: "Relative tolerance of every capacitor.",
          type: ["string", "number"],
          "x-unit": "1",
          examples: ["10 %", 0.1]
        },
        stages: {
          description: "Per-stage overrides, pin side first; an empty entry keeps the common tolerances.",
          type: "array",
          maxItems: 4,
          examples: [[{ capacitor: "5 %" }, {}]],
          items: {
            description: "Tolerances of one stage.",
            type: ["object", "null"],
            additionalProperties: false,
            examples: [{ resistor: "0.1 %", capacitor: "5 %" }],
            properties: {
              resistor: {
                description: "Relative tolerance of this stage's resistor.",
                type: ["string", "number"],
                "x-unit": "1",
                examples: ["0.1 %"]
              },
              capacitor: {
                description: "Relative tolerance of this stage's capacitor.",
                type: ["string", "number"],
                "x-unit": "1",
                examples: ["5 %"]
              }
            }
          }
        },
        driver: {
          description: "Ranges of the driver resistances (from the microcontroller data sheet); a side left out keeps its nominal value.",
          type: "object",
          additionalProperties: false,
          examples: [{ high: { min: "20 ohm", max: "60 ohm" }, low: { min: "15 ohm", max: "40 ohm" } }],
          properties: {
            high: {
              description: "Range of the high-side driver resistance.",
              type: "object",
              additionalProperties: false,
              required: ["min", "max"],
              examples: [{ min: "20 ohm", max: "60 ohm" }],
              properties: {
                min: { description: "Smallest high-side resistance.", type: ["string", "number"], "x-unit": "ohm", examples: ["20 ohm"] },
                max: { description: "Largest high-side resistance.", type: ["string", "number"], "x-unit": "ohm", examples: ["60 ohm"] }
              }
            },
            low: {
              description: "Range of the low-side driver resistance.",
              type: "object",
              additionalProperties: false,
              required: ["min", "max"],
              examples: [{ min: "15 ohm", max: "40 ohm" }],
              properties: {
                min: { description: "Smallest low-side resistance.", type: ["string", "number"], "x-unit": "ohm", examples: ["15 ohm"] },
                max: { description: "Largest low-side resistance.", type: ["string", "number"], "x-unit": "ohm", examples: ["40 ohm"] }
              }
            }
          }
        },
        supply: {
          description: "Relative tolerance of the high level (the supply of the pin).",
          type: ["string", "number"],
          "x-unit": "1",
          examples: ["2 %", 0.02]
        },
        load: {
          description: "Relative tolerance of the load resistance.",
          type: ["string", "number"],
          "x-unit": "1",
          examples: ["20 %"]
        },
        distribution: {
          description: "How component values spread within their tolerance: normal (tolerance = 3 sigma) or uniform.",
          enum: ["normal", "uniform"],
          default: "normal",
          examples: ["normal", "uniform"]
        },
        samples: {
          description: "Number of Monte Carlo samples.",
          type: "integer",
          minimum: 1,
          maximum: 1e6,
          default: 1e4,
          "x-unit": "1",
          examples: [1e4]
        },
        seed: {
          description: "Seed of the random generator, for repeatable results.",
          type: "integer",
          minimum: 0,
          maximum: 4294967295,
          default: 1,
          "x-unit": "1",
          examples: [1, 42]
        },
        yield: {
          description: "Share of samples that must meet every spec.",
          type: ["string", "number"],
          "x-unit": "1",
          examples: ["99 %", 0.99]
        }
      }
    }
  }
};

// src/project/editDistance.ts
function editDistance(a, b) {
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d = Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_2, j) => i === 0 ? j : j === 0 ? i : 0));
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
      }
    }
  }
  return d[rows - 1][cols - 1];
}

// src/project/closestName.ts
function closestName(typed, allowed) {
  const fold = (s) => s.toLowerCase().replace(/[-\s]/g, "_");
  const word = fold(typed);
  const limit = Math.max(1, Math.floor(word.length / 3));
  let best;
  let bestDistance = Infinity;
  for (const name of allowed) {
    const candidate = fold(name);
    let distance = editDistance(word, candidate);
    if (word.length >= 3 && candidate.startsWith(word)) distance = Math.min(distance, 1);
    const close = distance <= limit && distance < Math.min(word.length, candidate.length);
    if (close && distance < bestDistance) {
      best = name;
      bestDistance = distance;
    }
  }
  return best;
}

// src/project/projectValidator.ts
import ajv2020Module from "ajv/dist/2020.js";
var Ajv2020 = ajv2020Module.default ?? ajv2020Module;
var AJV_OPTIONS = {
  strict: true,
  allErrors: true,
  verbose: true,
  allowUnionTypes: true,
  validateSchema: false,
  code: { optimize: false }
};
function projectSchemaAjv(code = {}) {
  const ajv = new Ajv2020({ ...AJV_OPTIONS, code: { ...AJV_OPTIONS.code, ...code } });
  ajv.addKeyword({ keyword: "x-unit", schemaType: "string" });
  return ajv;
}
var validator;
function projectValidator() {
  validator ??= projectSchemaAjv().compile(project_schema_default);
  return validator;
}

// src/project/validateSchema.ts
var homes;
function validateSchema(data) {
  const validate = projectValidator();
  if (validate(data)) return [];
  const drafts = (validate.errors ?? []).map((error) => describe(error, data));
  const seen = /* @__PURE__ */ new Set();
  return drafts.filter((d) => {
    const key = `${formatKeyPath(d.path)}\0${d.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
function describe(error, root) {
  const path = pointerToPath(error.instancePath, root);
  const parent = error.parentSchema ?? {};
  const params = error.params;
  switch (error.keyword) {
    case "additionalProperties": {
      const key = String(params.additionalProperty);
      return { path: [...path, key], at: "key", message: unknownKey(key, Object.keys(parent.properties ?? {}), path) };
    }
    case "required": {
      const key = String(params.missingProperty);
      const property = parent.properties?.[key];
      return { path: [...path, key], at: "key", message: `missing${property ? `; ${whatItIs(property)}` : ""}` };
    }
    case "dependentRequired": {
      const key = String(params.property);
      const other = String(params.missingProperty);
      return { path: [...path, key], at: "key", message: `'${key}' needs '${other}' as well; give both or neither` };
    }
    case "type":
      return { path, message: `expected ${kindOf(parent)}, got ${valueText(error.data)}` };
    case "enum": {
      const choices = (parent.enum ?? []).map(String);
      const guess = typeof error.data === "string" ? closestName(error.data, choices) : void 0;
      return {
        path,
        message: `expected one of ${choices.join(", ")}, got ${valueText(error.data)}${guess ? `; did you mean '${guess}'?` : ""}`
      };
    }
    case "const":
      return { path, message: `expected ${JSON.stringify(parent.const)}, got ${valueText(error.data)}${path.join() === "version" ? " (this dacsmith reads version 1 project files)" : ""}` };
    case "minimum":
    case "exclusiveMinimum":
      return { path, message: `must be ${error.keyword === "minimum" ? "at least" : "more than"} ${params.limit}, got ${valueText(error.data)}` };
    case "maximum":
    case "exclusiveMaximum":
      return { path, message: `must be ${error.keyword === "maximum" ? "at most" : "less than"} ${params.limit}, got ${valueText(error.data)}` };
    case "minItems":
    case "maxItems": {
      const count = Array.isArray(error.data) ? error.data.length : 0;
      const limit = Number(params.limit);
      const entries = (n) => `${n} ${n === 1 ? "entry" : "entries"}`;
      return {
        path,
        message: `needs ${error.keyword === "minItems" ? "at least" : "at most"} ${entries(limit)}, got ${entries(count)}`
      };
    }
    case "uniqueItems": {
      const list = Array.isArray(error.data) ? error.data : [];
      return { path, message: `lists ${valueText(list[Number(params.i)])} twice` };
    }
    default:
      return { path, message: error.message ?? `does not match the schema (${error.keyword})` };
  }
}
function pointerToPath(pointer, root) {
  if (pointer === "") return [];
  const path = [];
  let node = root;
  for (const raw of pointer.slice(1).split("/")) {
    const segment = raw.replace(/~1/g, "/").replace(/~0/g, "~");
    if (Array.isArray(node)) {
      path.push(Number(segment));
      node = node[Number(segment)];
    } else {
      path.push(segment);
      node = node && typeof node === "object" ? node[segment] : void 0;
    }
  }
  return path;
}
function unknownKey(key, allowed, parent) {
  const guess = closestName(key, allowed);
  if (guess) return `unknown key '${key}'; did you mean '${guess}'?`;
  const here = formatKeyPath(parent.map((s) => typeof s === "number" ? 0 : s));
  const elsewhere = (keyHomes().get(key) ?? []).filter((home) => home !== here);
  if (elsewhere.length > 0) return `unknown key '${key}' here; '${key}' belongs under ${elsewhere.join(" or ")}`;
  return `unknown key '${key}'; expected one of: ${allowed.join(", ")}`;
}
function keyHomes() {
  if (homes) return homes;
  const found = /* @__PURE__ */ new Map();
  const visit = (node, path) => {
    for (const [name, child] of Object.entries(node.properties ?? {})) {
      const list = found.get(name) ?? [];
      const home = formatKeyPath(path) || "the top level";
      if (!list.includes(home)) list.push(home);
      found.set(name, list);
      visit(child, [...path, name]);
    }
    if (node.items) visit(node.items, [...path, 0]);
  };
  visit(project_schema_default, []);
  homes = found;
  return found;
}
function whatItIs(node) {
  const description = (node.description ?? "").split(/(?<=\.)\s/)[0].replace(/\.$/, "");
  const first = description ? description[0].toLowerCase() + description.slice(1) : "";
  const example = node.examples?.[0];
  return `${first}${example !== void 0 ? `, e.g. ${exampleText(example)}` : ""}`;
}
function kindOf(node) {
  const types = Array.isArray(node.type) ? node.type : node.type ? [node.type] : [];
  const words = [];
  const scalarExample = node.examples?.find((e) => typeof e !== "object");
  if (types.includes("string") || types.includes("number")) {
    const unit = node["x-unit"];
    const level = node.examples?.some((e) => typeof e === "string" && /LSB/.test(e));
    const what = level ? "a level in V, mV, LSB or % of full scale" : unit === "1" ? "a fraction or percentage" : unit ? `a quantity in ${unit}` : "a value";
    words.push(scalarExample !== void 0 ? `${what} such as ${exampleText(scalarExample)}` : what);
  }
  if (types.includes("integer")) words.push("a whole number");
  if (types.includes("boolean")) words.push("true or false");
  if (types.includes("array")) words.push("a list");
  if (types.includes("object")) {
    const keys = Object.keys(node.properties ?? {});
    words.push(keys.length > 0 ? `a mapping with keys ${keys.join(", ")}` : "a mapping");
  }
  return words.length > 0 ? words.join(", or ") : "another kind of value";
}
function exampleText(example) {
  if (typeof example === "string") return `'${example}'`;
  if (example && typeof example === "object" && !Array.isArray(example)) {
    const inner = Object.entries(example).map(([k, v]) => `${k}: ${typeof v === "object" ? JSON.stringify(v) : v}`);
    return `{ ${inner.join(", ")} }`;
  }
  return JSON.stringify(example);
}
function valueText(value) {
  if (value === null || value === void 0) return "nothing (an empty value)";
  if (Array.isArray(value)) return "a list";
  if (typeof value === "object") return "a mapping";
  if (typeof value === "string") return `'${value}'`;
  return String(value);
}

// src/project/parseProject.ts
function parseProject(text, file) {
  const source = readYamlDocument(text, file);
  const schemaIssues = validateSchema(source.data);
  if (schemaIssues.length > 0) throw positioned(source, schemaIssues);
  const { project, issues } = normalizeProject(source.data, file);
  if (!project || issues.length > 0) throw positioned(source, issues);
  return project;
}
function positioned(source, drafts) {
  return new ProjectError(
    drafts.map((draft) => {
      const { line, column } = locate(source.doc, source.lineCounter, draft.path, draft.at ?? "value");
      return { file: source.file, path: formatKeyPath(draft.path), line, column, message: draft.message };
    })
  );
}

// src/project/loadProject.ts
function loadProject(path) {
  const fail = (message, line, column) => new ProjectError([{ file: path, path: "", message, ...line !== void 0 && { line, column } }]);
  let bytes;
  try {
    const stats = statSync(path);
    if (stats.isDirectory()) throw fail("is a directory; give the path of a project file (.yaml)");
    if (!stats.isFile()) throw fail("is not a regular file");
    if (stats.size > MAX_PROJECT_BYTES) throw fail(`is ${stats.size} bytes; a project file is at most ${MAX_PROJECT_BYTES} bytes`);
    bytes = readFileSync(path);
  } catch (error) {
    if (error instanceof ProjectError) throw error;
    const code = error.code;
    const reason = code === "ENOENT" ? "no such file" : code === "EACCES" || code === "EPERM" ? "cannot read the file: permission denied" : code === "ENOTDIR" ? "no such file (a part of the path is not a directory)" : `cannot read the file: ${error.message}`;
    throw fail(reason);
  }
  return parseProject(decodeProjectText(bytes, path), path);
}
function decodeProjectText(bytes, path) {
  const fail = (message, line, column) => new ProjectError([{ file: path, path: "", message, ...line !== void 0 && { line, column } }]);
  if (bytes.length >= 2 && (bytes[0] === 255 && bytes[1] === 254 || bytes[0] === 254 && bytes[1] === 255)) {
    throw fail("is UTF-16 text; save it as UTF-8", 1, 1);
  }
  const nul = bytes.indexOf(0);
  if (nul >= 0) {
    const { line, column } = positionOfByte(bytes, nul);
    throw fail("holds a NUL byte: a binary file, not YAML text", line, column);
  }
  const invalid = firstInvalidUtf8(bytes);
  if (invalid >= 0) {
    const { line, column } = positionOfByte(bytes, invalid);
    const hex = bytes[invalid].toString(16).toUpperCase().padStart(2, "0");
    throw fail(`is not UTF-8 text: byte 0x${hex} does not belong there; save the file as UTF-8`, line, column);
  }
  return new TextDecoder("utf-8").decode(bytes);
}
function positionOfByte(bytes, offset) {
  const before = bytes.subarray(0, offset);
  const lineStart = before.lastIndexOf(10) + 1;
  let line = 1;
  for (const b of before) if (b === 10) line++;
  const column = [...new TextDecoder("utf-8").decode(bytes.subarray(lineStart, offset))].length + 1;
  return { line, column };
}

// src/circuit/checkLadder.ts
function checkLadder(ladder) {
  const bad = (what) => {
    throw new RangeError(`invalid ladder: ${what}`);
  };
  if (!(ladder.period > 0) || !Number.isFinite(ladder.period)) bad("period must be > 0");
  if (!Number.isFinite(ladder.high) || !Number.isFinite(ladder.low)) bad("levels must be finite");
  if (!(ladder.driverHigh >= 0) || !(ladder.driverLow >= 0)) bad("driver resistance must be >= 0");
  if (!Number.isFinite(ladder.driverHigh) || !Number.isFinite(ladder.driverLow)) bad("driver must be finite");
  if (ladder.stages.length === 0) bad("at least one stage");
  for (const s of ladder.stages) {
    if (!(s.r > 0) || !(s.c > 0) || !Number.isFinite(s.r) || !Number.isFinite(s.c)) {
      bad("every stage needs finite r > 0 and c > 0");
    }
  }
  if (ladder.loadResistance !== null && !(ladder.loadResistance > 0)) bad("load resistance must be > 0");
  if (!(ladder.loadCapacitance >= 0) || !Number.isFinite(ladder.loadCapacitance)) {
    bad("load capacitance must be finite and >= 0");
  }
}

// src/circuit/stateSpace.ts
function phaseSystem(ladder, driver, source) {
  const { stages: stages2 } = ladder;
  const n = stages2.length;
  const A = new Array(n * n).fill(0);
  const input = new Array(n).fill(0);
  const cap = nodeCapacitance(ladder);
  for (let k = 0; k < n; k++) {
    const gIn = 1 / (stages2[k].r + (k === 0 ? driver : 0));
    let gSelf = gIn;
    if (k > 0) A[k * n + k - 1] = gIn / cap[k];
    if (k < n - 1 && !stages2[k].buffered) {
      const gOut = 1 / stages2[k + 1].r;
      gSelf += gOut;
      A[k * n + k + 1] = gOut / cap[k];
    }
    if (k === n - 1 && !stages2[k].buffered && ladder.loadResistance !== null) {
      gSelf += 1 / ladder.loadResistance;
    }
    A[k * n + k] = -gSelf / cap[k];
    if (k === 0) input[0] = gIn / cap[0];
  }
  return { A, b: input.map((v) => v * source), input };
}
function stateSpace(ladder) {
  checkLadder(ladder);
  const n = ladder.stages.length;
  const sections = [];
  let first = 0;
  for (let k = 0; k < n; k++) {
    if (ladder.stages[k].buffered || k === n - 1) {
      sections.push({ first, last: k });
      first = k + 1;
    }
  }
  return {
    n,
    high: phaseSystem(ladder, ladder.driverHigh, ladder.high),
    low: phaseSystem(ladder, ladder.driverLow, ladder.low),
    mean: phaseSystem(ladder, (ladder.driverHigh + ladder.driverLow) / 2, 1),
    capacitance: nodeCapacitance(ladder),
    sections,
    output: n - 1
  };
}
function nodeCapacitance(ladder) {
  const n = ladder.stages.length;
  const cap = ladder.stages.map((s) => s.c);
  if (!ladder.stages[n - 1].buffered) cap[n - 1] += ladder.loadCapacitance;
  return cap;
}

// src/engine/modal/dcStates.ts
function dcStates(ladder) {
  const gHigh = dcGain(ladder, ladder.driverHigh);
  const equal = ladder.driverHigh === ladder.driverLow;
  const gLow = equal ? gHigh : dcGain(ladder, ladder.driverLow);
  const span = ladder.high - ladder.low;
  return {
    high: gHigh.map((g) => g * ladder.high),
    low: gLow.map((g) => g * ladder.low),
    delta: equal ? gHigh.map((g) => g * span) : gHigh.map((g, i) => g * ladder.high - gLow[i] * ladder.low)
  };
}

// src/engine/modal/cascadeLadder.ts
var MAX_CONDITION = 1e5;
function cascadeLadder(ladder) {
  const ss = stateSpace(ladder);
  const n = ss.n;
  const high = phaseModes(ss.high, ss.sections, ss.capacitance, n);
  const low = phaseModes(ss.low, ss.sections, ss.capacitance, n);
  if (!high || !low) return null;
  const dc = dcStates(ladder);
  const mix = zeros2(n * n);
  const delta = zeros2(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += low.W[i * n + k] * high.V[k * n + j];
      mix[i * n + j] = s;
      delta[i] += high.W[i * n + j] * dc.delta[j];
    }
  }
  return {
    n,
    period: ladder.period,
    high: ladder.high,
    low: ladder.low,
    symmetric: false,
    hi: high.modes,
    lo: low.modes,
    mix,
    delta,
    outLow: dc.low[n - 1],
    outHigh: dc.high[n - 1],
    condition: Math.max(high.condition, low.condition)
  };
}
function phaseModes(sys, sections, capacitance, n) {
  const { A } = sys;
  const V = zeros2(n * n);
  const rate = zeros2(n);
  let col = 0;
  for (let s = 0; s < sections.length; s++) {
    const { first, last } = sections[s];
    const m = last - first + 1;
    const cs = Array.from({ length: m }, (_, i) => Math.sqrt(capacitance[first + i]));
    const S2 = zeros2(m * m);
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) {
        const aij = A[(first + i) * n + first + j];
        const aji = A[(first + j) * n + first + i];
        S2[i * m + j] = 0.5 * (cs[i] * aij / cs[j] + cs[j] * aji / cs[i]);
      }
    }
    const eig = symmetricEigen2(S2, m, { vectors: true });
    for (let j = 0; j < m; j++, col++) {
      const lambda = eig.values[j];
      rate[col] = lambda;
      for (let i = 0; i < m; i++) V[(first + i) * n + col] = eig.vectors[i * m + j] / cs[i];
      for (let t = s + 1; t < sections.length; t++) {
        const { first: f, last: l } = sections[t];
        const size = l - f + 1;
        const block = zeros2(size * size);
        const rhs = zeros2(size);
        for (let i = 0; i < size; i++) {
          for (let k = 0; k < size; k++) block[i * size + k] = A[(f + i) * n + f + k] - (i === k ? lambda : 0);
          let sum = 0;
          for (let k = 0; k < f; k++) sum += A[(f + i) * n + k] * V[k * n + col];
          rhs[i] = -sum;
        }
        const x = solveLinear(block, size, rhs);
        if (!x) return null;
        for (let i = 0; i < size; i++) V[(f + i) * n + col] = x[i];
      }
    }
  }
  const W = solveLinear(V, n, Array.from({ length: n * n }, (_, i) => i % (n + 1) === 0 ? 1 : 0), n);
  if (!W || !(normInf(V, n) * normInf(W, n) <= MAX_CONDITION)) return null;
  const out = zeros2(n);
  for (let i = 0; i < n; i++) out[i] = V[(n - 1) * n + i];
  const Vb = zeros2(n * n);
  const Wb = zeros2(n * n);
  for (let i = 0; i < n; i++) {
    const s = Math.sqrt(capacitance[i]);
    for (let j = 0; j < n; j++) {
      Vb[i * n + j] = V[i * n + j] * s;
      Wb[j * n + i] = W[j * n + i] / s;
    }
  }
  return { modes: { rate, out }, V, W, condition: normInf(Vb, n) * normInf(Wb, n) };
}

// src/engine/modal/modalLadder.ts
function modalLadder(ladder) {
  const { stages: stages2 } = ladder;
  const n = stages2.length;
  for (let k = 0; k < n - 1; k++) if (stages2[k].buffered) return cascadeLadder(ladder);
  const circuit = stages2[n - 1].buffered ? { ...ladder, loadResistance: null, loadCapacitance: 0 } : ladder;
  return modalLadderOf(
    circuit,
    stages2.map((s) => s.r),
    stages2.map((s) => s.c)
  );
}

// src/engine/recentLadders.ts
function rememberRecentLadders(compute, size = 8) {
  const recent = [];
  return (ladder) => {
    for (let i = 0; i < recent.length; i++) {
      if (recent[i][0] === ladder) {
        const entry = recent[i];
        if (i > 0) {
          recent.splice(i, 1);
          recent.unshift(entry);
        }
        return entry[1];
      }
    }
    const value = compute(ladder);
    recent.unshift([ladder, value]);
    if (recent.length > size) recent.pop();
    return value;
  };
}

// src/engine/modalRoute.ts
var MAX_MODAL_CONDITION = 30;
var modalRoute = rememberRecentLadders(chooseModalRoute);
function chooseModalRoute(ladder) {
  checkLadder(ladder);
  if (ladder.stages.length < 2) return null;
  const m = modalLadder(ladder);
  return m && m.condition <= MAX_MODAL_CONDITION ? m : null;
}

// src/engine/prepare.ts
var prepare = rememberRecentLadders(prepareLadder);
function prepareLadder(ladder) {
  const system = stateSpace(ladder);
  const { n } = system;
  const gHigh = dcGain(ladder, ladder.driverHigh);
  const gLow = ladder.driverHigh === ladder.driverLow ? gHigh : dcGain(ladder, ladder.driverLow);
  const span = ladder.high - ladder.low;
  const delta = ladder.driverHigh === ladder.driverLow ? gHigh.map((g) => g * span) : gHigh.map((g, i) => g * ladder.high - gLow[i] * ladder.low);
  const prepared = {
    n,
    period: ladder.period,
    system,
    xHigh: gHigh.map((g) => g * ladder.high),
    xLow: gLow.map((g) => g * ladder.low),
    delta,
    balance: system.capacitance.map(Math.sqrt),
    cells: n === 1 ? 1 : n === 2 ? 8 : 32,
    plans: /* @__PURE__ */ new Map()
  };
  return prepared;
}

// src/engine/settlingSteps.ts
function settlingSteps(project) {
  const { min, max } = project.pwm.duty;
  const s = project.spec.settling;
  const given = s?.from !== void 0 || s?.to !== void 0;
  const fullScale = Math.abs(project.pwm.high - project.pwm.low);
  const band = s?.band ?? (project.lsb !== void 0 ? 0.5 * project.lsb : 1e-3 * fullScale);
  const steps = given ? [[s?.from ?? min, s?.to ?? max]] : [
    [min, max],
    [max, min]
  ];
  return { band, steps, defaultStep: !given };
}

// src/design/designInputError.ts
var DesignInputError = class extends InputError {
  name = "DesignInputError";
};

// src/design/projectAtResolution.ts
function projectAtResolution(project, bits) {
  const { pwm } = project;
  if (pwm.clock === void 0) throw new DesignInputError("needs pwm.clock", "search.bits", project.file);
  const frequency = derivePwmFrequency({ clock: pwm.clock, bits, prescaler: pwm.prescaler, alignment: pwm.alignment });
  const lsb = (pwm.high - pwm.low) / 2 ** bits;
  const inLsb = project.specInLsb ?? {};
  const spec = { ...project.spec };
  if (inLsb.ripple !== void 0) spec.ripple = inLsb.ripple * lsb;
  if (inLsb.droop !== void 0) spec.droop = inLsb.droop * lsb;
  if (inLsb.inl !== void 0) spec.inl = inLsb.inl * lsb;
  if (inLsb.band !== void 0 && spec.settling) spec.settling = { ...spec.settling, band: inLsb.band * lsb };
  return { ...project, pwm: { ...pwm, bits, frequency }, lsb, spec };
}

// src/design/designProblem.ts
function designProblem(project, bits, buffered = false) {
  const search = project.search;
  if (!search) throw new DesignInputError(`missing; add a search section (stages, series, resistance, capacitance) to design a filter`, "search", project.file);
  const at = bits === void 0 ? project : projectAtResolution(project, bits);
  const { pwm, spec } = at;
  const rValues = seriesValues(search.series.resistor, search.resistance.min, search.resistance.max);
  const cValues = seriesValues(search.series.capacitor, search.capacitance.min, search.capacitance.max);
  if (rValues.length === 0) throw new DesignInputError(`no ${search.series.resistor} value lies in the range`, "search.resistance", project.file);
  if (cValues.length === 0) throw new DesignInputError(`no ${search.series.capacitor} value lies in the range`, "search.capacitance", project.file);
  for (const n of search.stages) {
    if (!Number.isInteger(n) || n < 1 || n > 3) throw new DesignInputError(`${n} is not 1, 2 or 3`, "search.stages", project.file);
  }
  const { min: dutyMin, max: dutyMax } = pwm.duty;
  const settling = spec.settling;
  const plan = settlingSteps(at);
  const steps = plan.steps.map(([from2, to2]) => [from2, to2]);
  const limits = {
    ...spec.ripple !== void 0 && { ripple: spec.ripple },
    ...spec.droop !== void 0 && { droop: spec.droop },
    ...spec.inl !== void 0 && { inl: spec.inl },
    ...spec.gain !== void 0 && { gain: spec.gain },
    ...settling?.time !== void 0 && { settlingTime: settling.time },
    ...search.pinCurrent !== void 0 && { pinCurrent: search.pinCurrent }
  };
  const margin = search.margin;
  const searchLimits = {};
  for (const key of Object.keys(limits)) searchLimits[key] = limits[key] * (1 - margin);
  const base = {
    period: 1 / pwm.frequency,
    high: pwm.high,
    low: pwm.low,
    driverHigh: pwm.driver.high,
    driverLow: pwm.driver.low,
    loadResistance: at.load.resistance ?? null,
    loadCapacitance: at.load.capacitance
  };
  const seen = buffered ? { ...base, loadResistance: null, loadCapacitance: 0 } : base;
  const last = (k, n) => buffered && k === n - 1;
  return {
    project: at,
    bits: pwm.bits ?? null,
    lsb: at.lsb ?? null,
    frequency: pwm.frequency,
    period: 1 / pwm.frequency,
    dutyMin,
    dutyMax,
    limits,
    searchLimits,
    margin,
    buffered,
    band: plan.band,
    steps,
    defaultStep: plan.defaultStep,
    stageCounts: [...search.stages].sort((a, b) => a - b),
    series: search.series.resistor === search.series.capacitor ? search.series.resistor : `${search.series.resistor} resistors, ${search.series.capacitor} capacitors`,
    resistorSeries: search.series.resistor,
    capacitorSeries: search.series.capacitor,
    rValues,
    cValues,
    circuit: seen,
    ladderOf: (r, c) => {
      const stages2 = [];
      for (let k = 0; k < r.length; k++) stages2.push({ r: r[k], c: c[k], buffered: last(k, r.length) });
      return { ...base, stages: stages2 };
    }
  };
}

// ../../tmp/i3-mb/cnt/speed3.ts
var p = loadProject(process.argv[3]);
var problem = designProblem(p);
var seed = 7;
var rnd = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
var pick = (a) => a[Math.floor(rnd() * a.length)];
var stages = Number(process.argv[4] ?? 3);
var [from, to] = problem.steps[0];
var which = process.argv[2];
var cases = [];
while (cases.length < 2e3) {
  const r = Array.from({ length: stages }, () => pick(problem.rValues)), c = Array.from({ length: stages }, () => pick(problem.cValues));
  const fm = fastLadderOf(problem.circuit, r, c);
  const fa = fastSteadyState(fm, from), fb = fastSteadyState(fm, to);
  const settles = fastSettlingBound(fm, from, to, problem.band, fa, fb) !== Infinity;
  if (which.endsWith("settle") && !settles) continue;
  const m = modalLadderOf(problem.circuit, r, c);
  cases.push({ r, c, fm, fa, fb, m, a: periodicState(m, from), b: periodicState(m, to) });
}
var sink = 0;
var run = () => {
  if (which === "base-build") for (const k of cases) sink += fastLadderOf(problem.circuit, k.r, k.c).n;
  if (which === "new-build") for (const k of cases) sink += modalLadderOf(problem.circuit, k.r, k.c).n;
  if (which === "base-steady") for (const k of cases) sink += fastSteadyState(k.fm, 0.5).ripple;
  if (which === "new-steady") for (const k of cases) sink += steadySwing(k.m, 0.5, periodicState(k.m, 0.5)).ripple;
  if (which === "new-periodic") for (const k of cases) sink += periodicState(k.m, 0.5).average;
  if (which === "base-settle") for (const k of cases) sink += fastSettlingBound(k.fm, from, to, problem.band, k.fa, k.fb);
  if (which === "new-settle") for (const k of cases) sink += settlingLowerBound(k.m, from, to, problem.band, k.a, k.b);
};
for (let i = 0; i < 10; i++) run();
var ts = [];
for (let rep = 0; rep < 11; rep++) {
  const t0 = performance.now();
  for (let i = 0; i < 3; i++) run();
  ts.push(performance.now() - t0);
}
ts.sort((a, b) => a - b);
console.log(which.padEnd(14), stages, (ts[5] / (3 * cases.length) * 1e3).toFixed(3), "us", sink !== 0);
