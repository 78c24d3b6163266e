// E-mail with a single-use link to set a new password.
import { renderEmail } from "./layout";

export function passwordResetEmail(p: { name: string; url: string }) {
  return renderEmail({
    title: "Set a new Strutwise password",
    paragraphs: [
      `Hello ${p.name}, someone (we hope you) asked to set a new password for your Strutwise account.`,
      "The link works once, within 1 hour. If you did not ask, ignore this e-mail: your password stays as it is.",
    ],
    link: { href: p.url, label: "Set a new password" },
  });
}
