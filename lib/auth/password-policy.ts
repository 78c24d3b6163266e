// What a new password must be: at least 12 characters and not a common or easily guessed one.
// The guessability check is zxcvbn-ts with its common-password dictionary (a well-known estimator).
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";

export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 200;

let factory: ZxcvbnFactory | null = null;
function zxcvbn() {
  factory ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs });
  return factory;
}

/** Null when the password is acceptable, otherwise the reason in words. `userInputs`: name, e-mail… */
export function passwordProblem(password: string, userInputs: string[] = []): string | null {
  if (password.length < MIN_PASSWORD_LENGTH) return `Use at least ${MIN_PASSWORD_LENGTH} characters.`;
  if (password.length > MAX_PASSWORD_LENGTH) return `Use at most ${MAX_PASSWORD_LENGTH} characters.`;
  const inputs = userInputs.flatMap((s) => [s, ...s.split(/[@._\-\s]+/)]).map((s) => s.toLowerCase()).filter((s) => s.length >= 4);
  const letters = password.toLowerCase().replace(/[^a-z]/g, "");
  const own = inputs.map((s) => s.replace(/[^a-z]/g, "")).filter((s) => s.length >= 4);
  // Mostly the person's own name or address (a guesser tries those first).
  const leftover = own.reduce((rest, word) => rest.replace(word, ""), letters);
  if (own.some((w) => letters.includes(w)) && leftover.length < 6) return "Do not build the password from your name or e-mail address.";
  const result = zxcvbn().check(password, inputs);
  const commonWord = result.sequence.some((m) => m.pattern === "dictionary" && "dictionaryName" in m && m.dictionaryName === "passwords" && m.token.length >= password.length - 2);
  if (commonWord) return "That is one of the most common passwords. Choose another.";
  // Score 3 of 4: "safely unguessable" against an online attack with throttling (zxcvbn's scale).
  if (result.score < 3) return "That password is too easy to guess. Add more words or characters that do not follow a pattern.";
  return null;
}
