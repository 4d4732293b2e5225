import { syntheticReference } from "@/tests/integration/fit-world";
import { reliabilitySettings } from "../settings";
import type { World } from "../world";
import { JSON_TYPE, type BadCase } from "./case";
import { damageText, mutate, pick, type Rng } from "./mutate";
import { FIELD_VALUES, isRaw, NASTY_STRINGS, toJsonText, type Labelled } from "./values";

/** What the upload form sends: the file's name and text, the set's name and its provenance fields. */
interface Fields {
  name?: unknown;
  fileName?: unknown;
  content?: unknown;
  provenance?: Record<string, unknown>;
}

const CSV_CELLS: readonly string[] = ["NaN", "inf", "-Infinity", "1e308", "-1e308", "1e999", "", " ", "\u0000", "0x10", '"1,5"', '"unterminated', "\u0661\u0662", "\u22121", "1e-400", "9".repeat(400), "+-1", "1_000"];
const CSV_HEADERS: readonly string[] = ["E1 (MeV)", "E1", "", "k_index", "E1 (eV)\u0000", "band_1 [eV", "k1", "k_path (1/parsec)", "E1 (eV) (eV)"];

/** Seeded damage to a CSV file: cells, header, rows and bytes. */
function mutateCsv(rng: Rng, csv: string): { text: string | Buffer; summary: string } {
  const rows = csv.trimEnd().split("\n").map((r) => r.split(","));
  const at = 1 + Math.floor(rng() * (rows.length - 1));
  const col = Math.floor(rng() * rows[0].length);
  const join = (rs: string[][]) => rs.map((r) => r.join(",")).join("\n");
  switch (Math.floor(rng() * 8)) {
    case 0: {
      const cell = pick(rng, CSV_CELLS);
      rows[at][col] = cell;
      return { text: join(rows), summary: `row ${at + 1} column ${col + 1} → ${JSON.stringify(cell).slice(0, 30)}` };
    }
    case 1: {
      const cell = pick(rng, CSV_HEADERS);
      rows[0][col] = cell;
      return { text: join(rows), summary: `header column ${col + 1} → ${JSON.stringify(cell)}` };
    }
    case 2:
      rows[at].splice(col, 1);
      return { text: join(rows), summary: `row ${at + 1} lost a cell` };
    case 3:
      rows[at].push("0");
      return { text: join(rows), summary: `row ${at + 1} got an extra cell` };
    case 4: {
      const times = 2 + Math.floor(rng() * 5);
      rows.splice(at, 0, ...Array.from({ length: times }, () => rows[at]));
      return { text: join(rows), summary: `row ${at + 1} repeated ×${times}` };
    }
    case 5:
      return { text: join([rows[0], ...rows.slice(1).reverse()]), summary: "data rows reversed" };
    case 6:
      return { text: join(rows.slice(0, at)), summary: `only the first ${at} lines` };
    default: {
      const d = damageText(rng, csv);
      return { text: d.bytes, summary: d.summary };
    }
  }
}

/** Reference band files, their names and provenance through the upload route the proposal page uses. */
export function uploadCases(world: World, rng: Rng): BadCase[] {
  const proposalId = world.proposals.uploads;
  const json = syntheticReference(world.board.base, 0.002, 31);
  const energies = (JSON.parse(json) as { energies: number[][] }).energies;
  const csv = [`k_index,${energies[0].map((_, b) => `E${b + 1} (eV)`).join(",")}`, ...energies.map((row, i) => `${i},${row.map((e) => e.toFixed(6)).join(",")}`)].join("\n") + "\n";
  const provenance = { method: "synthetic", code: "probe 1.0", structureSource: "the model's lattice" };
  const valid = { name: "Probe reference", provenance };
  const text = (content: string | Buffer) => (Buffer.isBuffer(content) ? content.toString("utf8") : content);
  const file = (content: string | Buffer, fileName = "reference.csv") => ({ fileName, content: text(content) });

  const upload = (summary: string, fields: () => Fields, headers: Record<string, string> = {}, target = proposalId): BadCase => ({
    route: "POST /api/proposals/:id/reference-bands",
    summary,
    auth: "author",
    judge: "status",
    build: () => ({
      method: "POST",
      path: `/api/proposals/${target}/reference-bands`,
      headers: { "content-type": JSON_TYPE, origin: reliabilitySettings().baseUrl, ...headers },
      body: JSON.stringify(fields()),
    }),
  });
  const padded = (bytes: number) => `${"#".repeat(bytes - csv.length - 1)}\n${csv}`;
  const stringFields = FIELD_VALUES.filter(([, v]) => typeof v === "string" && !isRaw(v)) as Labelled<string>[];

  return [
    ...Array.from({ length: 60 }, () => {
      const m = mutateCsv(rng, csv);
      return upload(`CSV: ${m.summary}`, () => ({ ...valid, ...file(m.text) }));
    }),
    ...Array.from({ length: 40 }, () => {
      const m = mutate(rng, JSON.parse(json));
      return upload(`JSON: ${m.summary}`, () => ({ ...valid, ...file(toJsonText(m.value), "reference.json") }));
    }),
    upload("CSV: 501 band columns", () => ({ ...valid, ...file(`k_index,${Array.from({ length: 501 }, (_, b) => `E${b + 1} (eV)`).join(",")}\n0,${"0,".repeat(500)}0\n`) })),
    upload("CSV: 20,001 rows", () => ({ ...valid, ...file(`k_index,E1 (eV)\n${Array.from({ length: 20_001 }, (_, i) => `${i},0`).join("\n")}\n`) })),
    ...NASTY_STRINGS.map(([l, v]) => upload(`file name = ${l}`, () => ({ ...valid, ...file(csv, v) }))),
    ...stringFields.map(([l, v]) => upload(`name = ${l}`, () => ({ ...valid, name: v, ...file(csv) }))),
    ...["method", "code", "structureSource", "alignmentNote"].flatMap((field) =>
      stringFields.filter(([l]) => ["NUL inside", "CR/LF header injection", "100,001 chars", "empty string"].includes(l)).map(([l, v]) => upload(`${field} = ${l}`, () => ({ ...valid, provenance: { ...provenance, [field]: v }, ...file(csv) }))),
    ),
    upload("empty file", () => ({ ...valid, ...file("") })),
    upload("0.9 MB file (valid, padded with comments)", () => ({ ...valid, ...file(padded(900_000)) })),
    upload("1.5 MB file (valid, padded with comments)", () => ({ ...valid, ...file(padded(1_500_000)) })),
    upload("6 MB file (over the 5 MiB limit)", () => ({ ...valid, ...file(padded(6_000_000)) })),
    upload("no file", () => ({ ...valid })),
    upload("file content as a number", () => ({ ...valid, fileName: "reference.csv", content: 42 })),
    upload("provenance as a string", () => ({ ...valid, provenance: "dft" as unknown as Record<string, unknown>, ...file(csv) })),
    upload("proposal id = not a uuid", () => ({ ...valid, ...file(csv) }), {}, "not-a-uuid"),
    upload("proposal id = nil uuid", () => ({ ...valid, ...file(csv) }), {}, "00000000-0000-0000-0000-000000000000"),
    upload("sent as text/plain", () => ({ ...valid, ...file(csv) }), { "content-type": "text/plain" }),
  ];
}
