/**
 * Close-up demo photos: the front cabin (seats, steering wheel), the instrument cluster with the odometer readout,
 * the open cargo area (boot, tub, tray or van floor) and one wheel. Flat 2-D illustrations in the vehicle's paint.
 */
import { Svg, circle, num, pathD, roundCorners, type P2 } from "./geometry.ts";
import { glyphAdvance, glyphStrokes } from "./glyphs.ts";
import { GLASS, TRIM, TYRE, mix, shade } from "./palette.ts";
import { H, W, backdrop, drawBackground, type SceneCtx } from "./scenes.ts";

type Closeup = "interior_front" | "dashboard" | "cargo" | "wheel";

const rr = (x: number, y: number, w: number, h: number, r: number): P2[] =>
  roundCorners([{ x, y, r }, { x: x + w, y, r }, { x: x + w, y: y + h, r }, { x, y: y + h, r }], true, 6);

function trimColours(rnd: () => number): { seat: string; dash: string } {
  const seat = ["#34363a", "#2b2c30", "#6b5b4b", "#a8987f"][Math.floor(rnd() * 4)];
  return { seat, dash: "#26282b" };
}

function outsideView(svg: Svg, ctx: SceneCtx, top: number, bottom: number): void {
  const bd = backdrop(ctx.rnd);
  svg.add(`<rect y="${top}" width="${W}" height="${bottom - top}" fill="${svg.linear(0, top, 0, bottom, [[0, shade(bd.sky, -0.05)], [0.6, mix(bd.sky, "#ffffff", 0.6)], [0.62, "#9aa59c"], [1, "#a7aaa8"]])}"/>`);
}

/**
 * The start of every picture taken from inside the cabin: the trim colours, the camera moved sideways by up to half
 * of `sway` either way, and the outside seen through the glass down to `glassBottom`.
 */
function cabinView(ctx: SceneCtx, sway: number, glassBottom: number): { svg: Svg; t: ReturnType<typeof trimColours>; dx: number } {
  const svg = new Svg(W, H);
  const t = trimColours(ctx.rnd);
  const dx = (ctx.rnd() - 0.5) * sway;
  outsideView(svg, ctx, 0, glassBottom);
  return { svg, t, dx };
}

function interiorFront(ctx: SceneCtx): string {
  const { svg, t, dx } = cabinView(ctx, 60, 560);
  svg.add(`<rect width="${W}" height="110" fill="${svg.linear(0, 0, 0, 110, [[0, "#8d8a85"], [1, "#b7b3ac"]])}"/>`);
  // A-pillars and the mirror.
  svg.poly([[0, 0], [230 + dx, 0], [40 + dx, 600], [0, 620]], "#3a3b3e");
  svg.poly([[W, 0], [W - 230 + dx, 0], [W - 40 + dx, 600], [W, 620]], "#3a3b3e");
  svg.poly(rr(720 + dx, 110, 180, 60, 24), "#1f2023");
  svg.poly(rr(740 + dx, 118, 140, 44, 18), mix(GLASS, "#b9c6d2", 0.4));
  // Dashboard.
  const dash: P2[] = [[0, 560], [120, 470], [W - 120, 470], [W, 560], [W, H], [0, H]];
  svg.poly(dash, svg.linear(0, 470, 0, 760, [[0, shade(t.dash, 0.18)], [0.25, t.dash], [1, shade(t.dash, -0.3)]]));
  svg.poly([[120, 470], [W - 120, 470], [W - 160, 500], [160, 500]], shade(t.dash, 0.28));
  svg.poly(rr(660 + dx, 540, 280, 170, 18), "#0e0f11", `stroke="#3b3d41" stroke-width="6"`);
  svg.poly(rr(680 + dx, 558, 240, 134, 10), svg.linear(0, 558, 0, 692, [[0, "#1f2a36"], [1, "#101419"]]));
  for (const vx of [300, 560, 1000, 1260]) {
    svg.poly(rr(vx + dx, 560, 120, 70, 18), "#141517", `stroke="#44474b" stroke-width="5"`);
    for (let k = 1; k < 4; k++) svg.line([[vx + dx + 12, 560 + k * 17], [vx + dx + 108, 560 + k * 17]], "#3d4044", 4);
  }
  // Steering wheel (right-hand drive) with the cluster hood behind it.
  const sx = 1120 + dx;
  svg.poly(rr(sx - 230, 500, 460, 120, 50), shade(t.dash, 0.12));
  svg.poly(rr(sx - 200, 520, 400, 90, 30), "#0c0d0f");
  svg.add(`<circle cx="${num(sx)}" cy="790" r="235" fill="none" stroke="#1b1c1f" stroke-width="54"/>`);
  svg.add(`<circle cx="${num(sx)}" cy="790" r="235" fill="none" stroke="#3b3d41" stroke-width="10" stroke-dasharray="0 0" opacity="0.35" transform="translate(0 -12)"/>`);
  svg.poly([[sx - 215, 770], [sx - 70, 745], [sx - 60, 840], [sx - 200, 850]], "#222326");
  svg.poly([[sx + 215, 770], [sx + 70, 745], [sx + 60, 840], [sx + 200, 850]], "#222326");
  svg.poly([[sx - 40, 860], [sx + 40, 860], [sx + 30, 1010], [sx - 30, 1010]], "#222326");
  svg.poly(rr(sx - 95, 720, 190, 160, 60), "#2a2b2e", `stroke="#17181a" stroke-width="8"`);
  // Console, gear selector and door trims in paint.
  svg.poly([[640 + dx, 760], [960 + dx, 760], [1010 + dx, H], [590 + dx, H]], shade(t.dash, 0.05));
  svg.poly(rr(740 + dx, 850, 120, 150, 40), "#141517");
  svg.add(`<circle cx="${num(800 + dx)}" cy="870" r="38" fill="#3a3c40"/>`);
  svg.poly([[0, 620], [90, 600], [170, H], [0, H]], shade(ctx.paint, -0.15));
  svg.poly([[W, 620], [W - 90, 600], [W - 170, H], [W, H]], shade(ctx.paint, -0.15));
  svg.poly([[0, 700], [120, 690], [190, H], [0, H]], shade(t.seat, -0.25));
  svg.poly([[W, 700], [W - 120, 690], [W - 190, H], [W, H]], shade(t.seat, -0.25));
  // Front seat backs and headrests seen from the rear seat.
  for (const cx of [460 + dx * 0.5, 1140 + dx * 0.5]) {
    svg.poly(rr(cx - 95, 560, 190, 150, 55), shade(t.seat, 0.05), `stroke="${shade(t.seat, -0.35)}" stroke-width="6"`);
    svg.poly([[cx - 40, 705], [cx - 30, 760], [cx + 30, 760], [cx + 40, 705]], "#8f9398");
    const back = roundCorners(
      [
        { x: cx - 230, y: H + 40, r: 0 }, { x: cx - 250, y: 820, r: 90 }, { x: cx - 200, y: 740, r: 120 },
        { x: cx + 200, y: 740, r: 120 }, { x: cx + 250, y: 820, r: 90 }, { x: cx + 230, y: H + 40, r: 0 },
      ],
      true,
      6,
    );
    svg.poly(back, svg.linear(cx - 250, 0, cx + 250, 0, [[0, shade(t.seat, -0.25)], [0.45, shade(t.seat, 0.12)], [1, shade(t.seat, -0.3)]]), `stroke="${shade(t.seat, -0.4)}" stroke-width="6"`);
    svg.line([[cx - 120, 790], [cx - 140, H]], shade(t.seat, -0.3), 6);
    svg.line([[cx + 120, 790], [cx + 140, H]], shade(t.seat, -0.3), 6);
  }
  return svg.toString();
}

function dial(svg: Svg, cx: number, cy: number, r: number, needle: number): void {
  svg.add(`<circle cx="${cx}" cy="${cy}" r="${r + 14}" fill="${svg.linear(0, cy - r, 0, cy + r, [[0, "#c9ced3"], [1, "#5d6166"]])}"/>`);
  svg.add(`<circle cx="${cx}" cy="${cy}" r="${r}" fill="${svg.radial(cx, cy - r * 0.3, r * 1.3, [[0, "#1d2126"], [1, "#08090b"]])}"/>`);
  for (let i = 0; i <= 40; i++) {
    const a = ((225 - (270 * i) / 40) * Math.PI) / 180;
    const r0 = i % 5 === 0 ? r * 0.78 : r * 0.86;
    svg.line([[cx + Math.cos(a) * r0, cy - Math.sin(a) * r0], [cx + Math.cos(a) * r * 0.93, cy - Math.sin(a) * r * 0.93]], i > 32 ? "#e0474c" : "#e9eef2", i % 5 === 0 ? 7 : 3);
  }
  const a = ((225 - 270 * needle) * Math.PI) / 180;
  svg.line([[cx - Math.cos(a) * r * 0.12, cy + Math.sin(a) * r * 0.12], [cx + Math.cos(a) * r * 0.8, cy - Math.sin(a) * r * 0.8]], "#ff6a2b", 9);
  svg.add(`<circle cx="${cx}" cy="${cy}" r="${r * 0.11}" fill="#2c2f33" stroke="#6c7177" stroke-width="4"/>`);
}

function dashboard(ctx: SceneCtx): string {
  const { rnd } = ctx;
  const { svg, t, dx } = cabinView(ctx, 50, 260);
  svg.add(`<rect y="200" width="${W}" height="${H - 200}" fill="${svg.linear(0, 200, 0, H, [[0, shade(t.dash, 0.15)], [1, shade(t.dash, -0.35)]])}"/>`);
  svg.poly(rr(130 + dx, 230, 1340, 640, 200), shade(t.dash, 0.1));
  svg.poly(rr(170 + dx, 290, 1260, 560, 170), "#050607");
  dial(svg, 440 + dx, 560, 215, 0.05 + rnd() * 0.05);
  dial(svg, 1160 + dx, 560, 215, 0.12 + rnd() * 0.05);
  // Centre display: fuel and temperature bars, then the odometer readout.
  svg.poly(rr(670 + dx, 380, 260, 380, 24), "#0b1016", `stroke="#222a33" stroke-width="5"`);
  const fuel = 3 + Math.floor(rnd() * 6);
  for (let i = 0; i < 8; i++) svg.poly(rr(705 + dx + i * 24, 430, 16, 60, 3), i < fuel ? "#7fd7ff" : "#1b2a36");
  for (let i = 0; i < 8; i++) svg.poly(rr(705 + dx + i * 24, 520, 16, 34, 3), i < 4 ? "#7fd7ff" : "#1b2a36");
  const text = ctx.odometerText;
  const h = Math.min(62, 230 / Math.max(1, glyphAdvance(text, 1)));
  const tw = glyphAdvance(text, h);
  svg.poly(rr(685 + dx, 610, 230, 120, 12), "#060a0e", `stroke="#1d2630" stroke-width="3"`);
  const strokes = glyphStrokes(text, 800 + dx - tw / 2, 670 - h / 2, h);
  const d = strokes.map((s) => pathD(s, false)).join("");
  svg.add(`<path d="${d}" fill="none" stroke="#2a6f8f" stroke-width="${num(h * 0.2)}" stroke-linecap="round" opacity="0.6"/>`);
  svg.add(`<path d="${d}" fill="none" stroke="#c9f1ff" stroke-width="${num(h * 0.11)}" stroke-linecap="round" stroke-linejoin="round"/>`);
  // Steering wheel rim across the bottom.
  svg.add(`<circle cx="${num(800 + dx)}" cy="1560" r="700" fill="none" stroke="#18191b" stroke-width="110"/>`);
  svg.add(`<circle cx="${num(800 + dx)}" cy="1560" r="745" fill="none" stroke="#3a3c40" stroke-width="8" opacity="0.7"/>`);
  svg.poly([[560 + dx, H], [640 + dx, 930], [960 + dx, 930], [1040 + dx, H]], "#1f2023");
  svg.poly(rr(700 + dx, 960, 200, 120, 40), "#2a2b2e");
  svg.add(`<rect width="${W}" height="${H}" fill="${shade(ctx.paint, 0)}" opacity="0.04"/>`);
  return svg.toString();
}

/** One-point-perspective room: near rectangle, far rectangle (the opening seen into the vehicle). */
function room(
  svg: Svg,
  n: [number, number, number, number],
  f: [number, number, number, number],
  c: { floor: string; wall: string; back: string; ceil?: string },
): void {
  const [nx0, ny0, nx1, ny1] = n;
  const [fx0, fy0, fx1, fy1] = f;
  if (c.ceil) svg.poly([[nx0, ny0], [nx1, ny0], [fx1, fy0], [fx0, fy0]], c.ceil);
  svg.poly([[nx0, ny0], [fx0, fy0], [fx0, fy1], [nx0, ny1]], c.wall);
  svg.poly([[nx1, ny0], [fx1, fy0], [fx1, fy1], [nx1, ny1]], shade(c.wall, -0.08));
  svg.poly([[fx0, fy0], [fx1, fy0], [fx1, fy1], [fx0, fy1]], c.back);
  svg.poly([[nx0, ny1], [nx1, ny1], [fx1, fy1], [fx0, fy1]], c.floor);
}

function cargo(ctx: SceneCtx): string {
  const svg = new Svg(W, H);
  const { rnd, paint, bodyType } = ctx;
  const dx = (rnd() - 0.5) * 50;
  drawBackground(svg, rnd, 330, backdrop(rnd));
  const body = svg.linear(0, 300, 0, H, [[0, shade(paint, 0.2)], [0.5, paint], [1, shade(paint, -0.3)]]);
  const lamp = "#b5161f";
  if (bodyType === "ute" || bodyType === "cab_chassis") {
    const alloy = bodyType === "cab_chassis";
    svg.poly([[330 + dx, 250], [1270 + dx, 250], [1250 + dx, 420], [350 + dx, 420]], paint);
    svg.poly([[400 + dx, 280], [1200 + dx, 280], [1185 + dx, 400], [415 + dx, 400]], GLASS, `stroke="${TRIM}" stroke-width="10"`);
    if (alloy) {
      svg.poly([[300 + dx, 200], [1300 + dx, 200], [1300 + dx, 470], [300 + dx, 470]], "none", `stroke="#c3c8cd" stroke-width="22"`);
      for (let x = 340; x < 1300; x += 60) svg.line([[x + dx, 210], [x + dx, 460]], "#aab0b6", 6);
      svg.poly([[180 + dx, 470], [1420 + dx, 470], [1560 + dx, 1000], [40 + dx, 1000]], "#c7ccd0");
      for (let i = 1; i < 12; i++) svg.line([[180 + dx + (1240 * i) / 12, 470], [40 + dx + (1520 * i) / 12, 1000]], "#9fa6ac", 6);
      for (const sgn of [-1, 1]) svg.poly(sgn < 0 ? [[40 + dx, 1000], [180 + dx, 470], [180 + dx, 400], [20 + dx, 900]] : [[1560 + dx, 1000], [1420 + dx, 470], [1420 + dx, 400], [1580 + dx, 900]], "#b5bbc1", `stroke="#8b9299" stroke-width="6"`);
      svg.poly([[40 + dx, 1000], [1560 + dx, 1000], [1560 + dx, 1050], [40 + dx, 1050]], "#8f969c");
    } else {
      room(svg, [120 + dx, 330, 1480 + dx, 960], [330 + dx, 420, 1270 + dx, 640], { floor: "#2d2f32", wall: shade(paint, -0.1), back: shade(paint, -0.25) });
      for (let i = 1; i < 10; i++) svg.line([[120 + dx + (1360 * i) / 10, 960], [330 + dx + (940 * i) / 10, 640]], "#3c3f43", 14);
      svg.poly([[120 + dx, 960], [1480 + dx, 960], [1560 + dx, 1120], [40 + dx, 1120]], shade(paint, -0.15), `stroke="${shade(paint, -0.35)}" stroke-width="8"`);
      svg.poly([[60 + dx, 1110], [1540 + dx, 1110], [1540 + dx, 1180], [60 + dx, 1180]], TRIM);
      svg.poly([[60 + dx, 330], [120 + dx, 330], [120 + dx, 960], [60 + dx, 960]], body);
      svg.poly([[1480 + dx, 330], [1540 + dx, 330], [1540 + dx, 960], [1480 + dx, 960]], body);
      svg.poly([[60 + dx, 400], [120 + dx, 400], [120 + dx, 700], [60 + dx, 700]], lamp);
      svg.poly([[1480 + dx, 400], [1540 + dx, 400], [1540 + dx, 700], [1480 + dx, 700]], lamp);
    }
    return svg.toString();
  }
  if (bodyType === "van") {
    room(svg, [260 + dx, 120, 1340 + dx, 1000], [520 + dx, 300, 1080 + dx, 720], { floor: "#b89a6e", wall: "#c9c6bd", back: "#a9a69e", ceil: "#dad8d1" });
    for (let i = 1; i < 6; i++) svg.line([[260 + dx + (1080 * i) / 6, 1000], [520 + dx + (560 * i) / 6, 720]], "#9c7f57", 5);
    svg.poly(rr(640 + dx, 360, 320, 150, 20), GLASS, `stroke="#7d7a73" stroke-width="10"`);
    for (const sgn of [-1, 1]) {
      const x = sgn < 0 ? 260 + dx : 1340 + dx;
      const o = sgn < 0 ? -230 : 230;
      svg.poly([[x, 90], [x + o, 30], [x + o, 1090], [x, 1020]], body, `stroke="${shade(paint, -0.35)}" stroke-width="8"`);
      svg.poly([[x + o * 0.15, 140], [x + o * 0.85, 110], [x + o * 0.85, 380], [x + o * 0.15, 390]], GLASS);
    }
    svg.poly([[200 + dx, 1000], [1400 + dx, 1000], [1440 + dx, 1100], [160 + dx, 1100]], shade(paint, -0.1));
    svg.poly([[160 + dx, 1100], [1440 + dx, 1100], [1440 + dx, H], [160 + dx, H]], TRIM);
    return svg.toString();
  }
  // Boot or hatch: lid raised, carpeted floor, rear seat backs at the far end.
  const low = bodyType === "sedan" || bodyType === "coupe" || bodyType === "convertible";
  const top = low ? 520 : 300;
  svg.poly([[60 + dx, top - 60], [1540 + dx, top - 60], [1600 + dx, H], [0 + dx, H]], body, `stroke="${shade(paint, -0.35)}" stroke-width="6"`);
  const carpet = "#4a4c50";
  room(svg, [260 + dx, top, 1340 + dx, 930], [420 + dx, top + 80, 1180 + dx, 760], { floor: "#5a5c60", wall: "#3a3c3f", back: carpet, ceil: low ? undefined : "#5c5d5f" });
  const seat = trimColours(rnd).seat;
  const sTop = low ? top + 80 : top + 130;
  svg.poly(rr(440 + dx, sTop, 350, 760 - sTop, 30), shade(seat, -0.05));
  svg.poly(rr(810 + dx, sTop, 350, 760 - sTop, 30), shade(seat, -0.1));
  if (!low) for (const hx of [520, 1000]) svg.poly(rr(hx + dx, sTop - 70, 130, 90, 30), shade(seat, 0.05));
  svg.poly([[250 + dx, 930], [1350 + dx, 930], [1380 + dx, 975], [220 + dx, 975]], "#b8bdc2");
  svg.poly(
    [[0 + dx, 990], [1600 + dx, 990], [1600 + dx, H], [0 + dx, H]],
    svg.linear(0, 990, 0, H, [[0, shade(paint, -0.1)], [0.6, shade(paint, -0.3)], [0.61, TRIM], [1, TRIM]]),
  );
  svg.poly([[70 + dx, top], [250 + dx, top], [240 + dx, top + 200], [80 + dx, top + 190]], lamp, `stroke="#5a0c10" stroke-width="8"`);
  svg.poly([[1530 + dx, top], [1350 + dx, top], [1360 + dx, top + 200], [1520 + dx, top + 190]], lamp, `stroke="#5a0c10" stroke-width="8"`);
  // The raised lid, seen from below.
  svg.poly([[40 + dx, top - 70], [1560 + dx, top - 70], [1480 + dx, top - 260], [120 + dx, top - 260]], "#3a3c3f");
  svg.poly([[120 + dx, top - 260], [1480 + dx, top - 260], [1440 + dx, top - 320], [160 + dx, top - 320]], shade(paint, 0.1), `stroke="${shade(paint, -0.3)}" stroke-width="6"`);
  if (!low) svg.poly([[200 + dx, top - 330], [1400 + dx, top - 330], [1380 + dx, top - 420], [220 + dx, top - 420]], GLASS);
  return svg.toString();
}

function wheel(ctx: SceneCtx): string {
  const svg = new Svg(W, H);
  const { rnd, paint } = ctx;
  const cx = 840 + (rnd() - 0.5) * 80;
  const cy = 620 + (rnd() - 0.5) * 30;
  const R = 440;
  const sq = 0.9; // the wheel is seen slightly from the front
  const back = 150;
  const spokes = [5, 6, 7, 10][Math.floor(rnd() * 4)];
  // Body panel, arch opening, ground.
  svg.add(`<rect width="${W}" height="${H}" fill="${svg.linear(0, 0, 0, H, [[0, shade(paint, 0.25)], [0.35, paint], [0.8, shade(paint, -0.3)]])}"/>`);
  svg.add(`<ellipse cx="${num(cx - 40)}" cy="${num(cy + 40)}" rx="${num(R * 1.12)}" ry="${num(R * 1.1)}" fill="${svg.radial(cx, cy - R * 0.6, R * 1.2, [[0, "#26282b"], [1, "#0b0c0d"]])}"/>`);
  svg.add(`<rect y="${num(cy + R - 10)}" width="${W}" height="${num(H - cy - R + 10)}" fill="${svg.linear(0, cy + R, 0, H, [[0, "#6f7271"], [1, "#8c8f8d"]])}"/>`);
  svg.add(`<ellipse cx="${num(cx - 60)}" cy="${num(cy + R)}" rx="${num(R * 1.2)}" ry="40" fill="#000" opacity="0.45" filter="${svg.blur(20)}"/>`);
  // Tread band: back rim of the tyre offset to the left, with grooves and blocks.
  const pt = (a: number, t: number, r = R): P2 => [cx - back * t + Math.cos(a) * r * sq, cy + Math.sin(a) * r];
  const band: P2[] = [];
  for (let k = 0; k <= 40; k++) band.push(pt(Math.PI / 2 + (Math.PI * k) / 40, 1));
  for (let k = 40; k >= 0; k--) band.push(pt(Math.PI / 2 + (Math.PI * k) / 40, 0));
  svg.poly(band, TYRE);
  for (let k = 1; k < 36; k++) {
    const a0 = Math.PI / 2 + (Math.PI * k) / 36;
    const a1 = Math.PI / 2 + (Math.PI * (k + 0.55)) / 36;
    for (const [t0, t1] of [[0.08, 0.3], [0.38, 0.62], [0.7, 0.92]]) {
      const o = (t0 * 3) % 2 < 1 ? 0 : 0.25;
      const q = [pt(a0 + o / 36, t0), pt(a1 + o / 36, t0), pt(a1 + o / 36, t1), pt(a0 + o / 36, t1)];
      svg.poly(q, k % 2 ? "#2c2e32" : "#323438");
    }
  }
  // Sidewall and rim on the outer face.
  svg.add(`<g transform="translate(${num(cx)} ${num(cy)}) scale(${sq} 1)">`);
  svg.add(`<circle r="${R}" fill="${svg.radial(-R * 0.3, -R * 0.3, R * 1.4, [[0, "#3a3c40"], [0.7, "#25272a"], [1, "#1a1b1d"]])}"/>`);
  svg.add(`<circle r="${R * 0.96}" fill="none" stroke="#2f3135" stroke-width="6"/>`);
  const rim = R * 0.66;
  svg.add(`<circle r="${num(rim)}" fill="${svg.linear(-rim, -rim, rim, rim, [[0, "#eef1f3"], [0.5, "#a3a9af"], [1, "#d7dbdf"]])}"/>`);
  svg.add(`<circle r="${num(rim * 0.9)}" fill="#1c1e21"/>`);
  svg.add(`<circle r="${num(rim * 0.72)}" fill="${svg.radial(0, 0, rim * 0.72, [[0, "#8d9196"], [0.6, "#7a7f84"], [1, "#5a5e63"]])}"/>`);
  for (let i = 0; i < 12; i++) {
    const a = (i / 12) * Math.PI * 2;
    svg.add(`<circle cx="${num(Math.cos(a) * rim * 0.55)}" cy="${num(Math.sin(a) * rim * 0.55)}" r="7" fill="#4b4f54"/>`);
  }
  const cal = rnd() < 0.3 ? "#b3262c" : "#55595e";
  svg.poly(rr(-rim * 0.85, -rim * 0.5, rim * 0.3, rim * 0.75, 30), cal);
  for (let i = 0; i < spokes; i++) {
    const a = (i / spokes) * Math.PI * 2 - Math.PI / 2 + 0.2;
    const w = (rim * 0.55) / spokes + 10;
    const ca = Math.cos(a);
    const sa = Math.sin(a);
    const r0 = rim * 0.2;
    const r1 = rim * 0.92;
    const spoke: P2[] = [
      [r0 * ca - w * sa, r0 * sa + w * ca],
      [r1 * ca - w * 1.7 * sa, r1 * sa + w * 1.7 * ca],
      [r1 * ca + w * 1.7 * sa, r1 * sa - w * 1.7 * ca],
      [r0 * ca + w * sa, r0 * sa - w * ca],
    ];
    svg.poly(spoke, svg.linear(spoke[0][0], spoke[0][1], spoke[2][0], spoke[2][1], [[0, "#d9dde1"], [0.5, "#b9bfc5"], [1, "#8e949a"]]), `stroke="#6f757b" stroke-width="3"`);
  }
  svg.add(`<circle r="${num(rim * 0.26)}" fill="${svg.linear(-50, -50, 50, 50, [[0, "#e3e6e9"], [1, "#8f959b"]])}" stroke="#6b7076" stroke-width="4"/>`);
  for (let i = 0; i < 5; i++) {
    const a = (i / 5) * Math.PI * 2;
    svg.add(`<circle cx="${num(Math.cos(a) * rim * 0.17)}" cy="${num(Math.sin(a) * rim * 0.17)}" r="9" fill="#5d6268"/>`);
  }
  svg.add(`<circle r="${num(rim * 0.09)}" fill="#c9ced3"/>`);
  svg.add("</g>");
  // Arch lip in paint over the top of the tyre.
  const lip: P2[] = [];
  for (let k = 0; k <= 30; k++) {
    const a = Math.PI + (Math.PI * k) / 30;
    lip.push([cx - 40 + Math.cos(a) * R * 1.18, cy + 40 + Math.sin(a) * R * 1.16]);
  }
  for (let k = 30; k >= 0; k--) {
    const a = Math.PI + (Math.PI * k) / 30;
    lip.push([cx - 40 + Math.cos(a) * R * 1.12, cy + 40 + Math.sin(a) * R * 1.1]);
  }
  svg.poly(lip, shade(paint, 0.3), 'opacity="0.8"');
  void circle;
  return svg.toString();
}

export function closeup(angle: Closeup, ctx: SceneCtx): string {
  if (angle === "interior_front") return interiorFront(ctx);
  if (angle === "dashboard") return dashboard(ctx);
  if (angle === "cargo") return cargo(ctx);
  return wheel(ctx);
}
