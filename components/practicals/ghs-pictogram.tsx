import type { ReactNode } from "react";
import { GHS_PICTOGRAMS, type GhsCode } from "@/lib/ghs";

/*
 * The nine GHS hazard pictograms (an open UN standard): a red diamond frame on white around a
 * black symbol. The symbols below are our own simple drawings on a 100 × 100 grid, kept inside
 * the diamond; the colours are the standard's red and black, not the app palette, so they read
 * the same in light and dark themes.
 */

const RED = "#c8102e";
const INK = "#111111";

function Flame({ top, bottom }: { top: number; bottom: number }) {
  const h = bottom - top;
  const y = (f: number) => top + h * f;
  return (
    <path
      fill={INK}
      d={`M50 ${y(0)} C58 ${y(0.2)} 66 ${y(0.38)} 64 ${y(0.62)} C63 ${y(0.85)} 57 ${y(1)} 50 ${y(1)} C42 ${y(1)} 36 ${y(0.86)} 36 ${y(0.68)} C36 ${y(0.52)} 41 ${y(0.44)} 43 ${y(0.3)} C46 ${y(0.42)} 48 ${y(0.5)} 51 ${y(0.52)} C52 ${y(0.36)} 47 ${y(0.2)} 50 ${y(0)} Z`}
    />
  );
}

const SYMBOLS: Record<GhsCode, ReactNode> = {
  GHS01: (
    <g fill={INK} stroke={INK}>
      <circle cx="43" cy="62" r="10" stroke="none" />
      <path d="M49 54 L55 47" strokeWidth="3" strokeLinecap="round" fill="none" />
      <g strokeWidth="2.6" strokeLinecap="round" fill="none">
        <path d="M57 44 L55 30" />
        <path d="M60 45 L69 35" />
        <path d="M61 49 L73 48" />
        <path d="M59 52 L68 60" />
        <path d="M54 42 L46 32" />
      </g>
      <path d="M35 40 l6 -3 l1 6 z" stroke="none" />
      <path d="M62 26 l5 2 l-4 4 z" stroke="none" />
      <path d="M70 62 l5 1 l-3 5 z" stroke="none" />
      <path d="M28 52 l5 -1 l-1 5 z" stroke="none" />
    </g>
  ),
  GHS02: (
    <g>
      <Flame top={24} bottom={64} />
      <rect x="33" y="68" width="34" height="4.5" fill={INK} />
    </g>
  ),
  GHS03: (
    <g>
      <Flame top={22} bottom={50} />
      <circle cx="50" cy="58" r="8.5" fill="none" stroke={INK} strokeWidth="4.5" />
      <rect x="33" y="70" width="34" height="4.5" fill={INK} />
    </g>
  ),
  GHS04: (
    <g fill={INK} transform="rotate(-18 50 55)">
      <rect x="28" y="49" width="40" height="15" rx="7.5" />
      <rect x="67" y="52.5" width="6" height="8" />
      <rect x="73" y="50" width="3.5" height="13" rx="1" />
      <rect x="34" y="52" width="14" height="2.2" rx="1.1" fill="#ffffff" />
    </g>
  ),
  GHS05: (
    <g>
      <g transform="translate(38 35) rotate(-50)">
        <path d="M-4.5 12 V-8.5 a4.5 4.5 0 0 1 9 0 V12" fill="#ffffff" stroke={INK} strokeWidth="2.6" />
        <rect x="-4.5" y="4" width="9" height="8" fill={INK} />
      </g>
      <g transform="translate(62 35) rotate(50)">
        <path d="M-4.5 12 V-8.5 a4.5 4.5 0 0 1 9 0 V12" fill="#ffffff" stroke={INK} strokeWidth="2.6" />
        <rect x="-4.5" y="4" width="9" height="8" fill={INK} />
      </g>
      <g fill={INK}>
        <path d="M42 46 q2.2 4.5 0 7 q-2.2 -2.5 0 -7z" />
        <path d="M42 56 q1.8 3.5 0 5.5 q-1.8 -2 0 -5.5z" />
        <path d="M58 46 q2.2 4.5 0 7 q-2.2 -2.5 0 -7z" />
        <path d="M58 56 q1.8 3.5 0 5.5 q-1.8 -2 0 -5.5z" />
        <path d="M27 65 h20 v8 h-20 z M33 65 q2 3 4 0 z" />
        <path d="M52 63 h3.5 v-6 a1.7 1.7 0 0 1 3.4 0 v6 h1 v-4.5 a1.7 1.7 0 0 1 3.4 0 v4.5 h1 v-3.5 a1.7 1.7 0 0 1 3.4 0 v10.5 q0 4 -4 4 h-11.7 z" />
      </g>
      <path d="M33 65 q2 3.2 4 0" fill="#ffffff" />
      <path d="M56 68 l2.5 2.5 l2.5 -2.5" stroke="#ffffff" strokeWidth="1.6" fill="none" />
    </g>
  ),
  GHS06: (
    <g>
      <g stroke={INK} strokeWidth="5" strokeLinecap="round">
        <path d="M34 58 L66 75" />
        <path d="M66 58 L34 75" />
      </g>
      <g fill={INK}>
        <circle cx="31.5" cy="56" r="3" />
        <circle cx="68.5" cy="56" r="3" />
        <circle cx="31.5" cy="77" r="3" />
        <circle cx="68.5" cy="77" r="3" />
      </g>
      <ellipse cx="50" cy="38" rx="13" ry="12" fill={INK} />
      <rect x="43" y="45" width="14" height="10" rx="2" fill={INK} />
      <g fill="#ffffff">
        <circle cx="44.5" cy="38" r="3.6" />
        <circle cx="55.5" cy="38" r="3.6" />
        <path d="M50 42 l2.2 4 h-4.4 z" />
        <rect x="46" y="51" width="1.6" height="4" />
        <rect x="49.2" y="51" width="1.6" height="4" />
        <rect x="52.4" y="51" width="1.6" height="4" />
      </g>
    </g>
  ),
  GHS07: (
    <g fill={INK}>
      <path d="M44.5 25 h11 l-2.6 36 h-5.8 z" />
      <circle cx="50" cy="70" r="5" />
    </g>
  ),
  GHS08: (
    <g>
      <circle cx="50" cy="31" r="7.5" fill={INK} />
      <path d="M33 74 C33 53 39 43 50 43 C61 43 67 53 67 74 Z" fill={INK} />
      <path
        fill="#ffffff"
        d="M50 51 L52.2 56.4 L57.8 55 L54.6 59.8 L58.6 63.8 L53 64 L52 69.6 L50 64.6 L48 69.6 L47 64 L41.4 63.8 L45.4 59.8 L42.2 55 L47.8 56.4 Z"
      />
    </g>
  ),
  GHS09: (
    <g stroke={INK} strokeLinecap="round" fill="none">
      <path d="M28 72 H72" strokeWidth="3" />
      <path d="M38 72 V34" strokeWidth="3.4" />
      <path d="M38 44 L30 36 M38 52 L46 42 M38 40 L44 32 M46 42 L50 40" strokeWidth="2.4" />
      <ellipse cx="54" cy="63" rx="11" ry="5" fill={INK} stroke="none" />
      <path d="M63 63 L71 57 V69 Z" fill={INK} stroke="none" />
      <path d="M47 61 l2.6 2.6 M49.6 61 l-2.6 2.6" stroke="#ffffff" strokeWidth="1.3" />
    </g>
  ),
};

export function ghsName(code: GhsCode): string {
  return GHS_PICTOGRAMS.find((p) => p.code === code)?.name ?? code;
}

/**
 * One GHS pictogram. By default it is an image named for screen readers ("Corrosive"); pass
 * `decorative` when a visible label beside it already names it.
 */
export function GhsPictogram({ code, size = 56, decorative = false, className }: { code: GhsCode; size?: number; decorative?: boolean; className?: string }) {
  const name = ghsName(code);
  return (
    <svg
      width={size}
      height={size}
      viewBox="0 0 100 100"
      className={className}
      focusable="false"
      {...(decorative ? { "aria-hidden": true } : { role: "img", "aria-label": name })}
    >
      {decorative ? null : <title>{name}</title>}
      <polygon points="50,5 95,50 50,95 5,50" fill="#ffffff" stroke={RED} strokeWidth="7" strokeLinejoin="miter" />
      {SYMBOLS[code]}
    </svg>
  );
}
