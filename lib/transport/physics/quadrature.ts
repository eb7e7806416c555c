// Gauss–Legendre quadrature (nodes by Newton iteration on P_n; Abramowitz & Stegun 25.4.29).

type Rule = { nodes: Float64Array; weights: Float64Array };
const rules = new Map<number, Rule>();

function gaussLegendre(n: number): Rule {
  const cached = rules.get(n);
  if (cached) return cached;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5)); // Tricomi's initial guess
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) [p0, p1] = [p1, ((2 * k - 1) * x * p1 - (k - 1) * p0) / k]; // Bonnet recursion
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = weights[n - 1 - i] = 2 / ((1 - x * x) * dp * dp);
  }
  const rule = { nodes, weights };
  rules.set(n, rule);
  return rule;
}

/** ∫_a^b f(x) dx by composite 20-point Gauss–Legendre on panels no wider than `maxPanelWidth`. */
export function integrate(f: (x: number) => number, a: number, b: number, maxPanelWidth = 1): number {
  if (b === a) return 0;
  const { nodes, weights } = gaussLegendre(20);
  const panels = Math.max(1, Math.ceil(Math.abs(b - a) / maxPanelWidth));
  const h = (b - a) / panels;
  let total = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h;
    let s = 0;
    for (let i = 0; i < nodes.length; i++) s += weights[i] * f(mid + (h / 2) * nodes[i]);
    total += (s * h) / 2;
  }
  return total;
}
