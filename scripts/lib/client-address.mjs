// Who sent a request, for the throttles: the socket's peer address, unless that peer is a proxy named in
// SHUNTWISE_TRUSTED_PROXIES; then the address that proxy saw (the X-Forwarded-For entries are read from
// the right, skipping every trusted proxy, so entries a client wrote itself never count). Plain
// JavaScript: the server wrapper (scripts/serve.mjs) runs it before Next.js sees the request.
import net from "node:net";

/** `::ffff:1.2.3.4` (an IPv4 peer on a dual-stack socket) as `1.2.3.4`; anything else as given. */
export function plainAddress(address) {
  const a = String(address ?? "").trim();
  return a.toLowerCase().startsWith("::ffff:") && net.isIPv4(a.slice(7)) ? a.slice(7) : a;
}

/**
 * The trusted proxies from a comma-separated list of addresses and CIDR blocks (`10.0.0.5, 10.1.0.0/16,
 * fd00::/8`); an entry that is neither throws, naming it, so a typing mistake stops the server at start.
 */
export function trustedProxies(list) {
  const blocks = new net.BlockList();
  for (const raw of String(list ?? "").split(",")) {
    const entry = raw.trim();
    if (!entry) continue;
    const [address, prefix] = entry.split("/");
    const family = net.isIPv4(address) ? "ipv4" : net.isIPv6(address) ? "ipv6" : null;
    const bits = prefix === undefined ? (family === "ipv4" ? 32 : 128) : Number(prefix);
    if (!family || !Number.isInteger(bits) || bits < 0 || bits > (family === "ipv4" ? 32 : 128) || (prefix !== undefined && !/^\d+$/.test(prefix))) {
      throw new Error(`SHUNTWISE_TRUSTED_PROXIES: "${entry}" is not an IP address or a CIDR block`);
    }
    blocks.addSubnet(address, bits, family);
  }
  return blocks;
}

function isTrusted(blocks, address) {
  const family = net.isIPv4(address) ? "ipv4" : net.isIPv6(address) ? "ipv6" : null;
  return family !== null && blocks.check(address, family);
}

/**
 * The client's address: the socket peer when it is not a trusted proxy; else, walking X-Forwarded-For
 * from its last entry, the first address that is not a trusted proxy (a malformed entry ends the walk
 * and the last trusted hop's address counts).
 */
export function clientAddressOf(peer, forwardedFor, blocks) {
  let client = plainAddress(peer) || "unknown";
  if (!isTrusted(blocks, client)) return client;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(",") : String(forwardedFor ?? "");
  const hops = header.split(",").map(plainAddress).filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    if (net.isIP(hops[i]) === 0) break;
    client = hops[i];
    if (!isTrusted(blocks, client)) break;
  }
  return client;
}
