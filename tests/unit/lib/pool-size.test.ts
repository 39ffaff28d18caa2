// The database pool's size comes from SHUNTWISE_DB_POOL_MAX: 10 when unset, a clear error when it is
// not a usable number (the server refuses to start rather than run with a pool it was not given).
import { describe, expect, it } from "vitest";
import { poolMax } from "@/db";

describe("database pool size", () => {
  it("is 10 unless set, and the number given otherwise", () => {
    expect(poolMax(undefined)).toBe(10);
    expect(poolMax("")).toBe(10);
    expect(poolMax("25")).toBe(25);
  });

  it("refuses what is not a whole number from 1 to 1000, naming the variable", () => {
    for (const bad of ["0", "-3", "2.5", "ten", "1001"]) expect(() => poolMax(bad)).toThrow(/SHUNTWISE_DB_POOL_MAX/);
  });
});
