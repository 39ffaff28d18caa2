// Writes the files of public/ that are generated: the sample logged traces (from lib/trace's square-wave
// generator, so their numbers are known in closed form) and the PNG icons (the SVG mark drawn by Debian's
// chromium). Run with `npx tsx scripts/make-public-assets.ts`; the results are committed.
import fs from "node:fs";
import path from "node:path";
import { chromium } from "playwright-core";
import { squareWaveCsv } from "../lib/trace/generate";

const pub = path.join(import.meta.dirname, "..", "public");

// A sensor node: sleeps at 4 µA, wakes every 2 s for 50 ms at 18 mA; logged every 5 ms in ms and mA.
fs.writeFileSync(
  path.join(pub, "samples", "duty-cycle-sensor-node.csv"),
  squareWaveCsv({ sleepCurrent: 4e-6, activeCurrent: 18e-3, activeTime: 0.05, period: 2, cycles: 10, sampleInterval: 0.005, units: { time: "ms", current: "mA" } }),
);
// The same kind of load as a spreadsheet in a decimal-comma locale exports it, with a few broken rows
// that the analysis counts and skips: sleeps at 12 µA, wakes every 500 ms for 20 ms at 6.5 mA.
fs.writeFileSync(
  path.join(pub, "samples", "duty-cycle-decimal-comma.csv"),
  squareWaveCsv({ sleepCurrent: 12e-6, activeCurrent: 6.5e-3, activeTime: 0.02, period: 0.5, cycles: 8, sampleInterval: 0.001, units: { time: "s", current: "uA" }, separator: ";", decimalComma: true, garbageEvery: 700 }),
);

async function icons() {
  const svg = fs.readFileSync(path.join(pub, "icon.svg"), "utf8");
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--headless", "--no-sandbox", "--disable-gpu"] });
  try {
    for (const [name, size] of [["apple-touch-icon.png", 180], ["icon-192.png", 192], ["icon-512.png", 512], ["favicon-32.png", 32]] as const) {
      const page = await browser.newPage({ viewport: { width: size, height: size } });
      await page.setContent(`<html><body style="margin:0">${svg.replace("<svg ", `<svg width="${size}" height="${size}" `)}</body></html>`);
      await page.screenshot({ path: path.join(pub, name), omitBackground: true });
      await page.close();
    }
    // favicon.ico: one 32 × 32 PNG image inside the ICO container (6-byte header, one 16-byte entry)
    const png = fs.readFileSync(path.join(pub, "favicon-32.png"));
    const head = Buffer.alloc(22);
    head.writeUInt16LE(0, 0);
    head.writeUInt16LE(1, 2); // icon
    head.writeUInt16LE(1, 4); // one image
    head.writeUInt8(32, 6); // width
    head.writeUInt8(32, 7); // height
    head.writeUInt16LE(1, 10); // colour planes
    head.writeUInt16LE(32, 12); // bits per pixel
    head.writeUInt32LE(png.length, 14);
    head.writeUInt32LE(22, 18); // offset of the image
    fs.writeFileSync(path.join(pub, "favicon.ico"), Buffer.concat([head, png]));
  } finally {
    await browser.close();
  }
}

await icons();
console.log("public/ assets written");
