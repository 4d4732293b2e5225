import type { Role } from "@/lib/auth/roles";

/**
 * The demo scenario. Everything here is invented: the group, the people and the parameter values.
 * Passwords are listed in README.md; they are for the local demo only.
 */
export const DEMO_GROUP = "Meridian Nanoelectronics Group (fictional demo)";

export const DEMO_PEOPLE: { email: string; name: string; roles: Role[]; password: string }[] = [
  { email: "noor.haddad@meridian.example", name: "Noor Haddad", roles: ["author"], password: "demo-author-2026" },
  { email: "tomasz.wierzbicki@meridian.example", name: "Tomasz Wierzbicki", roles: ["reviewer"], password: "demo-reviewer-2026" },
  { email: "ines.carvalho@meridian.example", name: "Inês Carvalho", roles: ["reviewer", "author"], password: "demo-reviewer-2026" },
  { email: "akira.sato@meridian.example", name: "Akira Sato", roles: ["curator"], password: "demo-curator-2026" },
  { email: "transport-ci@meridian.example", name: "Transport CI (bot)", roles: ["consumer"], password: "demo-consumer-2026" },
  { email: "maren.olsen@meridian.example", name: "Maren Olsen", roles: ["admin"], password: "demo-admin-2026" },
];

export const DEMO_FAMILIES = [
  {
    slug: "sp-chain",
    title: "Two-orbital s + pz chain (demo)",
    description: "A one-dimensional chain with one s and one pz orbital per atom; the smallest model with s–p mixing. Invented values.",
    dimension: 1,
    documentFile: "demo-sp-chain",
    acceptanceCriteria: [{ metric: "gap", target: 1.5, tolerance: 0.3 }],
  },
  {
    slug: "honeycomb-pz",
    title: "Honeycomb pz sheet (demo)",
    description: "A two-dimensional honeycomb sheet with one pz orbital per site and nearest-neighbour hopping. Invented values.",
    dimension: 2,
    documentFile: "demo-honeycomb-pz",
    acceptanceCriteria: [{ metric: "bandwidth", band: 0, target: 8.4, tolerance: 0.5 }],
  },
  {
    slug: "diamond-sp3s",
    title: "Diamond-lattice sp3s* (demo)",
    description: "A three-dimensional diamond-lattice model with s, p and an excited s* orbital on each of the two sites, nearest neighbours only. Invented values.",
    dimension: 3,
    documentFile: "demo-diamond-sp3s",
    acceptanceCriteria: [
      { metric: "gap", target: 1.06, tolerance: 0.15 },
      { metric: "gap-character", direct: false },
    ],
  },
];
