import type { ModelDocument } from "./document-schema";

/**
 * The size of H(k): orbitals per cell, doubled when the document has spin–orbit coupling (the basis then holds every
 * orbital spin up and spin down). Every band computation costs about the cube of this number per k-point.
 */
export function basisSize(doc: Pick<ModelDocument, "sites" | "spinOrbit">): number {
  const orbitals = doc.sites.reduce((n, site) => n + site.orbitals.length, 0);
  return Object.keys(doc.spinOrbit ?? {}).length > 0 ? 2 * orbitals : orbitals;
}

/** The one message for a document whose basis is above an instance's limit. */
export function basisTooLargeMessage(doc: Pick<ModelDocument, "sites" | "spinOrbit">, limit: number): string {
  const size = basisSize(doc);
  const spinful = Object.keys(doc.spinOrbit ?? {}).length > 0;
  const how = spinful ? `${size / 2} orbitals per cell, doubled by spin–orbit` : `${size} orbitals per cell`;
  return `The model's basis has ${size} states (${how}); this Bandgate accepts models of at most ${limit} states.`;
}
