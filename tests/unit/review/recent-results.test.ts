import { describe, expect, it } from "vitest";
import { RecentResults } from "@/lib/review/recent-results";

describe("recent results (LRU)", () => {
  it("computes once per key, keeps the most recently used, and drops the least recently used beyond its limit", () => {
    const store = new RecentResults<number>(2);
    let calls = 0;
    const f = (v: number) => () => (calls++, v);
    expect(store.get("a", f(1))).toBe(1);
    expect(store.get("a", f(99))).toBe(1);
    expect(store.get("b", f(2))).toBe(2);
    expect(store.get("a", f(99))).toBe(1); // a is now the most recent
    expect(store.get("c", f(3))).toBe(3); // drops b
    expect(store.size).toBe(2);
    expect(store.get("b", f(4))).toBe(4);
    expect(calls).toBe(4);
  });
});
