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

  it("puts Inspections in the phone bar of everyone who records inspections, and the scan button in every site role's", () => {
    const bar = (roles: Parameters<typeof siteNav>[1]) => siteNav("s1", roles).filter((i) => i.primary).map((i) => i.label);
    for (const role of ["engineer", "supervisor", "coordinator"] as const) {
      expect(rolesAllowPure([role], "inspect")).toBe(true);
      expect(bar([role]), role).toContain("Inspections");
      expect(bar([role]).length, role).toBeLessThanOrEqual(4);
    }
    // Roles that may not record inspections see no Inspections link at all.
    for (const role of ["manager", "designer", "admin"] as const) expect(siteNav("s1", [role]).map((i) => i.label), role).not.toContain("Inspections");
    expect(bar(["manager"])).toContain("Alerts");
    for (const role of ["engineer", "coordinator", "supervisor", "designer", "manager", "admin"] as const) {
      const scan = siteNav("s1", [role]).filter((i) => i.scan);
      expect(scan, role).toEqual([expect.objectContaining({ href: "/sites/s1/scan", primary: false })]);
    }
  });
});
