export { parseReferenceBands, referenceChecksum, isJsonUpload } from "./parse";
export { resolveReferenceBands, type ResolvedReferenceBands } from "./resolve";
export { REFERENCE_PROVENANCE_SCHEMA, type ReferenceProvenance } from "./provenance";
export { REFERENCE_BANDS_JSON_SCHEMA } from "./parse-json";
export { ReferenceBandsError, REFERENCE_LIMITS, type ParsedReferenceBands, type ReferenceIssue, type KSource, type KKind } from "./types";
export { ENERGY_UNIT_FACTORS, RYDBERG_EV, HARTREE_EV, BOHR_ANGSTROM, type EnergyUnit } from "./units";
