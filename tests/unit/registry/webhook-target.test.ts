import { describe, expect, it } from "vitest";
import { mayConnectTo, NOT_PUBLIC, parseNetworks, webhookTargetProblem } from "@/lib/registry/webhook-target";
import { ISSUE_TARGETS, REFUSED_TARGETS } from "@/tests/support/refused-targets";

const PUBLIC_TARGETS = ["8.8.8.8", "172.32.0.1", "100.128.0.1", "[2606:4700::1111]", "[::ffff:8.8.8.8]", "[64:ff9b::808:808]", "[2002:808:808::1]", "[2001:0:4136:e378:8000:63bf:f7f7:f7f7]"];

const resolver = (map: Record<string, string[]>) => async (host: string) => {
  if (!(host in map)) throw new Error("ENOTFOUND");
  return map[host];
};
const dns = resolver({
  "hooks.example.org": ["93.184.216.34"],
  "sneaky.example.org": ["93.184.216.34", "10.0.0.5"],
  "mapped.example.org": ["::ffff:7f00:1"],
  "nat64.example.org": ["64:ff9b::5db8:d822"],
});

describe("webhook targets by URL", () => {
  it.each([...ISSUE_TARGETS, ...REFUSED_TARGETS])("refuses http://%s/ (%s)", async (host) => {
    expect(await webhookTargetProblem(`http://${host}:8080/hook`, dns, [])).toBe(NOT_PUBLIC);
  });

  it("calls public addresses, also in their mapped, NAT64, 6to4 and Teredo forms", async () => {
    for (const host of PUBLIC_TARGETS) expect(await webhookTargetProblem(`https://${host}/hook`, dns, []), host).toBeNull();
  });

  it("refuses a name when any of its addresses is not public, in any notation", async () => {
    expect(await webhookTargetProblem("https://hooks.example.org/bandgate", dns, [])).toBeNull();
    expect(await webhookTargetProblem("https://nat64.example.org/bandgate", dns, [])).toBeNull();
    expect(await webhookTargetProblem("https://sneaky.example.org/x", dns, [])).toBe(NOT_PUBLIC);
    expect(await webhookTargetProblem("https://mapped.example.org/x", dns, [])).toBe(NOT_PUBLIC);
    expect(await webhookTargetProblem("https://nowhere.example.org/", dns, [])).toMatch(/could not be resolved/);
    expect(await webhookTargetProblem("ftp://hooks.example.org/", dns, [])).toMatch(/http/);
  });
});

describe("networks the operator allows", () => {
  const allowed = parseNetworks(" 127.0.0.2/32, fd00:1::/64 ");

  it("lets through exactly the listed networks, matching an IPv4-mapped address as its IPv4 address", async () => {
    expect(await webhookTargetProblem("http://127.0.0.2:4567/hook", dns, allowed)).toBeNull();
    expect(await webhookTargetProblem("http://[::ffff:127.0.0.2]:4567/hook", dns, allowed)).toBeNull();
    expect(await webhookTargetProblem("http://[fd00:1::9]/hook", dns, allowed)).toBeNull();
    for (const host of ["127.0.0.1", "127.0.0.3", "[::ffff:127.0.0.1]", "[::127.0.0.2]", "[64:ff9b::7f00:2]", "[fd00:2::1]", "10.0.0.1"]) {
      expect(await webhookTargetProblem(`http://${host}:4567/hook`, dns, allowed), host).toBe(NOT_PUBLIC);
    }
  });

  it("reads CIDR lists and refuses anything else", () => {
    expect(parseNetworks("")).toEqual([]);
    expect(mayConnectTo("127.0.0.2", parseNetworks("127.0.0.0/8"))).toBe(true);
    expect(() => parseNetworks("127.0.0.1")).toThrow(/CIDR/);
    expect(() => parseNetworks("localhost/8")).toThrow(/CIDR/);
    expect(mayConnectTo("not an address", allowed)).toBe(false);
  });
});
