import { z } from "zod";
import { BOND_KEYS, ORBITALS } from "./orbitals";
import { CONVENTION_SCHEMA } from "./conventions";

const finite = z.number().refine(Number.isFinite, { message: "must be a finite number (NaN and Infinity are not allowed)" });
const vec3 = z.tuple([finite, finite, finite]);
const range = z.tuple([finite, finite]).refine(([lo, hi]) => lo <= hi, { message: "lower bound must not exceed upper bound" });
const label = z.string().min(1).max(64);
const species = z
  .string()
  .regex(/^[A-Za-z][A-Za-z0-9_]*$/, { message: "species names use letters, digits and _ and start with a letter" })
  .max(32);

const bondParams = z.record(z.string(), finite).superRefine((params, ctx) => {
  for (const key of Object.keys(params)) {
    if (!BOND_KEYS.includes(key)) {
      ctx.addIssue({ code: "custom", path: [key], message: `unknown Slater–Koster key "${key}" (expected <t1><t2>_<m> with t1, t2 in s, s*, p, d and m in sigma, pi, delta allowed for that pair)` });
    }
  }
});

export const SITE_SCHEMA = z.strictObject({
  label,
  species,
  position: vec3.describe("Cartesian position, Å"),
  orbitals: z.array(z.enum(ORBITALS)).min(1),
});

export const SHELL_SCHEMA = z.strictObject({
  species: z.tuple([species, species]).describe("FROM species, TO species: t1 of every key sits on the first"),
  index: z.number().int().min(1).describe("neighbour shell number, 1 = nearest"),
  distance: finite.refine((d) => d > 0, { message: "must be positive" }).describe("shell distance, Å"),
  tolerance: finite.refine((t) => t > 0, { message: "must be positive" }).optional().describe("Å, default 0.001"),
  params: bondParams.describe("two-centre integrals, eV"),
});

const orbitalRef = z.strictObject({ site: label, orbital: z.enum(ORBITALS) });

export const HOPPING_SCHEMA = z.strictObject({
  from: orbitalRef,
  to: orbitalRef,
  translation: z.array(z.number().int()).min(1).max(3).describe("lattice translation of the TO orbital, in primitive vectors"),
  value: z.strictObject({ re: finite, im: finite.optional() }).describe("eV; its Hermitian conjugate is added too"),
});

const STANDARD_LATTICES = ["chain", "square", "rectangular", "hexagonal", "cubic", "fcc", "bcc", "hcp", "tetragonal"] as const;
export type StandardLattice = (typeof STANDARD_LATTICES)[number];

/** Every band view samples the path at this many points, so its size bounds their cost (as many as a reference file's rows). */
const pointsTotal = z.number().int().min(2).max(20_000).optional();
const PATH_LABELS_MAX = 64;

export const KPATH_SCHEMA = z.discriminatedUnion("type", [
  z.strictObject({
    type: z.literal("standard"),
    lattice: z.enum(STANDARD_LATTICES),
    pointsTotal,
  }),
  z.strictObject({
    type: z.literal("custom"),
    points: z
      .record(label, z.array(finite).min(1).max(3))
      .refine((points) => Object.keys(points).length <= PATH_LABELS_MAX, { message: `at most ${PATH_LABELS_MAX} labelled points` })
      .describe("fractional coordinates in the reciprocal primitive vectors"),
    segments: z
      .array(z.array(label).min(2).max(PATH_LABELS_MAX))
      .min(1)
      .max(PATH_LABELS_MAX)
      .describe("each inner list is one continuous run of labels"),
    pointsTotal,
  }),
]);

export const VALIDITY_SCHEMA = z.strictObject({
  strain: range.optional().describe("fractional strain"),
  temperature: range.optional().describe("K"),
  energyWindow: range.optional().describe("eV, in the document's energy zero"),
  notes: z.string().optional(),
});

export const PROVENANCE_SCHEMA = z.strictObject({
  referenceMethod: z.string().min(1),
  referenceCode: z.string().optional(),
  functional: z.string().optional(),
  structureSource: z.string().min(1),
  kMesh: z.string().optional(),
  fitWindow: range.optional(),
  fitWeights: z.string().optional(),
  notes: z.string().optional(),
  citations: z.record(z.string(), z.string().min(1)).describe("parameter key → citation or reason why none"),
});

export const MODEL_DOCUMENT_SCHEMA = z.strictObject({
  format: z.literal("bandgate-model"),
  version: z.literal(1),
  name: z.string().min(1).max(200),
  description: z.string().optional(),
  conventions: CONVENTION_SCHEMA,
  lattice: z.strictObject({
    dimension: z.union([z.literal(1), z.literal(2), z.literal(3)]),
    vectors: z.array(vec3).min(1).max(3).describe("primitive vectors (rows), Cartesian Å"),
  }),
  sites: z.array(SITE_SCHEMA).min(1),
  onsite: z.record(species, z.record(z.string(), finite)).describe("species → orbital → energy, eV"),
  shells: z.array(SHELL_SCHEMA),
  hoppings: z.array(HOPPING_SCHEMA).optional(),
  spinOrbit: z.record(species, finite).optional().describe("species → λ (eV) of λ L·S on its p shell"),
  electronCount: finite.refine((n) => n >= 0, { message: "must not be negative" }),
  kPath: KPATH_SCHEMA,
  validity: VALIDITY_SCHEMA,
  provenance: PROVENANCE_SCHEMA,
});

export type ModelDocument = z.infer<typeof MODEL_DOCUMENT_SCHEMA>;
export type SiteSpec = z.infer<typeof SITE_SCHEMA>;
export type ShellSpec = z.infer<typeof SHELL_SCHEMA>;
export type HoppingSpec = z.infer<typeof HOPPING_SCHEMA>;
export type KPathSpec = z.infer<typeof KPATH_SCHEMA>;
