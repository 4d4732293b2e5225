/**
 * sp3s* nearest-neighbour models of P. Vogl, H. P. Hjalmarson and J. D. Dow, J. Phys. Chem. Solids 44, 365 (1983),
 * Table I, values from memory. That table gives Γ-point combinations (V(s,s), V(x,x), V(x,y), V(sa,pc), ...) for
 * bonds d = (a/4)(±1, ±1, ±1); with direction cosines ±1/√3 the two-centre integrals follow as
 * V(s,s) = 4 ss_sigma, V(x,x) = 4/3 pp_sigma + 8/3 pp_pi, V(x,y) = 4/3 (pp_sigma − pp_pi), V(sa,pc) = 4/√3 sp_sigma,
 * V(pa,sc) = 4/√3 ps_sigma (shell from anion to cation; flipping the sign of both s–p pairs together is a gauge
 * change, p → −p on every atom, so only their relative sign is physical).
 */
import type { ModelDocument } from "@/lib/tb/document";
import { buildDocument, FCC } from "./build-document";

export interface VoglParameters {
  anion: string;
  cation: string;
  a: number; // lattice constant, Å (from memory: Si 5.431, GaAs 5.653)
  esA: number; epA: number; esC: number; epC: number; essA: number; essC: number;
  vss: number; vxx: number; vxy: number; vsapc: number; vpasc: number; vssapc: number; vpassc: number;
}

// Vogl, Hjalmarson and Dow (1983), Table I, from memory.
export const SILICON: VoglParameters = {
  anion: "Si", cation: "Si", a: 5.431,
  esA: -4.2, epA: 1.715, esC: -4.2, epC: 1.715, essA: 6.685, essC: 6.685,
  vss: -8.3, vxx: 1.715, vxy: 4.575, vsapc: 5.7292, vpasc: 5.7292, vssapc: 5.3749, vpassc: 5.3749,
};

// Vogl, Hjalmarson and Dow (1983), Table I, from memory (anion As, cation Ga).
export const GALLIUM_ARSENIDE: VoglParameters = {
  anion: "As", cation: "Ga", a: 5.653,
  esA: -8.3431, epA: 1.0414, esC: -2.6569, epC: 3.6686, essA: 8.5914, essC: 6.7386,
  vss: -6.4513, vxx: 1.9546, vxy: 5.0779, vsapc: 4.48, vpasc: 5.7839, vssapc: 4.8422, vpassc: 4.8077,
};

export function twoCentreIntegrals(p: VoglParameters): Record<string, number> {
  const r = Math.sqrt(3) / 4;
  return {
    ss_sigma: p.vss / 4,
    pp_sigma: (p.vxx + 2 * p.vxy) / 4,
    pp_pi: (p.vxx - p.vxy) / 4,
    sp_sigma: r * p.vsapc,
    ps_sigma: r * p.vpasc,
    "s*p_sigma": r * p.vssapc,
    "ps*_sigma": r * p.vpassc,
    "ss*_sigma": 0,
    "s*s_sigma": 0,
    "s*s*_sigma": 0,
  };
}

export function voglDocument(p: VoglParameters): ModelDocument {
  const orbitals = ["s", "px", "py", "pz", "s*"] as const;
  const one = p.anion === p.cation;
  const params = twoCentreIntegrals(p);
  if (one) {
    delete params.ps_sigma;
    delete params["ps*_sigma"];
    delete params["s*s_sigma"];
  }
  const onsite = (es: number, ep: number, ess: number) => ({ s: es, px: ep, py: ep, pz: ep, "s*": ess });
  return buildDocument({
    lattice: { dimension: 3, vectors: FCC(p.a) },
    sites: [
      { label: `${p.anion}1`, species: p.anion, position: [0, 0, 0], orbitals: [...orbitals] },
      { label: `${p.cation}2`, species: p.cation, position: [p.a / 4, p.a / 4, p.a / 4], orbitals: [...orbitals] },
    ],
    onsite: one ? { [p.anion]: onsite(p.esA, p.epA, p.essA) } : { [p.anion]: onsite(p.esA, p.epA, p.essA), [p.cation]: onsite(p.esC, p.epC, p.essC) },
    shells: [{ species: [p.anion, p.cation], index: 1, distance: (p.a * Math.sqrt(3)) / 4, params }],
    electronCount: 8,
  });
}
