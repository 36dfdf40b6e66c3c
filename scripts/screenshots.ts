/**
 * `node --import tsx scripts/screenshots.ts`: the README's screenshots in docs/screenshots/, made from the journeys'
 * output (run `npx vitest run tests/e2e/journeys.test.ts` first; it writes test-results/screenshots/journeys/).
 * Each picture is cut to the part worth showing, at most 1200 px wide, and must stay under 200 kB.
 */
import sharp from "sharp";
import { existsSync, mkdirSync, statSync } from "node:fs";
import path from "node:path";

const FROM = path.resolve("test-results/screenshots/journeys");
const TO = path.resolve("docs/screenshots");
const MAX_WIDTH = 1200;
const MAX_BYTES = 200 * 1024;

interface Pick {
  from: string;
  to: string;
  /** Keep only a band of a full-page capture, from startPx (default 0) to topPx, in the source's pixels. */
  startPx?: number;
  topPx?: number;
  /** Width to scale to (never wider than MAX_WIDTH or the source). */
  width?: number;
  caption: string;
}

export const PICKS: Pick[] = [
  { from: "sales-01-stock-list.png", to: "stock-list.png", topPx: 1000, caption: "The staff stock list: every vehicle on the books, searchable and filtered by status, make and fuel." },
  { from: "workshop-05-walkaround-pinned.png", to: "walkaround-pins.png", topPx: 1330, width: 460, caption: "The workshop's walk-around on a phone: a dent pinned on the photo, with its close-up cut around the pin." },
  { from: "sales-04-published.png", to: "readiness-publish.png", width: 760, caption: "Readiness as a checklist; once every item is done, sales publishes an immutable revision." },
  { from: "buyer-02-condition-page.png", to: "condition-phone.png", width: 460, caption: "The public condition page on a phone: price, key figures and the condition index first." },
  { from: "buyer-04-defect-map.png", to: "defect-map-phone.png", startPx: 1530, topPx: 4100, width: 460, caption: "What we found: numbered pins on the photos match the item-by-item list with its close-ups." },
  { from: "marketing-03-feed-fetched.png", to: "feeds.png", topPx: 560, caption: "Marketing's feeds: a secret URL per portal, and every fetch logged with who asked and what was sent." },
];

async function make(p: Pick) {
  const source = path.join(FROM, p.from);
  if (!existsSync(source)) throw new Error(`${p.from} is missing: run npx vitest run tests/e2e/journeys.test.ts first`);
  const meta = await sharp(source).metadata();
  const top = p.startPx ?? 0;
  const height = Math.min(meta.height, p.topPx ?? meta.height) - top;
  const width = Math.min(MAX_WIDTH, meta.width, p.width ?? MAX_WIDTH);
  const target = path.join(TO, p.to);
  // Palette PNG: screenshots are flat colour and text, which a 256-colour palette keeps sharp and small.
  await sharp(source).extract({ left: 0, top, width: meta.width, height }).resize({ width }).png({ palette: true, quality: 90, effort: 8 }).toFile(target);
  const bytes = statSync(target).size;
  if (bytes > MAX_BYTES) throw new Error(`${p.to} is ${Math.round(bytes / 1024)} kB, over ${MAX_BYTES / 1024} kB`);
  console.log(`${p.to.padEnd(24)} ${width} px wide  ${Math.round(bytes / 1024)} kB`);
}

mkdirSync(TO, { recursive: true });
for (const p of PICKS) await make(p);
