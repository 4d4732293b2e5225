import { changedChain } from "@/tests/support/board-fixtures";
import type { ModelDocument } from "@/lib/tb/document";
import type { World } from "../world";
import { JSON_TYPE, type BadCase, type CaseContext, type RequestSpec } from "./case";
import { damageText, mutate, setAt, type Rng } from "./mutate";
import { deepJsonText, FIELD_VALUES, macroBomb, NASTY_STRINGS, toJsonText, type Labelled } from "./values";

type Valid = (ctx: CaseContext) => Promise<Record<string, unknown>>;

function post(route: string, path: string, summary: string, body: (ctx: CaseContext) => Promise<{ body: Buffer | string; type?: string }>): BadCase {
  return {
    route,
    summary,
    auth: "author",
    judge: "status",
    build: async (ctx): Promise<RequestSpec> => {
      const b = await body(ctx);
      return { method: "POST", path, headers: b.type ? { "content-type": b.type } : {}, body: b.body };
    },
  };
}

/** Whole-body damage that any JSON route must refuse (or, for a different content type, handle) without a 500. */
function bodyCatalogue(valid: Valid): Labelled<(ctx: CaseContext) => Promise<{ body: Buffer | string; type?: string }>>[] {
  const text = async (ctx: CaseContext) => toJsonText(await valid(ctx));
  const firstKey = async (ctx: CaseContext) => Object.keys(await valid(ctx))[0];
  return [
    ["empty body", async () => ({ body: "", type: JSON_TYPE })],
    ["not JSON", async () => ({ body: "not json", type: JSON_TYPE })],
    ["JSON null", async () => ({ body: "null", type: JSON_TYPE })],
    ["JSON array", async () => ({ body: "[]", type: JSON_TYPE })],
    ["JSON string", async () => ({ body: '"text"', type: JSON_TYPE })],
    ["JSON 1e999", async () => ({ body: "1e999", type: JSON_TYPE })],
    ["truncated JSON", async (ctx) => ({ body: (await text(ctx)).slice(0, 40), type: JSON_TYPE })],
    ["BOM before JSON", async (ctx) => ({ body: `\uFEFF${await text(ctx)}`, type: JSON_TYPE })],
    ["trailing garbage", async (ctx) => ({ body: `${await text(ctx)}}}`, type: JSON_TYPE })],
    ["duplicate first key (null first)", async (ctx) => ({ body: `{"${await firstKey(ctx)}":null,${(await text(ctx)).slice(1)}`, type: JSON_TYPE })],
    ["bad UTF-8 bytes in the text", async (ctx) => ({ body: Buffer.concat([Buffer.from((await text(ctx)).slice(0, -1)), Buffer.from(',"x":"'), Buffer.from([0xff, 0xfe, 0xc3, 0x28]), Buffer.from('"}')]), type: JSON_TYPE })],
    ["raw NUL byte in the text", async (ctx) => ({ body: Buffer.concat([Buffer.from((await text(ctx)).slice(0, 1)), Buffer.from([0]), Buffer.from((await text(ctx)).slice(1))]), type: JSON_TYPE })],
    ["arrays nested 100,000 deep", async () => ({ body: deepJsonText(100_000), type: JSON_TYPE })],
    ["first field nested 10,000 deep", async (ctx) => ({ body: `{"${await firstKey(ctx)}":${deepJsonText(10_000)}}`, type: JSON_TYPE })],
    ["text/plain content type", async (ctx) => ({ body: await text(ctx), type: "text/plain" })],
    ["form-urlencoded", async () => ({ body: "a=b&c=d", type: "application/x-www-form-urlencoded" })],
    ["multipart body", async () => ({ body: '--x\r\nContent-Disposition: form-data; name="a"\r\n\r\nb\r\n--x--\r\n', type: "multipart/form-data; boundary=x" })],
    ["no content type", async (ctx) => ({ body: await text(ctx) })],
    ["12 MB string field", async (ctx) => ({ body: `{"${await firstKey(ctx)}":"${"x".repeat(12_000_000)}"}`, type: JSON_TYPE })],
    ["text damaged", async (ctx) => ({ body: damageText(seedFor(await text(ctx)), await text(ctx)).bytes, type: JSON_TYPE })],
  ];
}

/** A deterministic generator from the text itself, for damage that does not need the run's seed. */
function seedFor(text: string): Rng {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  let a = h >>> 0;
  return () => ((a = (a + 0x6d2b79f5) >>> 0), (Math.imul(a ^ (a >>> 15), a | 1) >>> 0) / 4294967296);
}

/** A chain of `sites` atoms per cell with s, px, py and pz on each: a valid model whose basis is 4 × sites. */
export function largeChain(base: ModelDocument, sites: number): ModelDocument {
  const c = 2.5 * sites;
  return {
    ...base,
    name: `large-chain-${sites}`,
    lattice: { ...base.lattice, vectors: [[0, 0, c]] },
    sites: Array.from({ length: sites }, (_, i) => ({ label: `A${i + 1}`, species: "A", position: [0, 0, 2.5 * i], orbitals: ["s", "px", "py", "pz"] })),
    onsite: { A: { s: -5, px: 1.5, py: 1.5, pz: 1.5 } },
    electronCount: 2 * sites,
  } as ModelDocument;
}

function fieldCases(route: string, path: string, valid: Valid, fields: string[]): BadCase[] {
  return fields.flatMap((field) =>
    FIELD_VALUES.map(([label, v]) => post(route, path, `${field} = ${label}`, async (ctx) => ({ body: toJsonText({ ...(await valid(ctx)), [field]: v }), type: JSON_TYPE }))),
  );
}

function mutationCases(rng: Rng, route: string, path: string, valid: Valid, field: string, count: number, sample: unknown): BadCase[] {
  return Array.from({ length: count }, () => {
    const m = mutate(rng, sample);
    return post(route, path, `${field}${m.summary.startsWith("whole") ? ": " : ""}${m.summary}`, async (ctx) => ({ body: toJsonText({ ...(await valid(ctx)), [field]: m.value }), type: JSON_TYPE }));
  });
}

/** Model documents through POST /api/proposals and POST /api/proposals/:id/revisions. */
export function documentCases(world: World, rng: Rng): BadCase[] {
  const { board } = world;
  const doc = changedChain(board.base, "shell/A-A/1/sp_sigma", 1.85);
  const create: Valid = async () => ({ familySlug: board.familySlug, baseReleaseId: board.releaseId, title: "Bad input probe", rationale: "", document: doc });
  const rev = world.proposals.revisions;
  const revise: Valid = async (ctx) => ({ version: await ctx.versionOf(rev), document: doc, note: "probe" });
  const createRoute = "POST /api/proposals";
  const reviseRoute = "POST /api/proposals/:id/revisions";
  const revisePath = `/api/proposals/${rev}/revisions`;
  const asText = (label: string, text: string | Buffer) =>
    post(reviseRoute, revisePath, `document as text: ${label}`, async (ctx) => ({ body: toJsonText({ version: await ctx.versionOf(rev), document: Buffer.isBuffer(text) ? text.toString("latin1") : text }), type: JSON_TYPE }));
  const docText = JSON.stringify(doc);
  return [
    ...bodyCatalogue(create).map(([l, b]) => post(createRoute, "/api/proposals", l, b)),
    ...fieldCases(createRoute, "/api/proposals", create, ["familySlug", "baseReleaseId", "title", "rationale", "document"]),
    ...mutationCases(rng, createRoute, "/api/proposals", create, "document", 40, doc),
    post(createRoute, "/api/proposals", "document with a 5 MB description", async (ctx) => ({ body: toJsonText({ ...(await create(ctx)), document: { ...doc, description: "d".repeat(5_000_000) } }), type: JSON_TYPE })),
    ...bodyCatalogue(revise).map(([l, b]) => post(reviseRoute, revisePath, l, b)),
    ...fieldCases(reviseRoute, revisePath, revise, ["version", "note", "document"]),
    ...mutationCases(rng, reviseRoute, revisePath, revise, "document", 150, doc),
    ...Array.from({ length: 12 }, () => damageText(rng, docText)).map((d) => asText(d.summary, d.bytes)),
    asText("2.1 MB", JSON.stringify({ ...doc, description: "d".repeat(2_100_000) })),
    post(reviseRoute, revisePath, "document with a 5 MB description", async (ctx) => ({ body: toJsonText({ ...(await revise(ctx)), document: { ...doc, description: "d".repeat(5_000_000) } }), type: JSON_TYPE })),
    post(reviseRoute, revisePath, "document with sites × 1,000 (repeated site)", async (ctx) => ({ body: toJsonText({ ...(await revise(ctx)), document: setAt(doc, ["sites"], Array.from({ length: 1000 }, () => doc.sites[0])) }), type: JSON_TYPE })),
    // Valid models with a large basis (issue 11, item 3): last, because an accepted one slows every later view of the proposal.
    ...[20, 80].map((sites) =>
      post(reviseRoute, revisePath, `valid model, ${sites} sites × 4 orbitals (basis ${sites * 4})`, async (ctx) => ({ body: toJsonText({ ...(await revise(ctx)), document: largeChain(doc, sites) }), type: JSON_TYPE })),
    ),
  ];
}

/** TeX and markdown whose rendering costs far more than their length. */
const EXPENSIVE_MARKUP: readonly Labelled<string>[] = [
  ["\\def macros, 1,500 symbols", macroBomb(10)],
  ["\\def macros, 13,500 symbols", macroBomb(30)],
  ["matrix of 4,000 cells", `$$\n\\begin{matrix}${"a&".repeat(4000)}a\\end{matrix}\n$$`],
  ["fractions nested 400 deep", `$${"\\frac{1}{".repeat(400)}x${"}".repeat(400)}$`],
  ["superscripts nested 1,000 deep", `$${"x^{".repeat(1000)}x${"}".repeat(1000)}$`],
  ["5,000 nested block quotes", `${">".repeat(5000)} x`],
  ["90 nested list items", Array.from({ length: 90 }, (_, i) => `${"  ".repeat(i)}- x`).join("\n")],
  ["1,000 inline formulas", "$x$ ".repeat(1000)],
  ["unclosed math", "$\\frac{1}{"],
  ["\\href javascript", "$\\href{javascript:alert(1)}{x}$"],
  ["remote image", "![x](https://evil.example/pixel.png)"],
  ["protocol-relative link", "[x](//evil.example/x)"],
];

/** Remark bodies, anchors, flags and parents through POST /api/proposals/:id/remarks. */
export function remarkCases(world: World, rng: Rng): BadCase[] {
  const route = "POST /api/proposals/:id/remarks";
  const path = `/api/proposals/${world.proposals.remarks}/remarks`;
  const valid: Valid = async () => ({ body: "A remark from the bad-input probe.", blocking: false, anchor: { kind: "proposal" } });
  const withBody = (label: string, body: unknown) => post(route, path, `body = ${label}`, async (ctx) => ({ body: toJsonText({ ...(await valid(ctx)), body }), type: JSON_TYPE }));
  const anchors: Labelled<unknown>[] = [
    ...FIELD_VALUES,
    ["parameter without key", { kind: "parameter" }],
    ["parameter key NUL", { kind: "parameter", key: "\u0000" }],
    ["parameter key 201 chars", { kind: "parameter", key: "k".repeat(201) }],
    ["k-range from 1e308", { kind: "k-range", from: 1e308, to: "X" }],
    ["k-range with CR/LF", { kind: "k-range", from: "Γ\r\n", to: "X" }],
    ["unknown kind", { kind: "everything" }],
    ["proposal with extra key", { kind: "proposal", extra: 1 }],
    ["anchor as bad JSON text", "{bad json"],
    ["anchor as JSON text of a k-range", '{"kind":"k-range","from":"Γ","to":"X"}'],
    ["anchor text nested 10,000", deepJsonText(10_000)],
  ];
  return [
    ...bodyCatalogue(valid).map(([l, b]) => post(route, path, l, b)),
    ...NASTY_STRINGS.map(([l, v]) => withBody(l, v)),
    ...EXPENSIVE_MARKUP.map(([l, v]) => withBody(l, v)),
    ...FIELD_VALUES.filter(([, v]) => typeof v !== "string").map(([l, v]) => withBody(l, v)),
    ...anchors.map(([l, v]) => post(route, path, `anchor = ${l}`, async (ctx) => ({ body: toJsonText({ ...(await valid(ctx)), anchor: v }), type: JSON_TYPE }))),
    ...FIELD_VALUES.map(([l, v]) => post(route, path, `blocking = ${l}`, async (ctx) => ({ body: toJsonText({ ...(await valid(ctx)), blocking: v }), type: JSON_TYPE }))),
    ...FIELD_VALUES.map(([l, v]) => post(route, path, `parentId = ${l}`, async (ctx) => ({ body: toJsonText({ ...(await valid(ctx)), parentId: v }), type: JSON_TYPE }))),
    ...Array.from({ length: 30 }, () => {
      const m = mutate(rng, { body: "A remark from the bad-input probe.", blocking: false, anchor: { kind: "parameter", key: "shell/A-A/1/sp_sigma" } });
      return post(route, path, m.summary, async () => ({ body: toJsonText(m.value), type: JSON_TYPE }));
    }),
  ];
}
