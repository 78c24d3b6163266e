// The database pool size: DB_POOL_MAX when set (a bad value refuses to start, naming the variable),
// otherwise sized from the CPUs. The default follows common practice — the PostgreSQL wiki's
// "Number Of Database Connections": connections ≈ (core count × 2) + effective spindle count
// (one disk here) — bounded to 4…20 for one Node process.
import { describe, expect, it } from "vitest";
import { defaultPoolMax, parseEnv } from "@/lib/env";

describe("DB_POOL_MAX", () => {
  it("takes the configured number of connections", () => {
    expect(parseEnv({ DB_POOL_MAX: "12" }).DB_POOL_MAX).toBe(12);
    expect(parseEnv({ DB_POOL_MAX: " 3 " }).DB_POOL_MAX).toBe(3);
  });

  it("refuses a value that is not a whole number from 1 to 200, saying which variable and why", () => {
    for (const bad of ["0", "-2", "2.5", "ten", "500"])
      expect(() => parseEnv({ DB_POOL_MAX: bad }), bad).toThrow(/DB_POOL_MAX: DB_POOL_MAX must be a whole number of connections from 1 to 200/);
  });

  it("defaults to cores × 2 + 1 (2 cores → 5, 4 cores → 9), never below 4 nor above 20", () => {
    expect(defaultPoolMax(2)).toBe(5);
    expect(defaultPoolMax(4)).toBe(9);
    expect(defaultPoolMax(1)).toBe(4);
    expect(defaultPoolMax(64)).toBe(20);
    expect(parseEnv({}).DB_POOL_MAX).toBe(defaultPoolMax());
  });
});
