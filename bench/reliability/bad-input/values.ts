/** The catalogue of nasty values the bad-input generator draws from. Each has a short label for the report. */

export type Labelled<T> = readonly [label: string, value: T];

/** A JSON token written as is (numbers beyond double range, negative zero): a marker string replaced after stringify. */
export function raw(text: string): string {
  return `\u0000raw:${text}\u0000`;
}

export function isRaw(value: unknown): boolean {
  return typeof value === "string" && value.startsWith("\u0000raw:");
}

/** JSON text of a value, with raw() markers turned into bare tokens. */
export function toJsonText(value: unknown): string {
  return JSON.stringify(value).replace(/"\\u0000raw:(.*?)\\u0000"/g, "$1");
}

export function nestedArrays(depth: number, leaf: unknown = 0): unknown {
  let v: unknown = leaf;
  for (let i = 0; i < depth; i++) v = [v];
  return v;
}

export function nestedObjects(depth: number, leaf: unknown = 0): unknown {
  let v: unknown = leaf;
  for (let i = 0; i < depth; i++) v = { a: v };
  return v;
}

/** Nested brackets as text, deeper than JSON.stringify's recursion would allow building. */
export function deepJsonText(depth: number): string {
  return `${"[".repeat(depth)}0${"]".repeat(depth)}`;
}

/**
 * TeX whose three levels of macros expand `fanout` × `fanout` times a run of `leaf` symbols: with fanout 30 about
 * 13,500 symbols from under 200 characters, inside KaTeX's default budget of 1,000 expansions.
 */
export function macroBomb(fanout: number, leaf = 15): string {
  return `$\\def\\a{${"x".repeat(leaf)}}\\def\\b{${"\\a".repeat(fanout)}}\\def\\c{${"\\b".repeat(fanout)}}\\c$`;
}

export const NASTY_STRINGS: readonly Labelled<string>[] = [
  ["empty string", ""],
  ["blank", "   "],
  ["NUL", "\u0000"],
  ["NUL inside", "probe\u0000text"],
  ["CR/LF", "\r\n"],
  ["CR/LF header injection", "probe\r\nSet-Cookie: a=b"],
  ["1,000 newlines", "\n".repeat(1000)],
  ["BOM", "\uFEFFprobe"],
  ["lone high surrogate", "probe\uD800"],
  ["reversed surrogates", "\uDFFF\uD800"],
  ["right-to-left override", "\u202Eprobe"],
  ["zero-width joiners", "\u200D".repeat(500)],
  ["emoji ×1,000", "\u{1F4A5}".repeat(1000)],
  ["é ×50,000", "é".repeat(50_000)],
  ["201 chars", "x".repeat(201)],
  ["10,001 chars", "y".repeat(10_001)],
  ["100,001 chars", "z".repeat(100_001)],
  ["HTML script", "<script>alert(1)</script>"],
  ["HTML img onerror", '<img src=x onerror="alert(1)">'],
  ["javascript: URL", "javascript:alert(1)"],
  ["SQL quote", "'; drop table users; --"],
  ["path traversal", "../../../etc/passwd"],
  ["template syntax", "${7*7}{{7*7}}"],
  ["__proto__", "__proto__"],
  ["percent NUL", "%00"],
  ["NaN text", "NaN"],
  ["Infinity text", "Infinity"],
  ["1e308 text", "1e308"],
  ["400 nines", "9".repeat(400)],
  ["JSON text", '{"a":[1,2,3]}'],
];

export const NASTY_NUMBERS: readonly Labelled<unknown>[] = [
  ["0", 0],
  ["-1", -1],
  ["1e308", 1e308],
  ["-1e308", -1e308],
  ["5e-324", 5e-324],
  ["2^53+1", 2 ** 53 + 1],
  ["1e999 (Infinity)", raw("1e999")],
  ["-1e999", raw("-1e999")],
  ["-0", raw("-0")],
  ["1e-400", raw("1e-400")],
  ["30-digit integer", raw("123456789012345678901234567890")],
  ["0.5", 0.5],
];

export const NASTY_SHAPES: readonly Labelled<unknown>[] = [
  ["null", null],
  ["true", true],
  ["empty array", []],
  ["empty object", {}],
  ["[null]", [null]],
  ["__proto__ object", JSON.parse('{"__proto__":{"polluted":true}}')],
  ["constructor.prototype", { constructor: { prototype: { polluted: true } } }],
  ["arrays nested 64", nestedArrays(64)],
  ["objects nested 512", nestedObjects(512)],
  ["100,000 zeros", new Array(100_000).fill(0)],
  ["5,000 keys", Object.fromEntries(Array.from({ length: 5000 }, (_, i) => [`k${i}`, i]))],
];

/** Every nasty value: strings, numbers and shapes. */
export const NASTY_VALUES: readonly Labelled<unknown>[] = [...NASTY_STRINGS, ...NASTY_NUMBERS, ...NASTY_SHAPES];

/** A smaller set for fields where the full list would mostly repeat itself. */
export const FIELD_VALUES: readonly Labelled<unknown>[] = [
  ...NASTY_STRINGS.filter(([l]) => ["empty string", "NUL", "NUL inside", "CR/LF header injection", "lone high surrogate", "é ×50,000", "201 chars", "10,001 chars", "100,001 chars", "HTML script", "SQL quote", "1e308 text"].includes(l)),
  ...NASTY_NUMBERS.filter(([l]) => ["-1", "1e308", "1e999 (Infinity)", "-0", "30-digit integer", "0.5"].includes(l)),
  ...NASTY_SHAPES.filter(([l]) => ["null", "true", "empty array", "empty object", "__proto__ object", "arrays nested 64", "100,000 zeros"].includes(l)),
];

/** Query-string values, already percent-encoded as they go on the wire (some deliberately malformed). */
export const RAW_QUERY_VALUES: readonly Labelled<string>[] = [
  ["empty", ""],
  ["NUL", "%00"],
  ["NUL inside", "a%00b"],
  ["CR/LF", "%0D%0A"],
  ["CR/LF header injection", "x%0D%0ASet-Cookie:%20a=b"],
  ["bad UTF-8 FF", "%FF"],
  ["bad UTF-8 C3 28", "%C3%28"],
  ["overlong NUL C0 80", "%C0%80"],
  ["UTF-8 surrogate ED A0 80", "%ED%A0%80"],
  ["malformed escape %zz", "%zz"],
  ["lone %", "%"],
  ["BOM", "%EF%BB%BF"],
  ["right-to-left override", "%E2%80%AEx"],
  ["emoji", "%F0%9F%92%A5"],
  ["tab", "%09"],
  ["plus", "+"],
  ["20,000 chars", "q".repeat(20_000)],
  ["1e308", "1e308"],
  ["-1e308", "-1e308"],
  ["1e999", "1e999"],
  ["NaN", "NaN"],
  ["Infinity", "Infinity"],
  ["-0", "-0"],
  ["hex", "0x10"],
  ["400 nines", "9".repeat(400)],
  ["-1", "-1"],
  ["HTML script", "%3Cscript%3Ealert(1)%3C%2Fscript%3E"],
  ["SQL quote", "'%20or%201=1%20--"],
  ["path traversal", "..%2F..%2Fetc%2Fpasswd"],
  ["commas only", ",,,,"],
  ["2,000 list items", Array.from({ length: 2000 }, (_, i) => `f${i}`).join(",")],
  ["JSON", "%7B%22a%22%3A1%7D"],
  ["__proto__", "__proto__"],
  ["nil uuid", "00000000-0000-0000-0000-000000000000"],
  ["uuid with NUL", "00000000-0000-0000-0000-00000000000%00"],
  ["protocol-relative URL", "%2F%2Fevil.example%2Fx"],
];

/** Path segments (slugs, versions, file names), percent-encoded. */
export const RAW_SEGMENTS: readonly Labelled<string>[] = [
  ...RAW_QUERY_VALUES.filter(([l]) => !["empty", "plus", "commas only", "2,000 list items"].includes(l)),
  ["encoded slash", "a%2Fb"],
  ["dot dot", "%2E%2E"],
  ["version with NUL", "1.0.0%00"],
  ["huge version", "999999.999999.999999"],
  ["seven-digit version", "1234567.0.0"],
  ["latest with CR/LF", "latest%0D%0A"],
];
