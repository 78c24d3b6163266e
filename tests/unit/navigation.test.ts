// Each role sees the screens its permissions allow (BS 5975 roles).
import { describe, expect, it } from "vitest";
import { siteNav } from "@/lib/navigation";
import { PERMISSIONS, rolesAllowPure } from "@/lib/permissions";

describe("site navigation by role", () => {
  it("shows People only to organisation admins", () => {
    const labels = (roles: Parameters<typeof siteNav>[1]) => siteNav("s1", roles).map((i) => i.label);
    expect(labels(["admin"])).toContain("People");
    for (const role of ["engineer", "coordinator", "supervisor", "designer", "manager"] as const) expect(labels([role])).not.toContain("People");
  });

  it("gives a person holding several roles the union of what each allows", () => {
    expect(rolesAllowPure(["manager"], "issuePermit")).toBe(false);
    expect(rolesAllowPure(["manager", "coordinator"], "issuePermit")).toBe(true);
  });

  it("lets only coordinators issue permits", () => {
    expect(PERMISSIONS.issuePermit).toEqual(["coordinator"]);
  });

  it("links every item inside the site", () => {
    for (const item of siteNav("abc", ["admin", "engineer"])) expect(item.href.startsWith("/sites/abc")).toBe(true);
  });
});
