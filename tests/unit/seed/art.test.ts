import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { ANGLES, ANGLE_ZONE, colourToHex, demoPhotoSvg, renderDemoPhoto } from "../../../server/demo/art/index.ts";
import { BODY_TYPES } from "../../../shared/constants/vehicle.ts";

const COLOURS = ["White", "Slate grey", "Deep red", "Silver", "Black", "Blue", "Green", "Sand", "Bronze", "Dark blue", "Grey", "Red", "Yellow", "Orange"];

describe("demo photo art", () => {
  const cases = BODY_TYPES.flatMap((bodyType, b) => ANGLES.map((angle, a) => ({ bodyType, angle, colour: COLOURS[(a + b) % COLOURS.length], seed: b * 100 + a })));

  it.each(cases)("when $bodyType is drawn from $angle, then it renders a 1600×1200 JPEG under 400 KB", async ({ bodyType, angle, colour, seed }) => {
    const buf = await renderDemoPhoto({ bodyType, angle, colour, seed, odometerText: "84 210 km" });
    const meta = await sharp(buf).metadata();
    expect(meta.format).toBe("jpeg");
    expect(meta.width).toBe(1600);
    expect(meta.height).toBe(1200);
    expect(buf.length).toBeLessThan(400 * 1024);
  });

  it.each(cases)("when the SVG for $bodyType $angle is built, then it has no script, external link or embedded image", ({ bodyType, angle, colour, seed }) => {
    const svg = demoPhotoSvg({ bodyType, angle, colour, seed });
    expect(svg).not.toMatch(/<script/i);
    expect(svg).not.toMatch(/href\s*=\s*["']?\s*https?:/i);
    expect(svg).not.toMatch(/<image/i);
    expect(svg).not.toMatch(/<text/i);
    expect(svg).not.toMatch(/NaN|undefined|Infinity/);
  });

  it("when the same options are rendered twice, then the SVG and the JPEG bytes are the same", async () => {
    const opts = { bodyType: "suv", angle: "front_left", colour: "Slate grey", seed: 42, odometerText: "84 210 km" } as const;
    expect(demoPhotoSvg(opts)).toBe(demoPhotoSvg(opts));
    const [a, b] = await Promise.all([renderDemoPhoto(opts), renderDemoPhoto(opts)]);
    expect(a.equals(b)).toBe(true);
  });

  it("when only the seed differs, then the pictures differ", () => {
    for (const angle of ANGLES) {
      const a = demoPhotoSvg({ bodyType: "sedan", angle, colour: "White", seed: 1 });
      const b = demoPhotoSvg({ bodyType: "sedan", angle, colour: "White", seed: 2 });
      expect(a, angle).not.toBe(b);
    }
  });

  it("when the dashboard is drawn with an odometer reading, then the reading changes the picture", () => {
    const a = demoPhotoSvg({ bodyType: "ute", angle: "dashboard", colour: "White", seed: 3, odometerText: "84 210 km" });
    const b = demoPhotoSvg({ bodyType: "ute", angle: "dashboard", colour: "White", seed: 3, odometerText: "12 005 km" });
    expect(a).not.toBe(b);
  });

  it("when colour words are mapped, then the result is a deterministic #rrggbb and unknown words give a neutral grey", () => {
    for (const c of [...COLOURS, "Pearl white", "Midnight blue", "Chartreuse", "", "??"]) {
      expect(colourToHex(c)).toMatch(/^#[0-9a-f]{6}$/);
      expect(colourToHex(c)).toBe(colourToHex(c));
    }
    expect(colourToHex("Chartreuse")).toBe(colourToHex("Mauve-ish"));
    expect(colourToHex("White")).not.toBe(colourToHex("Black"));
    expect(colourToHex("Dark blue")).not.toBe(colourToHex("Blue"));
    expect(colourToHex("Slate grey")).not.toBe(colourToHex("Grey"));
  });

  it("when an angle is looked up, then it maps to its walk-around zone", () => {
    expect(Object.keys(ANGLE_ZONE).sort()).toEqual([...ANGLES].sort());
    expect(ANGLE_ZONE.front_left).toBe("front");
    expect(ANGLE_ZONE.side_left).toBe("left_side");
    expect(ANGLE_ZONE.dashboard).toBe("interior_front");
    expect(ANGLE_ZONE.cargo).toBe("cargo_area");
    expect(ANGLE_ZONE.wheel).toBe("wheels_tyres");
  });
});
