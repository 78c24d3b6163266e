// After sign-in only a path on this site is followed; anything pointing elsewhere is refused.
import { describe, expect, it } from "vitest";
import { safeCallbackPath } from "@/lib/auth/callback";

describe("safeCallbackPath", () => {
  it("keeps a member's deep link and the log form's ?tag= prefill exactly", () => {
    expect(safeCallbackPath("/sites/5c1e/members/9a2b")).toBe("/sites/5c1e/members/9a2b");
    expect(safeCallbackPath("/sites/5c1e/members/new?tag=WXB-P-017")).toBe("/sites/5c1e/members/new?tag=WXB-P-017");
    expect(safeCallbackPath("/sites/5c1e/permits/77?from=mail#top")).toBe("/sites/5c1e/permits/77?from=mail#top");
  });

  it.each([
    ["//evil.example/phish"],
    ["https://other.example/sites"],
    ["http://127.0.0.1:3100/sites"],
    ["javascript:alert(1)"],
    ["/\\evil.example"],
    ["\\\\evil.example"],
    ["/sites\n/x"],
    ["sites/relative"],
    [""],
    ["/sign-in?callbackUrl=/sites"],
    ["/api/v1/me"],
  ])("refuses %j", (value) => {
    expect(safeCallbackPath(value)).toBeNull();
  });

  it("refuses missing values", () => {
    expect(safeCallbackPath(null)).toBeNull();
    expect(safeCallbackPath(undefined)).toBeNull();
  });
});
