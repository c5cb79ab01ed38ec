/**
 * Drawings made for the demo (no photos from anywhere else): simple shop-floor
 * scenes in SVG, rendered to JPEG by the seed. Each is 1200 × 900.
 */

const W = 1200;
const H = 900;

function scene(body: string, caption: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs>
    <linearGradient id="bg" x1="0" y1="0" x2="0" y2="1">
      <stop offset="0" stop-color="#3d3a35"/><stop offset="1" stop-color="#24221f"/>
    </linearGradient>
    <linearGradient id="steel" x1="0" y1="0" x2="0" y2="1">
      <stop offset="0" stop-color="#9a9890"/><stop offset="0.5" stop-color="#6c6a63"/><stop offset="1" stop-color="#44423d"/>
    </linearGradient>
    <linearGradient id="chrome" x1="0" y1="0" x2="0" y2="1">
      <stop offset="0" stop-color="#f2f2ee"/><stop offset="0.45" stop-color="#b9bab4"/><stop offset="1" stop-color="#7d7e78"/>
    </linearGradient>
  </defs>
  <rect width="${W}" height="${H}" fill="url(#bg)"/>
  <g stroke-linecap="round" stroke-linejoin="round">${body}</g>
  <rect x="0" y="${H - 70}" width="${W}" height="70" fill="#000" opacity="0.45"/>
  <text x="28" y="${H - 26}" font-family="sans-serif" font-size="32" fill="#f6f1e7">${caption}</text>
</svg>`;
}

function ruler(x: number, y: number, length: number, label: string): string {
  const ticks = Array.from({ length: Math.floor(length / 20) + 1 }, (_, i) => {
    const tx = x + i * 20;
    const h = i % 4 === 0 ? 34 : 18;
    return `<line x1="${tx}" y1="${y}" x2="${tx}" y2="${y + h}" stroke="#222" stroke-width="3"/>`;
  }).join("");
  return `<rect x="${x - 10}" y="${y - 6}" width="${length + 20}" height="60" rx="6" fill="#e8c547"/>${ticks}
    <text x="${x + length - 70}" y="${y + 48}" font-family="sans-serif" font-weight="bold" font-size="26" fill="#222">${label}</text>`;
}

export const DEMO_DRAWINGS = {
  brakeChamberLong: scene(
    `<rect x="120" y="240" width="330" height="300" rx="60" fill="url(#steel)" stroke="#1b1a18" stroke-width="6"/>
     <rect x="100" y="370" width="370" height="40" fill="#55534d" stroke="#1b1a18" stroke-width="4"/>
     <rect x="450" y="372" width="430" height="30" fill="url(#chrome)" stroke="#1b1a18" stroke-width="4"/>
     <path d="M880 330 L950 330 L1010 640 L940 660 Z" fill="#5f5d57" stroke="#1b1a18" stroke-width="6"/>
     <circle cx="975" cy="640" r="34" fill="#3c3a36" stroke="#1b1a18" stroke-width="6"/>
     ${ruler(470, 430, 400, "2¼ in")}
     <path d="M600 360 q40 -60 90 0" stroke="#f6f1e7" stroke-width="6" fill="none"/>`,
    "Right rear chamber, applied: pushrod travel marked on the tape",
  ),
  brakeChamberOk: scene(
    `<rect x="160" y="250" width="300" height="280" rx="56" fill="url(#steel)" stroke="#1b1a18" stroke-width="6"/>
     <rect x="140" y="370" width="340" height="36" fill="#55534d" stroke="#1b1a18" stroke-width="4"/>
     <rect x="460" y="372" width="300" height="28" fill="url(#chrome)" stroke="#1b1a18" stroke-width="4"/>
     <path d="M760 330 L825 330 L880 620 L815 640 Z" fill="#5f5d57" stroke="#1b1a18" stroke-width="6"/>
     ${ruler(480, 430, 280, "1¾ in")}`,
    "Front chamber, applied: stroke measured at the limit",
  ),
  tieRodEnd: scene(
    `<rect x="80" y="400" width="760" height="44" rx="22" fill="url(#steel)" stroke="#1b1a18" stroke-width="6"/>
     <circle cx="900" cy="422" r="90" fill="#4a4843" stroke="#1b1a18" stroke-width="8"/>
     <path d="M840 340 l40 30 l-20 20 l50 10 l-30 30 l60 20" stroke="#d9d3c4" stroke-width="8" fill="none"/>
     <path d="M900 512 q-10 60 6 120" stroke="#2b2417" stroke-width="22" fill="none"/>
     <circle cx="906" cy="650" r="14" fill="#2b2417"/>
     <path d="M960 250 l80 -60 M1000 280 l100 -30" stroke="#e8c547" stroke-width="10"/>`,
    "Tie-rod end: torn boot, grease thrown out, play felt by hand",
  ),
  liftCylinder: scene(
    `<rect x="80" y="320" width="560" height="150" rx="20" fill="#c9a227" stroke="#1b1a18" stroke-width="6"/>
     <rect x="640" y="360" width="460" height="70" fill="url(#chrome)" stroke="#1b1a18" stroke-width="5"/>
     <path d="M700 380 l120 6 M760 400 l180 -4 M880 388 l140 8" stroke="#6b5f4a" stroke-width="4"/>
     <path d="M640 470 q20 90 -10 200 M600 470 q10 120 -20 230" stroke="#3a2d14" stroke-width="18" fill="none" opacity="0.85"/>
     <ellipse cx="600" cy="740" rx="110" ry="22" fill="#3a2d14" opacity="0.8"/>`,
    "Plow lift cylinder: scored rod, oil past the seals",
  ),
  batteries: scene(
    `<rect x="140" y="300" width="380" height="330" rx="14" fill="#2e2d2b" stroke="#111" stroke-width="6"/>
     <rect x="560" y="300" width="380" height="330" rx="14" fill="#2e2d2b" stroke="#111" stroke-width="6"/>
     <rect x="190" y="260" width="60" height="46" fill="#b0582a"/><rect x="410" y="260" width="60" height="46" fill="#8e8c85"/>
     <rect x="610" y="260" width="60" height="46" fill="#b0582a"/><rect x="830" y="260" width="60" height="46" fill="#8e8c85"/>
     <rect x="860" y="420" width="230" height="320" rx="24" fill="#e8c547" stroke="#111" stroke-width="6"/>
     <rect x="890" y="460" width="170" height="90" rx="8" fill="#c8d6b8" stroke="#111" stroke-width="4"/>
     <text x="905" y="525" font-family="monospace" font-size="48" font-weight="bold" fill="#1b1a18">12.52</text>
     <path d="M900 740 q-200 60 -470 -420 M1050 740 q40 -200 -190 -440" stroke="#b0582a" stroke-width="8" fill="none"/>`,
    "Batteries at rest, surface charge removed: 12.52 V",
  ),
  drainMeter: scene(
    `<rect x="420" y="200" width="360" height="520" rx="30" fill="#e8c547" stroke="#111" stroke-width="6"/>
     <rect x="460" y="250" width="280" height="140" rx="10" fill="#c8d6b8" stroke="#111" stroke-width="4"/>
     <text x="478" y="348" font-family="monospace" font-size="70" font-weight="bold" fill="#1b1a18">180 mA</text>
     <circle cx="600" cy="540" r="90" fill="#3a3935" stroke="#111" stroke-width="6"/>
     <path d="M520 720 q-200 80 -380 -40 M680 720 q200 90 390 -60" stroke="#b0582a" stroke-width="9" fill="none"/>
     <path d="M1070 620 l40 -40" stroke="#111" stroke-width="16"/>`,
    "Key-off drain, 60 min after key-off, meter in series",
  ),
  airLine: scene(
    `<path d="M60 520 C300 420 520 640 760 520 S1080 430 1160 500" stroke="#1f1f1d" stroke-width="46" fill="none"/>
     <path d="M60 520 C300 420 520 640 760 520 S1080 430 1160 500" stroke="#3a3936" stroke-width="30" fill="none"/>
     <path d="M600 556 l18 -22 l14 16 l20 -26" stroke="#e6e0d2" stroke-width="6" fill="none"/>
     ${[0, 1, 2, 3, 4, 5, 6]
       .map((i) => `<circle cx="${585 + (i % 3) * 26}" cy="${500 - i * 30}" r="${10 + (i % 3) * 5}" fill="none" stroke="#f6f1e7" stroke-width="4"/>`)
       .join("")}`,
    "Service line at the rear axle: soapy water shows the crack",
  ),
  tread: scene(
    `<rect x="200" y="180" width="800" height="520" rx="40" fill="#1f1f1e" stroke="#0d0d0c" stroke-width="8"/>
     ${[0, 1, 2, 3].map((i) => `<rect x="${300 + i * 180}" y="180" width="60" height="520" fill="#0b0b0a"/>`).join("")}
     <rect x="470" y="90" width="40" height="260" fill="url(#chrome)" stroke="#111" stroke-width="4"/>
     <rect x="420" y="60" width="140" height="60" rx="8" fill="#e8c547" stroke="#111" stroke-width="4"/>
     <text x="436" y="102" font-family="sans-serif" font-weight="bold" font-size="32" fill="#111">5/32</text>`,
    "Steer tyre, major groove: 5/32 in on the gauge",
  ),
  radiator: scene(
    `<rect x="160" y="140" width="880" height="600" fill="#6f6d66" stroke="#1b1a18" stroke-width="8"/>
     ${Array.from({ length: 40 }, (_, i) => `<line x1="${180 + i * 21}" y1="150" x2="${180 + i * 21}" y2="730" stroke="#4d4b46" stroke-width="6"/>`).join("")}
     <path d="M260 220 q140 -40 260 60 q120 120 300 40 q80 -20 160 60 l0 300 q-180 60 -360 -40 q-160 -80 -360 20 Z" fill="#8a6a3c" opacity="0.85"/>`,
    "Radiator core face: packed with fines from the crusher",
  ),
} as const;

export type DemoDrawing = keyof typeof DEMO_DRAWINGS;
