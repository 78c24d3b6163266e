// A missing or wrong-kind value is named in plain words, never with zod's internal wording.
import { describe, expect, it } from "vitest";
import { z } from "zod";
import "@/lib/validations/messages";
import { setupSchema } from "@/lib/validations/onboarding";
import { fieldErrorsFromZod } from "@/lib/errors";

describe("validation messages", () => {
  it("first-run setup with nothing filled in names each field in a sentence", () => {
    const r = setupSchema.safeParse({});
    expect(r.success).toBe(false);
    const fields = fieldErrorsFromZod(r.error!.issues);
    expect(fields).toEqual({
      organisationName: "Enter your organisation's name.",
      name: "Enter a name.",
      email: "Enter an e-mail address.",
      password: "Enter a password.",
    });
  });

  it("a field without a sentence of its own still reads as plain words", () => {
    const schema = z.object({ count: z.number(), label: z.string() });
    const fields = fieldErrorsFromZod(schema.safeParse({ label: 12 }).error!.issues);
    expect(fields.count).toBe("This value is required.");
    expect(fields.label).toBe("This value must be text.");
    for (const m of Object.values(fields)) expect(m).not.toMatch(/Invalid input|expected|received|undefined/);
  });
});
