// Invented "photos" for the demo school, drawn by us as SVG and given a camera's look with sharp
// (soft focus, grain, a vignette). Nothing here is a real photograph of anyone or anywhere.
import path from "node:path";
import sharp from "sharp";
import { seededRandom } from "./people";

export const PHOTO_WIDTH = 1200;
export const PHOTO_HEIGHT = 900;
const W = PHOTO_WIDTH;
const H = PHOTO_HEIGHT;

const FONT = "DejaVu Sans";
const INK = "#1f3a8a";

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
const f = (n: number) => Number(n.toFixed(1));

/**
 * Darker corners as a phone camera gives, and soft shadows. Everything is gradients: SVG blur
 * filters cost a second a picture, too slow for the first start of the demo.
 */
const VIGNETTE = `
  <radialGradient id="vignette" cx="45%" cy="40%" r="75%">
    <stop offset="55%" stop-color="#000" stop-opacity="0"/>
    <stop offset="100%" stop-color="#000" stop-opacity="0.42"/>
  </radialGradient>
  <radialGradient id="shadow"><stop offset="0" stop-color="#000" stop-opacity="0.5"/><stop offset="1" stop-color="#000" stop-opacity="0"/></radialGradient>
  <radialGradient id="blobLight"><stop offset="0" stop-color="#f4f4ec" stop-opacity="0.9"/><stop offset="0.7" stop-color="#f4f4ec" stop-opacity="0.6"/><stop offset="1" stop-color="#f4f4ec" stop-opacity="0"/></radialGradient>
  <radialGradient id="blobYellow"><stop offset="0" stop-color="#e7c66a" stop-opacity="0.8"/><stop offset="0.7" stop-color="#e7c66a" stop-opacity="0.55"/><stop offset="1" stop-color="#e7c66a" stop-opacity="0"/></radialGradient>
  <linearGradient id="blobPipe" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#8c969a" stop-opacity="0"/><stop offset="0.5" stop-color="#8c969a" stop-opacity="0.45"/><stop offset="1" stop-color="#8c969a" stop-opacity="0"/></linearGradient>`;

function frame(defs: string, body: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
<defs>${VIGNETTE}${defs}</defs>
${body}
<rect width="${W}" height="${H}" fill="url(#vignette)"/>
</svg>`;
}

/** The lab wall and a dark resin bench top, slightly out of focus. */
const LAB_DEFS = `
  <linearGradient id="wall" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#d9e0df"/><stop offset="1" stop-color="#aeb9b8"/></linearGradient>
  <linearGradient id="bench" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#4a5154"/><stop offset="0.08" stop-color="#2b3033"/><stop offset="1" stop-color="#1d2123"/></linearGradient>`;

function labBackground(benchTop: number): string {
  return `<rect width="${W}" height="${benchTop}" fill="url(#wall)"/>
  <ellipse cx="185" cy="235" rx="170" ry="210" fill="url(#blobLight)"/>
  <ellipse cx="1010" cy="140" rx="200" ry="140" fill="url(#blobYellow)"/>
  <rect x="365" y="100" width="56" height="${benchTop - 100}" fill="url(#blobPipe)"/>
  <rect y="${benchTop}" width="${W}" height="${H - benchTop}" fill="url(#bench)"/>
  <rect y="${benchTop}" width="${W}" height="6" fill="#6b7377" opacity="0.7"/>`;
}

/**
 * A gas syringe held level, read at `reading` cm³ (0–100): the plunger's seal stands at that mark.
 */
export function gasSyringeSvg(reading: number): string {
  const r = Math.max(0, Math.min(100, reading));
  const x0 = 175;
  const per = 7.6;
  const y = 420;
  const h = 120;
  const head = x0 + r * per;
  let ticks = "";
  for (let v = 0; v <= 100; v++) {
    const x = x0 + v * per;
    const len = v % 10 === 0 ? 34 : v % 5 === 0 ? 24 : 14;
    ticks += `<line x1="${x}" y1="${y - h / 2 + 4}" x2="${x}" y2="${y - h / 2 + 4 + len}" stroke="#1d2b33" stroke-width="${v % 10 === 0 ? 2.4 : 1.4}"/>`;
    if (v % 10 === 0) ticks += `<text x="${x}" y="${y - h / 2 + 68}" font-family="${FONT}" font-size="24" text-anchor="middle" fill="#1d2b33">${v}</text>`;
  }
  const defs = `${LAB_DEFS}
    <linearGradient id="glass" x1="0" y1="0" x2="0" y2="1">
      <stop offset="0" stop-color="#ffffff" stop-opacity="0.75"/><stop offset="0.18" stop-color="#e8f2f4" stop-opacity="0.35"/>
      <stop offset="0.7" stop-color="#cfdfe3" stop-opacity="0.3"/><stop offset="1" stop-color="#8fa9b0" stop-opacity="0.55"/>
    </linearGradient>
    <linearGradient id="plunger" x1="0" y1="0" x2="0" y2="1">
      <stop offset="0" stop-color="#f4f8f9" stop-opacity="0.9"/><stop offset="0.5" stop-color="#d5e2e5" stop-opacity="0.75"/><stop offset="1" stop-color="#9fb5bb" stop-opacity="0.9"/>
    </linearGradient>
    <linearGradient id="metal" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#7d868b"/><stop offset="0.4" stop-color="#e1e6e8"/><stop offset="1" stop-color="#6f787c"/></linearGradient>`;
  const body = `${labBackground(690)}
  <rect x="1040" y="80" width="28" height="610" fill="url(#metal)"/>
  <ellipse cx="640" cy="${y + 95}" rx="540" ry="34" fill="url(#shadow)" opacity="0.4"/>
  <path d="M-20 ${y + 6} C 40 ${y + 4}, 90 ${y + 2}, 130 ${y}" fill="none" stroke="#7a4626" stroke-width="26" stroke-linecap="round"/>
  <path d="M-20 ${y - 2} C 40 ${y - 4}, 90 ${y - 6}, 130 ${y - 8}" fill="none" stroke="#a86a40" stroke-width="6" opacity="0.7"/>
  <rect x="118" y="${y - 14}" width="80" height="28" rx="6" fill="url(#glass)" stroke="#6d8a94" stroke-width="2"/>
  <rect x="${head}" y="${y - h / 2 + 10}" width="${1180 - head}" height="${h - 20}" fill="url(#plunger)" stroke="#7f9aa2" stroke-width="2"/>
  <rect x="${head}" y="${y - h / 2 + 8}" width="16" height="${h - 16}" fill="#5f6d72" opacity="0.85"/>
  <rect x="${x0 - 30}" y="${y - h / 2}" width="${100 * per + 150}" height="${h}" rx="10" fill="url(#glass)" stroke="#6d8a94" stroke-width="3"/>
  <rect x="${x0 - 30}" y="${y - h / 2 + 10}" width="${100 * per + 150}" height="7" fill="#fff" opacity="0.7"/>
  ${ticks}
  <text x="${x0 + 100 * per + 14}" y="${y + h / 2 - 14}" font-family="${FONT}" font-size="22" fill="#1d2b33">cm³</text>
  <rect x="1015" y="${y - h / 2 - 22}" width="78" height="${h + 44}" rx="10" fill="url(#metal)" stroke="#4c5559" stroke-width="2"/>
  <circle cx="1054" cy="${y - h / 2 - 4}" r="8" fill="#3b4245"/>`;
  return frame(defs, body);
}

/**
 * Two conical flasks on paper marked with a cross, side by side: clear at the start, cloudy pale
 * yellow (sulfur) when the cross has gone. Labels are written on the paper in pen.
 */
export function crossFlasksSvg({ left, right }: { left: string; right: string }): string {
  const flask = (cx: number, liquid: string, opacity: number, cloudy: boolean) => {
    const top = 250;
    const neckW = 78;
    const baseY = 700;
    const baseW = 330;
    const shoulder = 420;
    const level = 575;
    const outline = `M ${cx - neckW / 2} ${top} L ${cx - neckW / 2} ${shoulder} L ${cx - baseW / 2 + 18} ${baseY - 14} Q ${cx - baseW / 2} ${baseY} ${cx - baseW / 2 + 26} ${baseY} L ${cx + baseW / 2 - 26} ${baseY} Q ${cx + baseW / 2} ${baseY} ${cx + baseW / 2 - 18} ${baseY - 14} L ${cx + neckW / 2} ${shoulder} L ${cx + neckW / 2} ${top} Z`;
    const t = (level - shoulder) / (baseY - 14 - shoulder);
    const halfAt = neckW / 2 + (baseW / 2 - 18 - neckW / 2) * t;
    const liquidPath = `M ${cx - halfAt} ${level} L ${cx - baseW / 2 + 18} ${baseY - 14} Q ${cx - baseW / 2} ${baseY} ${cx - baseW / 2 + 26} ${baseY} L ${cx + baseW / 2 - 26} ${baseY} Q ${cx + baseW / 2} ${baseY} ${cx + baseW / 2 - 18} ${baseY - 14} L ${cx + halfAt} ${level} Z`;
    return `
    <ellipse cx="${cx + 30}" cy="${baseY + 6}" rx="${baseW / 2 + 40}" ry="30" fill="url(#shadow)" opacity="0.7"/>
    <path d="${liquidPath}" fill="${liquid}" opacity="${opacity}"/>
    ${cloudy ? `<path d="${liquidPath}" fill="url(#haze)" opacity="0.7"/>` : ""}
    <ellipse cx="${cx}" cy="${level}" rx="${f(halfAt)}" ry="9" fill="${cloudy ? "#f3ebc2" : "#eef6f7"}" opacity="0.9"/>
    <path d="${outline}" fill="url(#flaskglass)" stroke="#7c979e" stroke-width="3"/>
    <rect x="${cx - neckW / 2 - 6}" y="${top - 8}" width="${neckW + 12}" height="16" rx="6" fill="#e9f1f2" stroke="#7c979e" stroke-width="2"/>
    <path d="M ${cx - neckW / 2 + 10} ${top + 20} L ${cx - neckW / 2 + 10} ${shoulder + 10} L ${cx - baseW / 2 + 48} ${baseY - 40}" fill="none" stroke="#fff" stroke-width="7" opacity="0.55" stroke-linecap="round"/>`;
  };
  const cross = (cx: number, visible: number) =>
    `<g opacity="${visible}"><path d="M ${cx - 120} ${668} L ${cx + 120} ${738} M ${cx + 120} ${668} L ${cx - 120} ${738}" stroke="#161616" stroke-width="14" stroke-linecap="round"/></g>`;
  const defs = `${LAB_DEFS}
    <linearGradient id="flaskglass" x1="0" y1="0" x2="1" y2="0">
      <stop offset="0" stop-color="#ffffff" stop-opacity="0.35"/><stop offset="0.5" stop-color="#eaf3f4" stop-opacity="0.08"/><stop offset="1" stop-color="#b8ccd1" stop-opacity="0.35"/>
    </linearGradient>
    <radialGradient id="haze" cx="50%" cy="40%" r="70%"><stop offset="0" stop-color="#fffbe6"/><stop offset="1" stop-color="#d9c77a"/></radialGradient>
    <linearGradient id="paper" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#f1efe8"/><stop offset="1" stop-color="#fbfaf6"/></linearGradient>`;
  const body = `${labBackground(560)}
  <path d="M 90 600 L 1110 600 L 1190 880 L 10 880 Z" fill="url(#paper)"/>
  ${cross(330, 1)}${cross(870, 0.9)}
  ${flask(330, "#e4f0f2", 0.35, false)}
  ${flask(870, "#eadb9a", 0.96, true)}
  <text x="330" y="828" font-family="${FONT}" font-size="34" text-anchor="middle" fill="${INK}" transform="rotate(-2 330 828) skewX(-10)">${esc(left)}</text>
  <text x="870" y="828" font-family="${FONT}" font-size="34" text-anchor="middle" fill="${INK}" transform="rotate(1.5 870 828) skewX(-10)">${esc(right)}</text>
  <g transform="rotate(-4 880 640)">
    <rect x="871" y="150" width="18" height="490" rx="9" fill="#f5f9fa" stroke="#8aa1a7" stroke-width="2" opacity="0.9"/>
    <rect x="876" y="300" width="8" height="330" rx="4" fill="#c0392b"/>
  </g>`;
  return frame(defs, body);
}

/**
 * A page of a lab book photographed on the bench: a results table written in pen, a pencil
 * across the corner. `rows` are [time, reading] pairs as the student wrote them.
 */
export function labBookSvg({ title, columns, rows, seed }: { title: string; columns: [string, string]; rows: [string, string][]; seed: number }): string {
  const rand = seededRandom(seed);
  const wobble = () => f((rand() - 0.5) * 3);
  const px = 250;
  const py = 90;
  const pw = 720;
  const ph = 760;
  const colX = [px + 120, px + 360];
  const rowH = 48;
  const tableTop = py + 190;
  let lines = "";
  for (let yy = py + 70; yy < py + ph - 20; yy += 34) lines += `<line x1="${px}" y1="${yy}" x2="${px + pw}" y2="${yy}" stroke="#9fc0dd" stroke-width="1.3"/>`;
  let cells = "";
  const hand = (x: number, y: number, text: string, size = 30, anchor = "middle") =>
    `<text x="${x}" y="${y}" font-family="${FONT}" font-size="${size}" text-anchor="${anchor}" fill="${INK}" transform="rotate(${wobble()} ${x} ${y}) skewX(-9)">${esc(text)}</text>`;
  cells += hand(colX[0]! + 10, tableTop + 34, columns[0], 26);
  cells += hand(colX[1]! + 50, tableTop + 34, columns[1], 26);
  rows.forEach(([a, b], i) => {
    const yy = tableTop + rowH * (i + 1) + 34;
    cells += hand(colX[0]! + 10 + wobble(), yy, a);
    cells += hand(colX[1]! + 50 + wobble(), yy, b);
  });
  const tableH = rowH * (rows.length + 1);
  const grid = `
    <rect x="${px + 40}" y="${tableTop}" width="${pw - 90}" height="${tableH}" fill="none" stroke="#3a3a3a" stroke-width="2.2" opacity="0.75"/>
    <line x1="${px + 40}" y1="${tableTop + rowH}" x2="${px + pw - 50}" y2="${tableTop + rowH}" stroke="#3a3a3a" stroke-width="2.2" opacity="0.75"/>
    <line x1="${px + 290}" y1="${tableTop}" x2="${px + 290}" y2="${tableTop + tableH}" stroke="#3a3a3a" stroke-width="2.2" opacity="0.75"/>`;
  const defs = `
    <linearGradient id="desk" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="#3b4144"/><stop offset="1" stop-color="#1f2426"/></linearGradient>
    <linearGradient id="page" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#f4efe2"/><stop offset="0.08" stop-color="#fdfbf4"/><stop offset="0.9" stop-color="#fbf8ef"/><stop offset="1" stop-color="#e6dfcd"/></linearGradient>
    <linearGradient id="pencil" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#f7d35c"/><stop offset="0.5" stop-color="#e7b52c"/><stop offset="1" stop-color="#b9881a"/></linearGradient>`;
  const body = `
  <rect width="${W}" height="${H}" fill="url(#desk)"/>
  <g transform="rotate(-4 600 450)">
    <rect x="${px + 8}" y="${py + 12}" width="${pw + 16}" height="${ph + 16}" rx="10" fill="#000" opacity="0.25"/>
    <rect x="${px + 14}" y="${py + 18}" width="${pw + 6}" height="${ph + 6}" rx="6" fill="#000" opacity="0.3"/>
    <rect x="${px}" y="${py}" width="${pw}" height="${ph}" fill="url(#page)"/>
    ${lines}
    <line x1="${px + 70}" y1="${py}" x2="${px + 70}" y2="${py + ph}" stroke="#e39a9a" stroke-width="2"/>
    ${hand(px + 90, py + 125, title, 32, "start")}
    ${grid}
    ${cells}
  </g>
  <g transform="rotate(28 980 700)">
    <rect x="760" y="680" width="420" height="30" fill="url(#pencil)"/>
    <polygon points="760,680 700,695 760,710" fill="#e8c9a0"/>
    <polygon points="716,691 700,695 716,699" fill="#333"/>
    <rect x="1180" y="680" width="34" height="30" fill="#b7b7b7"/>
    <rect x="1214" y="680" width="30" height="30" rx="6" fill="#e58c8c"/>
  </g>`;
  return frame(defs, body);
}

/** The set-up for collecting gas: flask with magnesium in acid, bung, delivery tube, syringe in a clamp. */
export function apparatusSvg(): string {
  let bubbles = "";
  const rand = seededRandom(7);
  for (let i = 0; i < 40; i++) {
    const x = 330 + rand() * 140;
    const y = 560 + rand() * 110;
    bubbles += `<circle cx="${f(x)}" cy="${f(y)}" r="${f(2 + rand() * 5)}" fill="#fff" opacity="${f(0.4 + rand() * 0.5)}" stroke="#9fb3b8" stroke-width="0.8"/>`;
  }
  const defs = `${LAB_DEFS}
    <linearGradient id="flaskglass" x1="0" y1="0" x2="1" y2="0">
      <stop offset="0" stop-color="#ffffff" stop-opacity="0.4"/><stop offset="0.5" stop-color="#eaf3f4" stop-opacity="0.1"/><stop offset="1" stop-color="#b8ccd1" stop-opacity="0.4"/>
    </linearGradient>
    <linearGradient id="glass" x1="0" y1="0" x2="0" y2="1">
      <stop offset="0" stop-color="#ffffff" stop-opacity="0.75"/><stop offset="0.3" stop-color="#e8f2f4" stop-opacity="0.3"/><stop offset="1" stop-color="#8fa9b0" stop-opacity="0.55"/>
    </linearGradient>
    <linearGradient id="metal" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#7d868b"/><stop offset="0.4" stop-color="#e1e6e8"/><stop offset="1" stop-color="#6f787c"/></linearGradient>`;
  const cx = 400;
  const body = `${labBackground(720)}
  <rect x="760" y="700" width="360" height="40" rx="6" fill="#3a4043"/>
  <rect x="1000" y="140" width="24" height="570" fill="url(#metal)"/>
  <rect x="640" y="300" width="380" height="20" fill="url(#metal)"/>
  <ellipse cx="${cx + 20}" cy="724" rx="210" ry="26" fill="url(#shadow)" opacity="0.8"/>
  <path d="M ${cx - 150} 718 L ${cx + 150} 718 L ${cx + 60} 560 L ${cx + 60} 470 L ${cx - 60} 470 L ${cx - 60} 560 Z" fill="#dfe9eb" opacity="0.35"/>
  <path d="M ${cx - 150} 718 L ${cx + 150} 718 L ${cx + 95} 620 L ${cx - 95} 620 Z" fill="#dfeef0" opacity="0.55"/>
  <rect x="${cx - 40}" y="640" width="70" height="8" fill="#8d9396" transform="rotate(-12 ${cx} 644)"/>
  ${bubbles}
  <path d="M ${cx - 160} 720 L ${cx + 160} 720 L ${cx + 48} 500 L ${cx + 48} 380 L ${cx - 48} 380 L ${cx - 48} 500 Z" fill="url(#flaskglass)" stroke="#7c979e" stroke-width="3" stroke-linejoin="round"/>
  <path d="M ${cx - 44} 350 L ${cx + 44} 350 L ${cx + 38} 410 L ${cx - 38} 410 Z" fill="#9a5a32"/>
  <path d="M ${cx} 352 L ${cx} 230 Q ${cx} 200 ${cx + 30} 200 L 540 200 Q 570 200 570 230 L 570 330" fill="none" stroke="#7a4626" stroke-width="16" stroke-linecap="round"/>
  <rect x="560" y="300" width="34" height="40" rx="6" fill="url(#glass)" stroke="#6d8a94" stroke-width="2"/>
  <rect x="590" y="270" width="420" height="100" rx="10" fill="url(#glass)" stroke="#6d8a94" stroke-width="3"/>
  <rect x="700" y="280" width="420" height="80" fill="#dfe9ec" opacity="0.6" stroke="#7f9aa2" stroke-width="2"/>
  <rect x="700" y="278" width="14" height="84" fill="#5f6d72" opacity="0.85"/>
  <rect x="880" y="250" width="70" height="140" rx="10" fill="url(#metal)" stroke="#4c5559" stroke-width="2"/>`;
  return frame(defs, body);
}

let fontReady: Promise<void> | null = null;

/**
 * Registers the project's own font with the SVG renderer: rendering one line of text from the
 * font file adds it to the process's font set, so the drawings look the same on any machine.
 */
function registerFont(): Promise<void> {
  fontReady ??= sharp({ text: { text: "0", fontfile: path.join(process.cwd(), "fonts", "DejaVuSans.ttf"), font: `${FONT} 12` } })
    .png()
    .toBuffer()
    .then(() => undefined);
  return fontReady;
}

let grain: Promise<Buffer> | null = null;

/** Renders a drawing as a JPEG with a phone camera's softness and grain. */
export async function photograph(svg: string): Promise<Buffer> {
  await registerFont();
  grain ??= sharp({ create: { width: W, height: H, channels: 3, background: { r: 128, g: 128, b: 128 }, noise: { type: "gaussian", mean: 128, sigma: 10 } } })
    .raw()
    .toBuffer();
  return sharp(Buffer.from(svg))
    .blur(0.7)
    .composite([{ input: await grain, raw: { width: W, height: H, channels: 3 }, blend: "soft-light" }])
    .jpeg({ quality: 86 })
    .toBuffer();
}
