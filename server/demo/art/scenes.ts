/**
 * One function per photo angle. Exterior angles place the projected vehicle (./exterior.ts) on a yard or in a
 * photo bay; the close-ups (cabin, dashboard, cargo area, wheel) are in ./closeups.ts.
 */
import { Svg, num, type Camera, type P3 } from "./geometry.ts";
import { carBounds, drawCar } from "./exterior.ts";
import { mix, shade } from "./palette.ts";
import type { BodySpec, BodyType } from "./shapes.ts";

export const W = 1600;
export const H = 1200;

export interface SceneCtx {
  spec: BodySpec;
  paint: string;
  rnd: () => number;
  odometerText: string;
  seed: number;
  bodyType: BodyType;
}

export interface Backdrop {
  sky: string;
  yard: boolean;
}

export function backdrop(rnd: () => number): Backdrop {
  const yard = rnd() < 0.65;
  const sky = mix("#8db7e0", ["#a7c4e2", "#9fb9d9", "#b3cde6", "#c2d3e2"][Math.floor(rnd() * 4)], 0.5);
  return { sky, yard };
}

/** Sky or photo-bay wall above `horizon`, asphalt or concrete below. */
export function drawBackground(svg: Svg, rnd: () => number, horizon: number, bd: Backdrop): void {
  if (bd.yard) {
    svg.add(`<rect width="${W}" height="${num(horizon + 2)}" fill="${svg.linear(0, 0, 0, horizon, [[0, shade(bd.sky, -0.12)], [0.7, mix(bd.sky, "#ffffff", 0.45)], [1, mix(bd.sky, "#ffffff", 0.7)]])}"/>`);
    const blur = svg.blur(30);
    for (let i = 0; i < 4; i++) {
      const cx = rnd() * W;
      const cy = horizon * (0.15 + rnd() * 0.45);
      svg.add(`<ellipse cx="${num(cx)}" cy="${num(cy)}" rx="${num(140 + rnd() * 160)}" ry="${num(28 + rnd() * 25)}" fill="#ffffff" opacity="0.55" filter="${blur}"/>`);
    }
    // Distant trees, then a low showroom building and a fence line.
    let d = `M0 ${num(horizon)}`;
    for (let x = 0; x <= W + 60; x += 60) d += `Q${num(x + 30)} ${num(horizon - 70 - rnd() * 70)} ${num(x + 60)} ${num(horizon - 30 - rnd() * 30)}`;
    d += `L${W} ${num(horizon)}Z`;
    svg.add(`<path d="${d}" fill="${mix("#7f9a88", bd.sky, 0.35)}"/>`);
    const bx = rnd() < 0.5 ? 60 + rnd() * 200 : 900 + rnd() * 300;
    const bw = 420 + rnd() * 200;
    svg.add(`<rect x="${num(bx)}" y="${num(horizon - 120)}" width="${num(bw)}" height="120" fill="#dfe1e2"/>`);
    svg.add(`<rect x="${num(bx - 10)}" y="${num(horizon - 132)}" width="${num(bw + 20)}" height="16" fill="#9aa3aa"/>`);
    svg.add(`<rect x="${num(bx + 30)}" y="${num(horizon - 90)}" width="${num(bw - 60)}" height="62" fill="#a9bac7" opacity="0.8"/>`);
    svg.add(`<rect x="0" y="${num(horizon - 26)}" width="${W}" height="26" fill="#a7aca9" opacity="0.5"/>`);
    svg.add(`<rect y="${num(horizon)}" width="${W}" height="${num(H - horizon)}" fill="${svg.linear(0, horizon, 0, H, [[0, "#b3b5b2"], [0.35, "#9c9e9c"], [1, "#7c7f7e"]])}"/>`);
    svg.add(`<rect y="${num(horizon)}" width="${W}" height="10" fill="#cfd1cd"/>`);
  } else {
    const wall = mix("#d9d6cf", ["#d3d8dc", "#dcd4c8", "#d6d6d2"][Math.floor(rnd() * 3)], 0.6);
    svg.add(`<rect width="${W}" height="${num(horizon + 2)}" fill="${svg.linear(0, 0, 0, horizon, [[0, shade(wall, -0.12)], [1, shade(wall, 0.04)]])}"/>`);
    for (let x = 100 + rnd() * 80; x < W; x += 240) svg.add(`<rect x="${num(x)}" y="0" width="4" height="${num(horizon)}" fill="${shade(wall, -0.08)}"/>`);
    const lx = 500 + rnd() * 600;
    svg.add(`<rect width="${W}" height="${num(horizon)}" fill="${svg.radial(lx, horizon * 0.45, 760, [[0, "#ffffff", 0.4], [1, "#ffffff", 0]])}"/>`);
    svg.add(`<rect x="0" y="${num(horizon - 40)}" width="${W}" height="40" fill="${shade(wall, -0.3)}"/>`);
    svg.add(`<rect y="${num(horizon)}" width="${W}" height="${num(H - horizon)}" fill="${svg.linear(0, horizon, 0, H, [[0, "#b9bab6"], [0.4, "#a5a6a3"], [1, "#8a8c8a"]])}"/>`);
    for (let i = 1; i < 4; i++) svg.add(`<rect y="${num(horizon + (H - horizon) * (i / 4) ** 1.6)}" width="${W}" height="3" fill="#8e908d" opacity="0.6"/>`);
  }
}

function exterior(ctx: SceneCtx, cam: Camera): string {
  const svg = new Svg(W, H);
  const { rnd, spec } = ctx;
  const bd = backdrop(rnd);
  const light: P3 = [-0.6 + rnd() * 1.2, 1, 0.2 + rnd() * 0.5];
  const spokes = [5, 6, 7, 10][Math.floor(rnd() * 4)];
  const b = carBounds(spec, cam);
  const k = Math.min((W * (0.78 + rnd() * 0.06)) / (b.x1 - b.x0), (H * 0.56) / (b.y1 - b.y0));
  const cx = W / 2 + (rnd() - 0.5) * 90;
  const bottom = H * 0.8 + (rnd() - 0.5) * 50;
  const tx = cx - ((b.x0 + b.x1) / 2) * k;
  const ty = bottom - b.y1 * k;
  const horizon = bottom - (b.y1 - b.y0) * k * (0.5 + cam.pitch * 1.2);
  drawBackground(svg, rnd, horizon, bd);
  svg.add(`<g transform="translate(${num(tx)} ${num(ty)}) scale(${k.toFixed(5)})">`);
  drawCar(svg, spec, { paint: ctx.paint, sky: bd.sky, light, spokes }, cam);
  svg.add("</g>");
  return svg.toString();
}

const deg = Math.PI / 180;

export function sideLeft(ctx: SceneCtx): string {
  return exterior(ctx, { yaw: (ctx.rnd() - 0.5) * 3 * deg, pitch: (3 + ctx.rnd() * 2) * deg });
}

export function frontLeft(ctx: SceneCtx): string {
  return exterior(ctx, { yaw: (34 + ctx.rnd() * 10) * deg, pitch: (6 + ctx.rnd() * 3) * deg });
}

export function rearRight(ctx: SceneCtx): string {
  return exterior(ctx, { yaw: -(180 - 34 - ctx.rnd() * 10) * deg, pitch: (6 + ctx.rnd() * 3) * deg });
}

export function front(ctx: SceneCtx): string {
  return exterior(ctx, { yaw: 90 * deg, pitch: (3 + ctx.rnd() * 2) * deg });
}

export function rear(ctx: SceneCtx): string {
  return exterior(ctx, { yaw: -90 * deg, pitch: (3 + ctx.rnd() * 2) * deg });
}
