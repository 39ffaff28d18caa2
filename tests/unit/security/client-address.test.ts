// Who sent a request: the socket's peer unless it is a trusted proxy, then the address that proxy saw.
// Check values: RFC 7239 §7.4 and the usual reading of X-Forwarded-For (each proxy appends the address it
// received the request from, so only entries right of the last untrusted hop can be believed); common
// practice, no single source.
import { describe, expect, it } from "vitest";
import { clientAddressOf, plainAddress, trustedProxies } from "../../../scripts/lib/client-address.mjs";

describe("client address", () => {
  const none = trustedProxies("");
  const proxies = trustedProxies("10.0.0.5, 10.1.0.0/16, fd00::/8");

  it("is the socket's peer when no proxy is trusted, whatever X-Forwarded-For says", () => {
    expect(clientAddressOf("203.0.113.9", "198.51.100.1", none)).toBe("203.0.113.9");
    expect(clientAddressOf("::ffff:203.0.113.9", "198.51.100.1, 198.51.100.2", none)).toBe("203.0.113.9");
    expect(clientAddressOf("127.0.0.1", ["1.1.1.1", "2.2.2.2"], none)).toBe("127.0.0.1");
  });

  it("is the peer when the peer is not one of the trusted proxies", () => {
    expect(clientAddressOf("203.0.113.9", "198.51.100.1", proxies)).toBe("203.0.113.9");
  });

  it("behind trusted proxies: the rightmost X-Forwarded-For entry that is not a trusted proxy", () => {
    expect(clientAddressOf("10.0.0.5", "198.51.100.7", proxies)).toBe("198.51.100.7");
    // the client wrote the first entry itself; the trusted proxy appended the address it saw
    expect(clientAddressOf("10.0.0.5", "1.2.3.4, 198.51.100.7", proxies)).toBe("198.51.100.7");
    // two trusted hops
    expect(clientAddressOf("10.0.0.5", "1.2.3.4, 198.51.100.7, 10.1.2.3", proxies)).toBe("198.51.100.7");
    expect(clientAddressOf("fd00::1", "2001:db8::7", proxies)).toBe("2001:db8::7");
  });

  it("behind a trusted proxy that sent no usable entry: the last trusted address", () => {
    expect(clientAddressOf("10.0.0.5", undefined, proxies)).toBe("10.0.0.5");
    expect(clientAddressOf("10.0.0.5", "not-an-address", proxies)).toBe("10.0.0.5");
    expect(clientAddressOf("10.0.0.5", "garbage, 10.1.0.9", proxies)).toBe("10.1.0.9");
  });

  it("refuses a setting that is not an address or a CIDR block, naming the entry", () => {
    expect(() => trustedProxies("10.0.0.5, proxy.internal")).toThrow(/"proxy.internal"/);
    expect(() => trustedProxies("10.0.0.0/33")).toThrow(/10.0.0.0\/33/);
    expect(() => trustedProxies("10.0.0.0/x")).toThrow();
  });

  it("reads an IPv4 peer of a dual-stack socket as IPv4", () => {
    expect(plainAddress("::ffff:127.0.0.1")).toBe("127.0.0.1");
    expect(plainAddress("::1")).toBe("::1");
  });
});
