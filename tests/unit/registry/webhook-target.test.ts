import { describe, expect, it } from "vitest";
import { isPrivateAddress, webhookTargetProblem } from "@/lib/registry/webhook-target";

// Ranges from RFC 1918 (private), RFC 1122 (loopback, "this network"), RFC 3927 (link-local), RFC 6598 (shared),
// RFC 2544 (benchmarking), RFC 4193 (IPv6 unique local), RFC 4291 (IPv6 loopback, link-local, mapped, multicast).
describe("private addresses", () => {
  it("recognises private, loopback, link-local and multicast IPv4", () => {
    for (const ip of ["10.1.2.3", "172.16.0.1", "172.31.255.255", "192.168.1.1", "127.0.0.1", "169.254.169.254", "100.64.0.1", "198.18.0.1", "0.0.0.0", "224.0.0.1"]) {
      expect(isPrivateAddress(ip), ip).toBe(true);
    }
    for (const ip of ["8.8.8.8", "172.32.0.1", "100.128.0.1", "192.0.2.1", "203.0.113.9"]) expect(isPrivateAddress(ip), ip).toBe(false);
  });
  it("recognises IPv6 loopback, unique-local, link-local, multicast and mapped private IPv4", () => {
    for (const ip of ["::1", "::", "fd12:3456::1", "fe80::1", "ff02::1", "::ffff:10.0.0.1"]) expect(isPrivateAddress(ip), ip).toBe(true);
    for (const ip of ["2001:db8::1", "::ffff:8.8.8.8"]) expect(isPrivateAddress(ip), ip).toBe(false);
  });
});

describe("webhook targets", () => {
  const resolver = (map: Record<string, string[]>) => async (host: string) => {
    if (!(host in map)) throw new Error("ENOTFOUND");
    return map[host];
  };
  const dns = resolver({ "hooks.example.org": ["203.0.113.10"], "sneaky.example.org": ["203.0.113.10", "10.0.0.5"] });

  it("calls public hosts and refuses names or literals that reach private networks", async () => {
    expect(await webhookTargetProblem("https://hooks.example.org/bandgate", dns, false)).toBeNull();
    expect(await webhookTargetProblem("https://sneaky.example.org/x", dns, false)).toMatch(/private/);
    expect(await webhookTargetProblem("http://169.254.169.254/latest", dns, false)).toMatch(/private/);
    expect(await webhookTargetProblem("http://[::1]:8080/", dns, false)).toMatch(/private/);
    expect(await webhookTargetProblem("http://localhost:9000/", dns, false)).toMatch(/private/);
    expect(await webhookTargetProblem("https://nowhere.example.org/", dns, false)).toMatch(/could not be resolved/);
    expect(await webhookTargetProblem("ftp://hooks.example.org/", dns, false)).toMatch(/http/);
  });

  it("lets local set-ups call loopback receivers when allowed", async () => {
    expect(await webhookTargetProblem("http://127.0.0.1:4567/hook", dns, true)).toBeNull();
  });
});
