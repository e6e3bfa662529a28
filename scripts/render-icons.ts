// Draws the Tenthwise mark (the same geometry as components/ui/logo.tsx: a bore seen end-on,
// ten graduations over its top arc, the brass gauge line across it) as SVG, and renders the
// PNG icons the web app manifest names. Run: npx tsx scripts/render-icons.ts
import sharp from "sharp";
import { mkdirSync, writeFileSync } from "node:fs";

const STEEL = "#1c4070";
const BRASS = "#d99a2b"; // a touch lighter than the UI brass so the line reads on the small icon
const OUT = "public/icons";

function markBody(): string {
  const ticks = Array.from({ length: 11 }, (_, i) => {
    const a = Math.PI * (1.1 + (0.8 * i) / 10);
    const r1 = 13.5;
    const r2 = i % 5 === 0 ? 9.5 : 11.2;
    const f = (n: number) => n.toFixed(3);
    const w = i % 5 === 0 ? 1.8 : 1.1;
    return (
      `<line x1="${f(20 + r1 * Math.cos(a))}" y1="${f(21 + r1 * Math.sin(a))}" ` +
      `x2="${f(20 + r2 * Math.cos(a))}" y2="${f(21 + r2 * Math.sin(a))}" ` +
      `stroke="#fff" stroke-width="${w}" stroke-linecap="round"/>`
    );
  });
  return [
    `<circle cx="20" cy="21" r="13.5" fill="none" stroke="#fff" stroke-width="2.2"/>`,
    ...ticks,
    `<line x1="9" y1="27.5" x2="31" y2="22.5" stroke="${BRASS}" stroke-width="3" stroke-linecap="round"/>`,
  ].join("");
}

/** The everyday icon: a rounded steel tile, as in the app header. */
export function iconSvg(): string {
  return (
    '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 40">' +
    `<rect x="1" y="1" width="38" height="38" rx="9" fill="${STEEL}"/>${markBody()}</svg>`
  );
}

/** Maskable: full-bleed steel, the mark shrunk into the 80 % safe zone the platform may crop to. */
export function maskableSvg(): string {
  return (
    '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 40">' +
    `<rect width="40" height="40" fill="${STEEL}"/>` +
    `<g transform="translate(20 20) scale(0.72) translate(-20 -20.5)">${markBody()}</g></svg>`
  );
}

async function main() {
  mkdirSync(OUT, { recursive: true });
  writeFileSync(`${OUT}/icon.svg`, iconSvg());
  writeFileSync(`${OUT}/icon-maskable.svg`, maskableSvg());
  const jobs: [string, string, number][] = [
    [iconSvg(), "icon-192.png", 192],
    [iconSvg(), "icon-512.png", 512],
    [maskableSvg(), "icon-maskable-192.png", 192],
    [maskableSvg(), "icon-maskable-512.png", 512],
    [iconSvg(), "apple-touch-icon.png", 180],
  ];
  for (const [svg, name, size] of jobs) {
    await sharp(Buffer.from(svg), { density: (72 * size) / 40 })
      .resize(size, size)
      .png({ compressionLevel: 9 })
      .toFile(`${OUT}/${name}`);
    console.log(`${OUT}/${name} ${size}×${size}`);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
