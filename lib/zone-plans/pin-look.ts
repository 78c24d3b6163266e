// How a member looks on a plan: a word, an icon and a colour together (never colour alone), the
// same on the screen and on the printed plan. Glyphs are drawn in a -1…1 box inside the pin's disc.
import { MEMBER_STATUS_LABELS } from "@/lib/labels";

export type PinState = "fail" | "out" | "unchecked" | "struck" | "loaded" | "draft" | "pass";

type Status = keyof typeof MEMBER_STATUS_LABELS;

export type PinLook = { state: PinState; word: string; colour: string; glyph: string; legend: string };

/** Stroked glyph paths (white on the coloured disc). */
const GLYPHS: Record<PinState, string> = {
  fail: "M -0.5 -0.5 L 0.5 0.5 M 0.5 -0.5 L -0.5 0.5",
  out: "M -0.5 0.5 L 0.5 -0.5",
  unchecked: "M 0 -0.6 L 0 0.15 M 0 0.5 L 0 0.55",
  struck: "M -0.55 0 L 0.55 0",
  loaded: "M -0.45 -0.45 L 0.45 -0.45 L 0.45 0.45 L -0.45 0.45 Z",
  draft: "M -0.5 0.05 L -0.15 0.4 L 0.5 -0.35",
  pass: "M -0.5 0.05 L -0.15 0.4 L 0.5 -0.35",
};

const LOOKS: Record<PinState, Omit<PinLook, "state" | "glyph">> = {
  fail: { word: "Fail", colour: "#b42318", legend: "Fails its capacity check (over capacity, or no capacity could be found)" },
  out: { word: "Out of service", colour: "#5b21b6", legend: "Out of service: not to be relied on until a passing inspection" },
  unchecked: { word: "Not checked", colour: "#a15c07", legend: "No completed capacity check yet" },
  struck: { word: "Struck", colour: "#4b5563", legend: "Struck (removed) under a permit to strike" },
  loaded: { word: "Loaded", colour: "#1d4ed8", legend: "Passes its check and is loaded under a permit" },
  draft: { word: "Pass, draft", colour: "#0f766e", legend: "Passes its check; still a draft (not submitted)" },
  pass: { word: "Pass", colour: "#15803d", legend: "Passes its check; submitted, not loaded yet" },
};

/** The order of the legend: what needs attention first. */
export const PIN_STATES: readonly PinState[] = ["fail", "out", "unchecked", "draft", "pass", "loaded", "struck"];

export function pinState({ status, pass }: { status: Status; pass: boolean | null }): PinState {
  if (status === "struck") return "struck";
  if (pass === false) return "fail";
  if (status === "out_of_service") return "out";
  if (pass == null) return "unchecked";
  if (status === "loaded") return "loaded";
  if (status === "draft") return "draft";
  return "pass";
}

export function lookOf(state: PinState): PinLook {
  return { state, glyph: GLYPHS[state], ...LOOKS[state] };
}

export function pinLook(m: { status: Status; pass: boolean | null }): PinLook {
  return lookOf(pinState(m));
}
