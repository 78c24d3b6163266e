import type { NavIcon } from "@/lib/navigation";

const paths: Record<NavIcon | "more" | "user" | "ok" | "bad" | "warn", string> = {
  overview: "M3 3h8v8H3zM13 3h8v5h-8zM13 10h8v11h-8zM3 13h8v8H3z",
  register: "M4 4h16v3H4zM4 10h16v3H4zM4 16h16v3H4z",
  add: "M11 4h2v7h7v2h-7v7h-2v-7H4v-2h7z",
  permit: "M6 2h9l5 5v15H6zM14 3v5h5M9 13l2 2 4-4",
  inspect: "M10 3a7 7 0 1 1 0 14 7 7 0 0 1 0-14zM15 15l6 6",
  alert: "M12 3l10 18H2zM12 10v5M12 17v1",
  calc: "M5 2h14v20H5zM8 5h8v4H8zM8 12h2v2H8zM12 12h2v2h-2zM8 16h2v2H8zM12 16h2v2h-2z",
  library: "M4 3h4v18H4zM10 3h4v18h-4zM16 4l4 1-3 16-4-1z",
  scheme: "M3 20h18M6 20V8l6-5 6 5v12M10 20v-6h4v6",
  people: "M9 11a4 4 0 1 0 0-8 4 4 0 0 0 0 8zM2 21c0-4 3-7 7-7s7 3 7 7M17 11a3 3 0 1 0 0-6M22 21c0-3-2-6-5-6",
  sites: "M3 21V9l9-6 9 6v12zM9 21v-7h6v7",
  settings: "M12 8a4 4 0 1 0 0 8 4 4 0 0 0 0-8zM12 2v3M12 19v3M2 12h3M19 12h3M5 5l2 2M17 17l2 2M5 19l2-2M17 7l2-2",
  // A QR code's corner squares inside a viewfinder.
  scan: "M3 8V3h5M16 3h5v5M21 16v5h-5M8 21H3v-5M7 7h4v4H7zM13 13h4v4h-4zM13 7h4v4h-4zM7 13h4v4H7z",
  more: "M5 12h.01M12 12h.01M19 12h.01",
  user: "M12 12a5 5 0 1 0 0-10 5 5 0 0 0 0 10zM3 22c0-5 4-8 9-8s9 3 9 8",
  ok: "M4 12l5 5L20 6",
  bad: "M6 6l12 12M18 6L6 18",
  warn: "M12 3l10 18H2zM12 10v5M12 17v1",
};

export function Icon({ name, className = "h-6 w-6" }: { name: keyof typeof paths; className?: string }) {
  return (
    <svg viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth={2} strokeLinecap="round" strokeLinejoin="round" className={className} aria-hidden>
      <path d={paths[name]} />
    </svg>
  );
}
