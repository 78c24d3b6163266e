// Fitting a label's words into its text box: lines measured with the PDF's own font, so nothing
// runs past the label's right edge or bottom into the next label. Pure (the width of a string at a
// size is passed in), so the rules can be tested without drawing a PDF.

/** Width in points of `text` set at `size` points. */
export type Measure = (text: string, size: number) => number;

const ELLIPSIS = "…";

/**
 * Pieces of a text that may end a line. Spaces are break points (and dropped at a line's end); a
 * line may also end just after one of `breakAfter` (the character stays on the first line and no
 * hyphen is added, so a tag reads exactly as written).
 */
function pieces(text: string, breakAfter: string): string[] {
  const set = breakAfter.replace(/[\\\]^-]/g, "\\$&");
  return text.match(new RegExp(`[^\\s${set}]*[${set}]+|\\S+|\\s+`, "gu")) ?? [];
}

/** Where a tag may break (its own separators), and where words of a name may. */
export const TAG_BREAKS = "-_./";
export const WORD_BREAKS = "-/–";

/** The longest start of `word` (by characters) that fits `width`, at least one character. */
function fitChars(word: string, size: number, width: number, measure: Measure) {
  const chars = [...word];
  let n = 1;
  while (n < chars.length && measure(chars.slice(0, n + 1).join(""), size) <= width) n++;
  return chars.slice(0, n).join("");
}

/** `line` cut short so that it and an ellipsis fit `width`. */
function withEllipsis(line: string, size: number, width: number, measure: Measure) {
  const chars = [...line.trimEnd()];
  while (chars.length > 0 && measure(chars.join("").trimEnd() + ELLIPSIS, size) > width) chars.pop();
  return chars.join("").trimEnd() + ELLIPSIS;
}

/**
 * Greedy line filling: words (or tag pieces) wrap at the break points above; a piece wider than the
 * box is split between characters. More than `maxLines` lines: the last shown line ends with "…".
 */
export function wrapLines(
  text: string,
  { size, width, maxLines, measure, breakAfter = WORD_BREAKS }: { size: number; width: number; maxLines: number; measure: Measure; breakAfter?: string },
) {
  const lines: string[] = [];
  let line = "";
  const queue = pieces(text.replace(/\s+/g, " ").trim(), breakAfter);
  while (queue.length > 0) {
    const piece = queue.shift()!;
    const candidate = line + piece;
    if (measure(candidate.trimEnd(), size) <= width) {
      line = candidate;
      continue;
    }
    if (/^\s+$/.test(piece)) continue; // a space at a line's end is dropped
    if (line.trim() !== "") {
      lines.push(line.trimEnd());
      line = "";
      queue.unshift(piece);
      continue;
    }
    // A piece wider than a whole line: as many characters as fit, the rest on the next line.
    const head = fitChars(piece, size, width, measure);
    lines.push(head);
    const rest = piece.slice(head.length);
    if (rest) queue.unshift(rest);
  }
  if (line.trim() !== "") lines.push(line.trimEnd());
  if (lines.length <= maxLines) return { lines, truncated: false };
  const shown = lines.slice(0, maxLines);
  shown[maxLines - 1] = withEllipsis(shown[maxLines - 1]!, size, width, measure);
  return { lines: shown, truncated: true };
}

export type LabelBlock = { lines: string[]; size: number; lineHeight: number; gapBefore: number };

export const LABEL_TEXT = {
  typeSize: 6.5,
  zoneSize: 6.5,
  siteSize: 5.5,
  lineHeight: 1.2,
  tagLineHeight: 1.1,
  /** Tag sizes tried from the largest: one line at 10 pt or more, else two lines, else up to four at 7 pt or less. */
  tagSizes: [17, 14, 12, 10, 8.5, 7, 6] as const,
};

/**
 * The lines of one label's text box (`width` × `height` points): the tag as large as it fits whole
 * (on one line where it can be at 10 pt or more),
 * then the type (3 lines at most), the zone (2) and the site (1), each cut with "…" if longer. The
 * blocks' total height never exceeds `height`.
 */
export function layoutLabelText(
  m: { tag: string; typeName: string; zoneName: string | null; siteLabel: string },
  { width, height, measureBold, measure }: { width: number; height: number; measureBold: Measure; measure: Measure },
): LabelBlock[] {
  const T = LABEL_TEXT;
  const rest = (typeLines: number): LabelBlock[] => {
    const out: LabelBlock[] = [
      { lines: wrapLines(m.typeName, { size: T.typeSize, width, maxLines: typeLines, measure }).lines, size: T.typeSize, lineHeight: T.lineHeight, gapBefore: 3 },
    ];
    if (m.zoneName) out.push({ lines: wrapLines(m.zoneName, { size: T.zoneSize, width, maxLines: 2, measure }).lines, size: T.zoneSize, lineHeight: T.lineHeight, gapBefore: 2 });
    out.push({ lines: wrapLines(m.siteLabel, { size: T.siteSize, width, maxLines: 1, measure }).lines, size: T.siteSize, lineHeight: T.lineHeight, gapBefore: 2 });
    return out;
  };
  const total = (blocks: LabelBlock[]) => blocks.reduce((h, b) => h + b.gapBefore + b.lines.length * b.size * b.lineHeight, 0);

  const smallest = T.tagSizes[T.tagSizes.length - 1]!;
  // A short tag on one line at a readable size first, then two lines, then up to four small lines.
  const tries = [
    ...T.tagSizes.filter((size) => size >= 10).map((size) => ({ size, maxLines: 1 })),
    ...T.tagSizes.map((size) => ({ size, maxLines: 2 })),
    ...T.tagSizes.filter((size) => size <= 7).map((size) => ({ size, maxLines: 4 })),
  ];
  for (const typeLines of [3, 2, 1]) {
    for (const { size, maxLines } of tries) {
      const tag = wrapLines(m.tag, { size, width, maxLines, measure: measureBold, breakAfter: TAG_BREAKS });
      if (tag.truncated && !(size === smallest && maxLines === 4)) continue;
      const blocks = [{ lines: tag.lines, size, lineHeight: T.tagLineHeight, gapBefore: 0 }, ...rest(typeLines)];
      if (total(blocks) <= height) return blocks;
    }
  }
  // Not reached with a label's box and the sizes above; kept so the result always fits.
  return [{ lines: wrapLines(m.tag, { size: smallest, width, maxLines: 4, measure: measureBold, breakAfter: TAG_BREAKS }).lines, size: smallest, lineHeight: T.tagLineHeight, gapBefore: 0 }];
}
