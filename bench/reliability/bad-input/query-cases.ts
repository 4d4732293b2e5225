import type { World } from "../world";
import type { BadCase } from "./case";
import { RAW_QUERY_VALUES, RAW_SEGMENTS, type Labelled } from "./values";

const get = (route: string, auth: BadCase["auth"], path: string, summary: string, headers?: Record<string, string>): BadCase => ({
  route,
  summary,
  auth,
  judge: "status",
  build: () => ({ method: "GET", path, headers }),
});

const each = (values: readonly Labelled<string>[], make: (label: string, v: string) => BadCase) => values.map(([label, v]) => make(label, v));

/** A few values only, for pages whose every view is a full render. */
const PAGE_VALUES = RAW_QUERY_VALUES.filter(([l]) =>
  ["NUL", "CR/LF header injection", "bad UTF-8 FF", "malformed escape %zz", "20,000 chars", "1e308", "NaN", "-1", "HTML script", "2,000 list items", "protocol-relative URL", "uuid with NUL"].includes(l),
);

const K_POINTS: readonly Labelled<string>[] = [
  ["k=1e308", "1e308"],
  ["k=-1e308", "-1e308"],
  ["k=1e999", "1e999"],
  ["k=5e-324", "5e-324"],
  ["k=NaN", "NaN"],
  ["k=Infinity", "Infinity"],
  ["k with 3 coordinates on a 1D lattice", "0,0,0"],
  ["k with an empty point", "0;;0.5"],
  ["k trailing semicolon", "0.5;"],
  ["k 20,000 points", Array.from({ length: 20_000 }, (_, i) => (i / 20_000).toFixed(4)).join(";")],
  ["k 100,001 chars", "0".repeat(100_001)],
  ["k hex", "0x1"],
  ["k with spaces", "%200.5%20;%200.25"],
  ["k 1e308 among good points", "0;0.5;1e308;0.25"],
];

const WINDOWS: readonly Labelled<string>[] = [
  ["window=1e308,1e309", "1e308,1e309"],
  ["window=-1e308,1e308", "-1e308,1e308"],
  ["window=0,0", "0,0"],
  ["window=3,-8 (reversed)", "3,-8"],
  ["window=NaN,1", "NaN,1"],
  ["window=-8", "-8"],
  ["window=-8,3,5", "-8,3,5"],
  ["window=1e-320,1e-310", "1e-320,1e-310"],
  ["window=-Infinity,Infinity", "-Infinity,Infinity"],
  ["window=-8e0,3e0", "-8e0,3e0"],
];

const AUTH_HEADERS: readonly Labelled<string>[] = [
  ["Bearer, no token", "Bearer "],
  ["Basic scheme", "Basic dXNlcjpwYXNz"],
  ["token of 20,000 chars", `Bearer bgt_${"a".repeat(20_000)}`],
  ["token with a quote", 'Bearer bgt_"x'],
  ["lower-case scheme", "bearer bgt_abc"],
  ["two tokens", "Bearer bgt_a, Bearer bgt_b"],
  ["non-ASCII token", "Bearer bgt_\u00e9\u00e9"],
  ["SQL in token", "Bearer bgt_' or 1=1 --"],
  ["prefix only", "Bearer bgt_"],
  ["token of spaces", "Bearer      "],
];

/** Query strings and path segments of the board, review, login and registry routes, signed in or with the token. */
export function queryCases(world: World): BadCase[] {
  const slug = world.board.familySlug;
  const q = world.proposals.queries;
  const v1 = `/api/v1/families/${slug}/releases/1.0.0`;
  return [
    ...["family", "stage", "mine", "author"].flatMap((p) => each(RAW_QUERY_VALUES, (l, v) => get("GET /api/board", "author", `/api/board?${p}=${v}`, `${p}=${l}`))),
    get("GET /api/board", "author", `/api/board?family=a&family=b&family=c`, "family repeated 3×"),
    get("GET /api/board", "author", `/api/board?stage[]=draft`, "stage[]=draft"),
    ...["family", "stage"].flatMap((p) => each(PAGE_VALUES, (l, v) => get("GET /board (page)", "author", `/board?${p}=${v}`, `${p}=${l}`))),
    get("GET /board (page)", "author", `/board?family=a&family=b`, "family repeated"),
    ...each(PAGE_VALUES, (l, v) => get("GET /proposals/new (page)", "author", `/proposals/new?family=${v}`, `family=${l}`)),
    ...each(RAW_QUERY_VALUES, (l, v) => get("GET /login (page)", "none", `/login?callbackUrl=${v}`, `callbackUrl=${l}`)),
    ...["from", "to", "remark"].flatMap((p) => each(PAGE_VALUES, (l, v) => get("GET /proposals/:id/review (page)", "author", `/proposals/${q}/review?${p}=${v}`, `${p}=${l}`))),
    ...each(RAW_QUERY_VALUES, (l, v) => get("GET /api/proposals/:id/metrics", "author", `/api/proposals/${q}/metrics?alignment=${v}`, `alignment=${l}`)),
    ...each(RAW_QUERY_VALUES, (l, v) => get("GET /api/proposals/:id/metrics", "author", `/api/proposals/${q}/metrics?alignment=vbm&window=${v}`, `window=${l}`)),
    ...each(WINDOWS, (l, v) => get("GET /api/proposals/:id/metrics", "author", `/api/proposals/${q}/metrics?alignment=least-squares&window=${v}`, l)),
    ...each(RAW_SEGMENTS, (l, v) => get("GET /api/v1/families/:slug/releases", "token", `/api/v1/families/${v}/releases`, `slug=${l}`)),
    ...each(RAW_SEGMENTS, (l, v) => get("GET /api/v1/families/:slug/releases/:version", "token", `/api/v1/families/${slug}/releases/${v}`, `version=${l}`)),
    ...each(RAW_SEGMENTS, (l, v) => get("GET /api/v1/…/:version/document", "token", `/api/v1/families/${v}/releases/latest/document`, `slug=${l}`)),
    ...each(RAW_QUERY_VALUES, (l, v) => get("GET /api/v1/…/bands", "token", `${v1}/bands?k=${v}`, `k=${l}`)),
    ...each(K_POINTS, (l, v) => get("GET /api/v1/…/bands", "token", `${v1}/bands?k=${v}`, l)),
    ...each(RAW_QUERY_VALUES, (l, v) => get("GET /api/v1/…/bands", "token", `${v1}/bands?points=${v}`, `points=${l}`)),
    ...each(RAW_QUERY_VALUES.slice(0, 18), (l, v) => get("GET /api/v1/…/bands", "token", `${v1}/bands?format=${v}`, `format=${l}`)),
    ...each(RAW_QUERY_VALUES.slice(0, 18), (l, v) => get("GET /api/v1/…/hoppings", "token", `${v1}/hoppings?format=${v}`, `format=${l}`)),
    ...each(RAW_SEGMENTS, (l, v) => get("GET /registry/:slug/:version/files/:file", "author", `/registry/${slug}/1.0.0/files/${v}`, `file=${l}`)),
    ...each(AUTH_HEADERS, (l, v) => get("GET /api/v1/families", "none", "/api/v1/families", `Authorization: ${l}`, { authorization: v })),
  ];
}
