// What a person on a shared phone notices: the banner says how old the copy is, and an entry saved
// by one person is never listed or sent for another.
import { describe, expect, it } from "vitest";
import { loadedAtText } from "@/lib/client/format";
import { isMine } from "@/lib/client/outbox/store";

describe("offline banner time", () => {
  it("says the time alone for a copy from today and adds the date for an older one", () => {
    const now = new Date(2026, 11, 3, 15, 0);
    expect(loadedAtText(new Date(2026, 11, 3, 14, 32).toISOString(), now)).toBe("14:32");
    expect(loadedAtText(new Date(2026, 11, 2, 9, 5).toISOString(), now)).toBe("2 Dec 09:05");
  });
});

describe("outbox entries are the author's", () => {
  it("an entry of one person is not another's, and nobody's while signed out", () => {
    expect(isMine({ userId: "u-1" }, "u-1")).toBe(true);
    expect(isMine({ userId: "u-1" }, "u-2")).toBe(false);
    expect(isMine({ userId: "u-1" }, null)).toBe(false);
  });
});
