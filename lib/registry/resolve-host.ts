import { lookup } from "node:dns/promises";
import type { Resolver } from "./webhook-target";

export const resolveHost: Resolver = async (host) => (await lookup(host, { all: true })).map((a) => a.address);
