// New passwords: at least 12 characters and not a common one (zxcvbn-ts common-password list).
import { describe, expect, it } from "vitest";
import { passwordProblem } from "@/lib/auth/password-policy";

describe("passwordProblem", () => {
  it("refuses anything shorter than 12 characters", () => {
    expect(passwordProblem("Xk7#pQ2!mZ")).toMatch(/at least 12 characters/);
  });

  it.each([["password1234"], ["123456789012"], ["qwertyuiopas"], ["iloveyou1234"]])("refuses the common or patterned password %j", (pw) => {
    expect(passwordProblem(pw)).not.toBeNull();
  });

  it("refuses a password made of the person's own e-mail", () => {
    expect(passwordProblem("maria.kowalska2026", ["Maria Kowalska", "maria.kowalska@site.example"])).not.toBeNull();
  });

  it("accepts a long passphrase of unrelated words", () => {
    expect(passwordProblem("violet harbour crane 47")).toBeNull();
    expect(passwordProblem("gravel-otter-lantern-91")).toBeNull();
  });
});
