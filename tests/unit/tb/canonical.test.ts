import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { canonicalJson, documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import { sha256Hex } from "@/lib/tb/sha256";

const raw = (name: string) => JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8"));

describe("sha256", () => {
  it("matches the FIPS 180-2 test vectors", () => {
    // FIPS PUB 180-2 (2002), Appendix B.1 and B.2
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(sha256Hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")).toBe(
      "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
    );
  });
  it("matches the well-known digest of the empty string and node:crypto on multi-block UTF-8 input", async () => {
    expect(sha256Hex("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
    const { createHash } = await import("node:crypto");
    const text = "Γ–X ångström ".repeat(97);
    expect(sha256Hex(text)).toBe(createHash("sha256").update(text, "utf8").digest("hex"));
  });
});

describe("canonical serialisation", () => {
  it("sorts keys, writes −0 as 0, keeps numbers exact and refuses NaN", () => {
    expect(canonicalJson({ b: 1, a: [0.1, -0, 1e-7, 123456789012345680000], c: { z: "x", y: true } })).toBe(
      '{"a":[0.1,0,1e-7,123456789012345680000],"b":1,"c":{"y":true,"z":"x"}}',
    );
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(/NaN/);
  });

  it("round-trips every document without losing a field (compact and pretty)", () => {
    for (const name of ["demo-sp-chain", "demo-honeycomb-pz", "demo-diamond-sp3s"]) {
      const input = raw(name);
      const doc = parseModelDocument(input);
      expect(parseModelDocument(JSON.parse(canonicalJson(doc)))).toEqual(input);
      expect(JSON.parse(canonicalJson(doc, { pretty: true }))).toEqual(input);
      expect(canonicalJson(parseModelDocument(JSON.parse(canonicalJson(doc))))).toBe(canonicalJson(doc));
    }
  });

  it("does not depend on key order in the input", () => {
    const input = raw("demo-sp-chain");
    const reversed = Object.fromEntries(Object.entries(input).reverse());
    expect(documentHash(parseModelDocument(reversed))).toBe(documentHash(parseModelDocument(input)));
  });

  it("physics hash ignores metadata edits but not parameter or geometry edits", () => {
    const doc = parseModelDocument(raw("demo-diamond-sp3s"));
    const meta = { ...doc, name: "renamed", description: "new words", provenance: { ...doc.provenance, notes: "more notes" }, validity: { temperature: [0, 10] as [number, number] } };
    expect(physicsHash(meta)).toBe(physicsHash(doc));
    expect(documentHash(meta)).not.toBe(documentHash(doc));
    expect(physicsHash(setParameters(doc, { "shell/X-X/1/pp_pi": -0.91 }))).not.toBe(physicsHash(doc));
    const moved = structuredClone(doc);
    moved.sites[1].position = [1.375, 1.375, 1.376];
    expect(physicsHash(moved)).not.toBe(physicsHash(doc));
  });
});
