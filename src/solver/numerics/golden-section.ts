// A maximum without derivatives: golden-section search.

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Maximum of a unimodal fn on [a, b] to within `tolerance` in x by golden-section search (Press et al., Numerical Recipes 3rd ed. sec. 10.2). */
export function goldenSectionMax(fn: (t: number) => number, a: number, b: number, tolerance: number): { t: number; value: number } {
  let x1 = b - GOLDEN * (b - a);
  let x2 = a + GOLDEN * (b - a);
  let f1 = fn(x1);
  let f2 = fn(x2);
  while (b - a > tolerance) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + GOLDEN * (b - a);
      f2 = fn(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - GOLDEN * (b - a);
      f1 = fn(x1);
    }
  }
  // Interior points only: callers compare with the ends themselves where an edge can win.
  return f1 >= f2 ? { t: x1, value: f1 } : { t: x2, value: f2 };
}
