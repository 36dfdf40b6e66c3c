/**
 * Demo vehicle photos drawn by the project itself: flat illustrations of each body type in its paint colour, from the
 * walk-around angles of a condition report, rendered from SVG to JPEG with sharp. Nothing is downloaded and nothing
 * comes from the real world; the same options always give the same picture, and the seed varies backdrop, light and
 * framing so different cars do not look identical.
 */
import sharp from "sharp";
import { closeup } from "./closeups.ts";
import { colourToHex, rng } from "./palette.ts";
import { frontLeft, front, rear, rearRight, sideLeft, type SceneCtx } from "./scenes.ts";
import { BODIES, type BodyType } from "./shapes.ts";

export { colourToHex } from "./palette.ts";
export type { BodyType } from "./shapes.ts";

export const ANGLES = ["front_left", "side_left", "rear_right", "front", "rear", "interior_front", "dashboard", "cargo", "wheel"] as const;
export type Angle = (typeof ANGLES)[number];

/** The walk-around zone each angle shows. */
export const ANGLE_ZONE: Record<Angle, string> = {
  front_left: "front", side_left: "left_side", rear_right: "rear", front: "front", rear: "rear",
  interior_front: "interior_front", dashboard: "interior_front", cargo: "cargo_area", wheel: "wheels_tyres",
};

export interface DemoPhotoOptions {
  bodyType: BodyType;
  colour: string;
  angle: Angle;
  seed: number;
  odometerText?: string;
}

export const PHOTO_WIDTH = 1600;
export const PHOTO_HEIGHT = 1200;

/** The SVG source of one demo photo (1600 × 1200, self-contained: no external references, fonts or scripts). */
export function demoPhotoSvg(opts: DemoPhotoOptions): string {
  const spec = BODIES[opts.bodyType] ?? BODIES.sedan;
  const rnd = rng(opts.seed * 31 + ANGLES.indexOf(opts.angle) * 7919);
  const odometerText = opts.odometerText ?? `${Math.floor(10 + rng(opts.seed)() * 190)} ${String(Math.floor(rng(opts.seed + 1)() * 1000)).padStart(3, "0")} km`;
  const ctx: SceneCtx = { spec, paint: colourToHex(opts.colour), rnd, odometerText, seed: opts.seed, bodyType: opts.bodyType };
  switch (opts.angle) {
    case "front_left": return frontLeft(ctx);
    case "side_left": return sideLeft(ctx);
    case "rear_right": return rearRight(ctx);
    case "front": return front(ctx);
    case "rear": return rear(ctx);
    default: return closeup(opts.angle, ctx);
  }
}

/** The demo photo as a 1600 × 1200 JPEG. */
export async function renderDemoPhoto(opts: DemoPhotoOptions): Promise<Buffer> {
  return sharp(Buffer.from(demoPhotoSvg(opts))).resize(PHOTO_WIDTH, PHOTO_HEIGHT, { fit: "fill" }).jpeg({ quality: 82, mozjpeg: true }).toBuffer();
}
