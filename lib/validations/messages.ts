// Plain-words fallbacks for zod's own messages ("Invalid input: expected string, received
// undefined"), for any schema field without a sentence of its own. Imported for its effect by the
// server's parsing seam (lib/api/route.ts) and the browser's API client (lib/client/api.ts).
import { z } from "zod";

const KIND: Record<string, string> = {
  string: "text",
  number: "a number",
  int: "a whole number",
  boolean: "yes or no (true or false)",
  array: "a list",
  object: "a set of values",
  date: "a date",
};

z.config({
  customError: (iss) => {
    if (iss.code === "invalid_type") {
      if (iss.input === undefined || iss.input === null || iss.input === "") return "This value is required.";
      const kind = KIND[String(iss.expected)];
      return kind ? `This value must be ${kind}.` : "This value is not of the expected kind.";
    }
    if (iss.code === "unrecognized_keys") return "This value is not one that can be given here.";
    return undefined;
  },
});

export {};
