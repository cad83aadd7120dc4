
const GRID = 8;
const INV_PHI = (Math.sqrt(5) - 1) / 2;

/**
 * The largest value of f(duty) found over [dutyMin, dutyMax], e.g. the ripple or the |DC error| of
 * the fast model: a lower bound on the maximum (every value returned is f at some duty of the
 * range), equal to it when the maximum lies in the bracket found on the grid.
 *
 * Method: ripple at GRID + 1 evenly spaced duties, then golden-section search (Kiefer 1953;
 * Press et al., Numerical Recipes, 3rd ed., section 10.2) on the two cells around the best grid
 * point, to 1e-7 in duty.
 *
 * Syntax: maximizeOverDuty(f, dutyMin, dutyMax)
 * Example: maximizeOverDuty((d) => fastSteadyState(model, d).ripple, 0.05, 0.95)   // worst ripple, V (a lower bound)
 */
export function maximizeOverDuty(ripple: (duty: number) => number, dutyMin: number, dutyMax: number): number {
  if (!(dutyMax > dutyMin)) return ripple(dutyMin);
  const h = (dutyMax - dutyMin) / GRID;
  let bestI = 0;
  let best = -Infinity;
  for (let i = 0; i <= GRID; i++) {
    const v = ripple(i === GRID ? dutyMax : dutyMin + i * h);
    if (v > best) {
      best = v;
      bestI = i;
    }
  }
  let a = dutyMin + Math.max(0, bestI - 1) * h;
  let b = Math.min(dutyMax, dutyMin + (bestI + 1) * h);
  let x1 = b - INV_PHI * (b - a);
  let x2 = a + INV_PHI * (b - a);
  let f1 = ripple(x1);
  let f2 = ripple(x2);
  while (b - a > 1e-7) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + INV_PHI * (b - a);
      f2 = ripple(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - INV_PHI * (b - a);
      f1 = ripple(x1);
    }
  }
  return Math.max(best, f1, f2);
}
