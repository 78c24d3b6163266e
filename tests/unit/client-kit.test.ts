// The client kit: one way figures are written, server refusals placed on form fields, drafts read
// back from the device, and the register's column choice in the address.
import { afterEach, describe, expect, it } from "vitest";
import { placeServerErrors } from "@/components/use-server-errors";
import { readLocalDraft } from "@/components/use-local-draft";
import { formatForceFor, formatLengthFor, formatUtilisation } from "@/lib/client/format";
import { columnsParam, DEFAULT_COLUMNS, parseColumns } from "@/app/(app)/sites/[siteId]/members/register-columns";

describe("figures in the site's units", () => {
  it("writes forces in kN on an SI site and kip on a US one", () => {
    // 1 kN = 1000 N (SI Brochure, 9th edition, Table 7: prefix kilo = 10^3).
    expect(formatForceFor(12_345, "si")).toBe("12.3 kN");
    // 1 kip = 1000 lbf = 4448.2216152605 N (NIST SP 811, 2008, Appendix B.8: 1 lbf = 4.448 222 N).
    expect(formatForceFor(44_482.216152605, "us")).toBe("10.00 kip");
    expect(formatForceFor(null, "si")).toBe("—");
    expect(formatForceFor(Number.NaN, "us")).toBe("—");
  });

  it("writes lengths in millimetres on an SI site and feet and inches on a US one", () => {
    expect(formatLengthFor(2650, "si")).toBe("2650 mm");
    // 1 ft = 0.3048 m exactly, 1 in = 25.4 mm exactly (international yard and pound, 1959; NIST SP 811 B.8).
    expect(formatLengthFor(2438.4, "us")).toBe(`8' 0"`);
    expect(formatLengthFor(2590.8, "us")).toBe(`8' 6"`);
    expect(formatLengthFor(undefined, "si")).toBe("—");
  });

  it("writes utilisation as a whole per cent, and a dash when there is none", () => {
    expect(formatUtilisation(0.874)).toBe("87 %");
    expect(formatUtilisation(1.03)).toBe("103 %");
    expect(formatUtilisation(null)).toBe("—");
    expect(formatUtilisation(Number.POSITIVE_INFINITY)).toBe("—");
  });
});

describe("server refusals on form fields", () => {
  const recorder = () => {
    const set: Record<string, string> = {};
    const setError = ((name: string, e: { message?: string }) => {
      set[name] = e.message ?? "";
    }) as never;
    return { set, setError };
  };

  it("puts each message on the field it names, under the form's own name for it", () => {
    const { set, setError } = recorder();
    const out = placeServerErrors(
      { status: 422, code: "validation", message: "Some values need attention.", fields: { extensionMm: "Too long for this prop.", tag: "Tag already used." } },
      setError,
      { fieldOf: (k) => (k === "extensionMm" ? "extension" : k) },
    );
    expect(set).toEqual({ extension: "Too long for this prop.", tag: "Tag already used." });
    expect(out).toEqual({ placed: ["extension", "tag"], unplaced: [] });
  });

  it("returns the messages no field shows, and the refusal's own message when it names no field", () => {
    const { set, setError } = recorder();
    const out = placeServerErrors(
      { status: 422, code: "validation", message: "x", fields: { photoIds: "A photo is still uploading.", _: "The member was changed meanwhile." } },
      setError,
      { isField: (k) => k === "tag" },
    );
    expect(set).toEqual({});
    expect(out.unplaced).toEqual(["A photo is still uploading.", "The member was changed meanwhile."]);
    const none = placeServerErrors({ status: 409, code: "conflict", message: "Already issued.", fields: {} }, recorder().setError);
    expect(none).toEqual({ placed: [], unplaced: ["Already issued."] });
  });
});

describe("drafts kept on the device", () => {
  const g = globalThis as unknown as { window?: unknown };
  afterEach(() => delete g.window);
  const withStorage = (items: Record<string, string>) => {
    g.window = { localStorage: { getItem: (k: string) => items[k] ?? null } };
  };

  it("reads back a draft, and ignores one that is missing, unreadable or not a draft", () => {
    withStorage({ a: JSON.stringify({ values: { tag: "P1" } }), broken: "{not json", n: "42" });
    expect(readLocalDraft("a")).toEqual({ values: { tag: "P1" } });
    expect(readLocalDraft("missing")).toBeNull();
    expect(readLocalDraft("broken")).toBeNull();
    expect(readLocalDraft("n")).toBeNull();
    expect(readLocalDraft("a", (raw) => ((raw as { photos?: unknown }).photos ? (raw as object) : null))).toBeNull();
  });
});

describe("register columns in the address", () => {
  it("shows the default set without a cols key, and keeps plain links plain", () => {
    expect(parseColumns(null)).toEqual([...DEFAULT_COLUMNS]);
    expect(columnsParam(parseColumns(null))).toBeUndefined();
  });

  it("round-trips a choice in the table's order, ignores unknown names and can show none", () => {
    expect(parseColumns("scheme,load,nonsense")).toEqual(["load", "scheme"]);
    expect(columnsParam(["scheme", "load"])).toBe("load,scheme");
    expect(parseColumns("none")).toEqual([]);
    expect(columnsParam([])).toBe("none");
  });
});
