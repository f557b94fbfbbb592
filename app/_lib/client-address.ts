import { headers } from "next/headers";
import { appConfig } from "./config";

// server.ts writes the socket's peer address into this header after deleting any inbound copy, so
// a client cannot choose its own address. Behind a trusted reverse proxy (TRUSTED_PROXY_HOPS = N)
// the client is the N-th address from the right of X-Forwarded-For.
export const PEER_HEADER = "x-loopwright-peer";

export async function clientAddress(): Promise<string> {
  const h = await headers();
  const hops = appConfig().TRUSTED_PROXY_HOPS;
  if (hops > 0) {
    const chain = (h.get("x-forwarded-for") ?? "").split(",").map((s) => s.trim()).filter(Boolean);
    const fromProxy = chain[chain.length - hops];
    if (fromProxy) return fromProxy;
  }
  return h.get(PEER_HEADER) ?? "unknown-peer";
}
