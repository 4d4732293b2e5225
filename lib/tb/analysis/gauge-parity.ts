/**
 * Signs σ_v ∈ {+1, −1} per variable such that σ_a·σ_b = (flip ? −1 : +1) for every constraint: a linear system
 * over GF(2), solved by walking each connected component (breadth-first) and checking every edge.
 * In each component the solution with fewer flips is kept (ties: the first variable, in the given order, unflipped).
 */
export interface SignConstraint {
  a: string;
  b: string;
  flip: boolean;
  /** What produced the constraint, for the explanation (e.g. a parameter key). */
  source: string;
}

export type SignSolution = { consistent: true; flipped: string[] } | { consistent: false; conflict: string };

export function solveSignFlips(variables: string[], constraints: SignConstraint[]): SignSolution {
  const edges = new Map<string, { to: string; flip: boolean; source: string }[]>(variables.map((v) => [v, []]));
  for (const c of constraints) {
    for (const v of [c.a, c.b]) if (!edges.has(v)) throw new Error(`gauge: unknown variable ${v}`);
    edges.get(c.a)!.push({ to: c.b, flip: c.flip, source: c.source });
    edges.get(c.b)!.push({ to: c.a, flip: c.flip, source: c.source });
  }
  const value = new Map<string, boolean>();
  const flipped: string[] = [];
  for (const root of variables) {
    if (value.has(root)) continue;
    const component: string[] = [root];
    value.set(root, false);
    for (let i = 0; i < component.length; i++) {
      const v = component[i];
      for (const e of edges.get(v)!) {
        const want = value.get(v) !== e.flip;
        const have = value.get(e.to);
        if (have === undefined) {
          value.set(e.to, want);
          component.push(e.to);
        } else if (have !== want) {
          return { consistent: false, conflict: e.source };
        }
      }
    }
    const ones = component.filter((v) => value.get(v));
    flipped.push(...(ones.length * 2 > component.length ? component.filter((v) => !value.get(v)) : ones));
  }
  return { consistent: true, flipped: variables.filter((v) => flipped.includes(v)) };
}
