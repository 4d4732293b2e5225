import { describe, expect, it } from "vitest";
import { BOHR_ANGSTROM, HARTREE_EV, parseReferenceBands, REFERENCE_PROVENANCE_SCHEMA, referenceChecksum, RYDBERG_EV } from "@/lib/reference-bands";

const lines = (...rows: string[]) => rows.join("\n") + "\n";

describe("unit conversions (CODATA 2018: Tiesinga, Mohr, Newell, Taylor, Rev. Mod. Phys. 93, 025010 (2021))", () => {
  it("energies: 1 Ry = 13.605693122994 eV, 1 Hartree = 27.211386245988 eV, 1 meV = 0.001 eV", () => {
    const text = lines("k_index,E1 (Ry),E2 (Hartree),E3 (meV),E4 (eV),E5 (Ha),E6 (rydberg)", "0,1,1,1,1,-2,0.5");
    const [row] = parseReferenceBands("u.csv", text).energies;
    // CODATA 2018 Rydberg energy R∞hc = 13.605693122994 eV
    expect(row[0]).toBe(13.605693122994);
    // CODATA 2018 Hartree energy E_h = 27.211386245988 eV
    expect(row[1]).toBe(27.211386245988);
    expect(row[2]).toBe(0.001);
    expect(row[3]).toBe(1);
    expect(row[4]).toBe(-2 * 27.211386245988);
    expect(row[5]).toBeCloseTo(13.605693122994 / 2, 14);
    // E_h = 2 R∞hc (Tiesinga et al. 2021), to the 14 digits both values carry
    expect(HARTREE_EV / RYDBERG_EV).toBeCloseTo(2, 12);
  });

  it("path lengths: 1/bohr with a₀ = 0.529177210903 Å (CODATA 2018)", () => {
    expect(BOHR_ANGSTROM).toBe(0.529177210903);
    const parsed = parseReferenceBands("u.csv", lines("k_path (1/bohr),E1 (eV)", "0,0", "1,0"));
    expect(parsed.k[1][0]).toBeCloseTo(1 / 0.529177210903, 13);
    const å = parseReferenceBands("u.csv", lines("k_path (Å^-1),E1 (eV)", "0,0", "1,0"));
    expect(å.k[1][0]).toBe(1);
  });

  it("the JSON form converts energies and the Fermi level with the same factors", () => {
    const json = { format: "bandgate-reference-bands", version: 1, energyUnit: "Ry", k: { kind: "index", values: [0] }, energies: [[1, null]], fermiLevel: -0.5 };
    const parsed = parseReferenceBands("u.json", JSON.stringify(json));
    // CODATA 2018 Rydberg energy
    expect(parsed.energies).toEqual([[13.605693122994, null]]);
    expect(parsed.fermiLevel).toBe(-0.5 * 13.605693122994);
  });
});

describe("checksum", () => {
  it("is SHA-256 in lowercase hex (FIPS 180-2, Appendix B.1: 'abc')", () => {
    expect(referenceChecksum("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("changes with any byte of the upload", () => {
    expect(referenceChecksum("k_index,E1 (eV)\n0,1\n")).not.toBe(referenceChecksum("k_index,E1 (eV)\n0,1.0\n"));
  });
});

describe("provenance of reference bands", () => {
  const valid = { method: "  DFT-PBE ", code: "a plane-wave code, version 7.2", structureSource: "experimental lattice constant" };

  it("trims text and keeps optional fields optional", () => {
    expect(REFERENCE_PROVENANCE_SCHEMA.parse(valid)).toEqual({ method: "DFT-PBE", code: "a plane-wave code, version 7.2", structureSource: "experimental lattice constant" });
    const full = { ...valid, functional: "PBE", alignmentNote: "VBM at 0", notes: "spin–orbit off" };
    expect(REFERENCE_PROVENANCE_SCHEMA.parse(full)).toMatchObject({ functional: "PBE", alignmentNote: "VBM at 0", notes: "spin–orbit off" });
  });

  it("names what is missing, too long or unknown", () => {
    const result = REFERENCE_PROVENANCE_SCHEMA.safeParse({ method: "   ", structureSource: "x".repeat(501), notes: 7, kMesh: "8x8x8" });
    expect(result.success).toBe(false);
    const messages = result.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    expect(messages).toEqual([
      'method: method is required, e.g. "DFT-PBE"',
      'code: code is required, e.g. "the program\'s name and version"',
      "structureSource: structureSource must be at most 500 characters",
      "notes: notes must be text",
      ': Unrecognized key: "kMesh"',
    ]);
  });
});
