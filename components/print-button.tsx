"use client";
// Prints the page with the print stylesheet (no navigation, no buttons, tables in full).
import { buttonClass } from "@/components/ui/button";

export function PrintButton({ label = "Print" }: { label?: string }) {
  return (
    <button type="button" className={buttonClass("secondary", "hidden text-sm md:inline-flex md:text-base print:hidden")} onClick={() => window.print()}>
      {label}
    </button>
  );
}
