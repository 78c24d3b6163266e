// When a member was last changed, as the register shows it. Force, length and utilisation are
// written by the client kit (lib/client/format.ts).

export function formatUpdated(iso: string): string {
  const d = new Date(iso);
  return d.toLocaleString("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });
}
