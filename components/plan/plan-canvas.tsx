"use client";
// A zone plan with pins drawn over it in one SVG layer (hundreds of pins stay smooth on a phone).
// Pins keep the same size on screen at any zoom; pinch (two fingers) or the buttons zoom, one
// finger or the scroll bars pan. A tap on the plan (not on a pin) reports where, as fractions 0–1.
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from "react";
import { lookOf, type PinState } from "@/lib/zone-plans/pin-look";

export type CanvasPin = { id: string; x: number; y: number; state: PinState; label: string; dim?: boolean };

const PIN_PX = 11;
/** Width of one character of a 12 px bold label, about 0.62 em (rounded up so a label never underestimates). */
const LABEL_CHAR_PX = 7.6;
const MIN_ZOOM = 1;
const MAX_ZOOM = 8;

export function PinGlyph({ state, size = 20 }: { state: PinState; size?: number }) {
  const look = lookOf(state);
  return (
    <svg width={size} height={size} viewBox="-1.2 -1.2 2.4 2.4" aria-hidden focusable="false" className="shrink-0">
      <circle r={1} fill={look.colour} stroke="#111" strokeWidth={0.15} />
      <path d={look.glyph} stroke="#fff" strokeWidth={0.28} fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}

export function PlanCanvas({
  imageUrl, width, height, pins, selectedId, onPinTap, onPlanTap, marker, labels = "auto", label = "Zone plan",
}: {
  imageUrl: string;
  width: number;
  height: number;
  pins: CanvasPin[];
  selectedId?: string | null;
  onPinTap?: (id: string) => void;
  onPlanTap?: (p: { x: number; y: number }) => void;
  /** The place being chosen (placing a member): drawn larger, with a cross-hair. */
  marker?: { x: number; y: number } | null;
  labels?: "auto" | "always";
  label?: string;
}) {
  const outer = useRef<HTMLDivElement>(null);
  const inner = useRef<HTMLDivElement>(null);
  const [zoom, setZoom] = useState(1);
  const [shownPx, setShownPx] = useState(0);
  const anchor = useRef<{ cx: number; cy: number; mx: number; my: number } | null>(null);
  const pinch = useRef<{ dist: number; zoom: number } | null>(null);

  useEffect(() => {
    const el = inner.current;
    if (!el) return;
    const ro = new ResizeObserver(() => setShownPx(el.getBoundingClientRect().width));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  // Keep the point under the fingers (or the centre) where it was after a zoom.
  useLayoutEffect(() => {
    const a = anchor.current;
    const o = outer.current;
    if (!a || !o) return;
    o.scrollLeft = a.cx * zoom - a.mx;
    o.scrollTop = a.cy * zoom - a.my;
    anchor.current = null;
  }, [zoom]);

  const zoomTo = useCallback((next: number, mx?: number, my?: number) => {
    const o = outer.current;
    const z = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, next));
    if (o) {
      const px = mx ?? o.clientWidth / 2;
      const py = my ?? o.clientHeight / 2;
      setZoom((old) => {
        anchor.current = { cx: (o.scrollLeft + px) / old, cy: (o.scrollTop + py) / old, mx: px, my: py };
        return z;
      });
    } else setZoom(z);
  }, []);

  // Pinch with two fingers: native touch listeners, because only a non-passive touchmove may stop
  // the browser from zooming the whole page instead of the plan. One finger still scrolls (pans).
  const zoomRef = useRef(zoom);
  zoomRef.current = zoom;
  useEffect(() => {
    const o = outer.current;
    if (!o) return;
    const spread = (t: TouchList) => Math.hypot(t[0]!.clientX - t[1]!.clientX, t[0]!.clientY - t[1]!.clientY);
    const start = (e: TouchEvent) => {
      if (e.touches.length === 2) pinch.current = { dist: spread(e.touches), zoom: zoomRef.current };
    };
    const move = (e: TouchEvent) => {
      if (e.touches.length !== 2 || !pinch.current) return;
      e.preventDefault();
      const r = o.getBoundingClientRect();
      const mx = (e.touches[0]!.clientX + e.touches[1]!.clientX) / 2 - r.left;
      const my = (e.touches[0]!.clientY + e.touches[1]!.clientY) / 2 - r.top;
      zoomTo((pinch.current.zoom * spread(e.touches)) / Math.max(1, pinch.current.dist), mx, my);
    };
    const end = (e: TouchEvent) => {
      if (e.touches.length < 2) pinch.current = null;
    };
    o.addEventListener("touchstart", start, { passive: true });
    o.addEventListener("touchmove", move, { passive: false });
    o.addEventListener("touchend", end, { passive: true });
    o.addEventListener("touchcancel", end, { passive: true });
    return () => {
      o.removeEventListener("touchstart", start);
      o.removeEventListener("touchmove", move);
      o.removeEventListener("touchend", end);
      o.removeEventListener("touchcancel", end);
    };
  }, [zoomTo]);

  // Viewbox units per screen pixel, so a pin is PIN_PX on screen whatever the zoom.
  const unit = shownPx > 0 ? width / shownPx : width / 800;
  const r = PIN_PX * unit;
  const showLabels = labels === "always" || pins.length <= 80 || zoom >= 2.5;
  // A label is drawn only where it reads: not over a neighbouring pin at this zoom (labels of a
  // tight row would print over each other). Zooming in spreads the pins and brings the labels back;
  // a hidden label's pin still has its icon, and a tap shows its tag.
  const labelled = useMemo(() => {
    if (labels === "always") return null;
    if (!showLabels) return new Set<string>();
    const at = pins.map((p) => ({ id: p.id, x: (p.x * width) / unit, y: (p.y * height) / unit, w: LABEL_CHAR_PX * p.label.length + 4 }));
    const keep = new Set<string>();
    for (const a of at) {
      const x0 = a.x + PIN_PX * 1.3;
      const x1 = x0 + a.w;
      const clash = at.some((b) => b !== a && b.x + PIN_PX > x0 && b.x - PIN_PX < x1 && Math.abs(b.y - a.y) < PIN_PX + 8);
      if (!clash) keep.add(a.id);
    }
    return keep;
  }, [labels, showLabels, pins, width, height, unit]);

  const drawn = useMemo(
    () =>
      pins.map((p) => {
        const look = lookOf(p.state);
        const selected = p.id === selectedId;
        const rr = selected ? r * 1.45 : r;
        return (
          <g
            key={p.id}
            transform={`translate(${p.x * width} ${p.y * height})`}
            opacity={p.dim ? 0.45 : 1}
            onClick={onPinTap ? (e) => { e.stopPropagation(); onPinTap(p.id); } : undefined}
            style={{ cursor: onPinTap ? "pointer" : undefined }}
            role={onPinTap ? "button" : undefined}
            aria-label={`${p.label}`}
            data-pin={p.id}
            data-state={p.state}
          >
            <circle r={rr * 1.9} fill="transparent" />
            <circle r={rr} fill={look.colour} stroke={selected ? "#000" : "#111"} strokeWidth={(selected ? 3 : 1.2) * unit} />
            <path d={look.glyph} transform={`scale(${rr})`} stroke="#fff" strokeWidth={0.28} fill="none" strokeLinecap="round" strokeLinejoin="round" />
            {(labelled === null || labelled.has(p.id)) || selected ? (
              <text x={rr * 1.3} y={rr * 0.45} fontSize={12 * unit} fontWeight={700} fill="#111" stroke="#fff" strokeWidth={3 * unit} paintOrder="stroke">
                {p.label}
              </text>
            ) : null}
          </g>
        );
      }),
    [pins, selectedId, r, unit, width, height, onPinTap, labelled],
  );

  const onClick = (e: React.MouseEvent) => {
    if (!onPlanTap || !inner.current) return;
    const b = inner.current.getBoundingClientRect();
    const x = (e.clientX - b.left) / b.width;
    const y = (e.clientY - b.top) / b.height;
    if (x < 0 || x > 1 || y < 0 || y > 1) return;
    onPlanTap({ x: Math.round(x * 10000) / 10000, y: Math.round(y * 10000) / 10000 });
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Zoom">
        <button type="button" className="min-h-touch min-w-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3 font-bold" onClick={() => zoomTo(zoom / 1.5)} aria-label="Zoom out">−</button>
        <button type="button" className="min-h-touch min-w-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3 font-bold" onClick={() => zoomTo(zoom * 1.5)} aria-label="Zoom in">+</button>
        <button type="button" className="min-h-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3" onClick={() => zoomTo(1)}>Whole plan</button>
        <span className="text-sm text-ink-soft">{Math.round(zoom * 100)} % · pinch to zoom</span>
      </div>
      <div
        ref={outer}
        className="max-h-[70vh] overflow-auto rounded-lg border-2 border-ink/20 bg-white"
        style={{ touchAction: "pan-x pan-y" }}
        data-testid="plan-canvas"
      >
        <div ref={inner} className="relative" style={{ width: `${zoom * 100}%`, aspectRatio: `${width} / ${height}` }}>
          {/* eslint-disable-next-line @next/next/no-img-element -- a presigned store URL, drawn at its own size */}
          <img src={imageUrl} alt={label} width={width} height={height} className="block h-full w-full select-none" draggable={false} />
          <svg
            viewBox={`0 0 ${width} ${height}`}
            className="absolute inset-0 h-full w-full"
            onClick={onClick}
            role={onPlanTap ? "application" : "img"}
            aria-label={onPlanTap ? `${label}: tap where the member stands` : `${label} with ${pins.length} members`}
            style={{ cursor: onPlanTap ? "crosshair" : undefined }}
            data-testid="plan-svg"
          >
            {drawn}
            {marker ? (
              <g transform={`translate(${marker.x * width} ${marker.y * height})`} pointerEvents="none" data-testid="plan-marker">
                <circle r={r * 1.8} fill="none" stroke="#000" strokeWidth={3 * unit} />
                <circle r={r * 1.8} fill="none" stroke="#fff" strokeWidth={1.2 * unit} />
                <path d={`M ${-r * 3} 0 H ${-r * 0.6} M ${r * 0.6} 0 H ${r * 3} M 0 ${-r * 3} V ${-r * 0.6} M 0 ${r * 0.6} V ${r * 3}`} stroke="#000" strokeWidth={2 * unit} />
              </g>
            ) : null}
          </svg>
        </div>
      </div>
    </div>
  );
}
