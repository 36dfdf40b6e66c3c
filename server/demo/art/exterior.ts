/**
 * Draws a vehicle from outside: the side outline of ./shapes.ts swept across the width (greenhouse tapered inward),
 * projected with an orthographic camera, shaded per facet, with side glass, shut lines, lamps, grille and wheels
 * laid on the visible faces. Output goes into an Svg in projected model units (y flipped); the caller frames it.
 */
import { cross, facing, hull, project, roundCorners, sub, dot, normalize, circle, pathD, type Camera, type P2, type P3 } from "./geometry.ts";
import type { Svg } from "./geometry.ts";
import { GLASS, TRIM, TYRE, mix, shade } from "./palette.ts";
import type { BodySpec, Box, Material } from "./shapes.ts";

export interface CarLook {
  paint: string;
  sky: string;
  light: P3;
  spokes: number;
}

interface Prepared {
  pts: P2[];
  mats: Material[];
  roof: number;
  hw: (y: number) => number;
  side: P2[];
}

function prepare(spec: BodySpec): Prepared {
  const pts: P2[] = [];
  const mats: Material[] = [];
  // Dense outline with a material per segment.
  const corners = spec.outline.map(([x, y, r]) => ({ x, y, r }));
  const edgeMat = spec.outline.map((p) => p[3] ?? "paint");
  for (let i = 0; i < corners.length; i++) {
    const one = roundCorners(corners.slice(Math.max(0, i - 1), i + 2), false, 5);
    const part = i === 0 ? one.slice(0, 1) : i === corners.length - 1 ? one.slice(-1) : one.slice(1, -1);
    part.forEach((p, k) => {
      pts.push(p);
      const half = k < part.length / 2 && i > 0 ? edgeMat[i - 1] : edgeMat[i];
      mats.push(half);
    });
  }
  const roof = Math.max(...pts.map((p) => p[1]));
  const half = spec.width / 2;
  // Half-width by height: fullest just under the belt, tucked in towards the sills, tapered over the greenhouse.
  const peak = spec.belt - 220;
  const hw = (y: number) =>
    y <= peak ? half * (1 - 0.06 * ((peak - Math.max(0, y)) / peak) ** 2)
      : y <= spec.belt ? half * (1 - 0.015 * ((y - peak) / 220) ** 2)
        : half * 0.985 * (1 - ((1 - spec.taper) * (y - spec.belt)) / Math.max(1, roof - spec.belt));
  // Insert belt-line crossings so every straight edge lies in one plane.
  const withBelt: P2[] = [];
  const matsB: Material[] = [];
  for (let i = 0; i < pts.length; i++) {
    withBelt.push(pts[i]);
    matsB.push(mats[i]);
    const a = pts[i];
    const b = pts[i + 1];
    if (b && (a[1] - spec.belt) * (b[1] - spec.belt) < 0) {
      const t = (spec.belt - a[1]) / (b[1] - a[1]);
      withBelt.push([a[0] + (b[0] - a[0]) * t, spec.belt]);
      matsB.push(mats[i]);
    }
  }
  // Side silhouette: outline, then the bottom edge back to the front with wheel arches.
  const side = [...withBelt];
  const first = withBelt[0];
  const last = withBelt[withBelt.length - 1];
  const ra = spec.wheelR + 45;
  for (const cx of [spec.frontAxle + spec.wheelbase, spec.frontAxle]) {
    if (cx + ra > last[0] || cx - ra < first[0]) continue;
    const t0 = Math.asin(Math.max(-0.5, Math.min(0.9, (spec.sill - spec.wheelR) / ra)));
    for (let k = 0; k <= 16; k++) {
      const t = t0 + ((Math.PI - 2 * t0) * k) / 16;
      side.push([cx + Math.cos(t) * ra, spec.wheelR + Math.sin(t) * ra]);
    }
  }
  return { pts: withBelt, mats: matsB, roof, hw, side };
}

/** Where the front (or rear) surface is at height y. */
function contourX(pts: P2[], y: number, fromFront: boolean): number {
  const n = pts.length;
  for (let k = 0; k < n - 1; k++) {
    const i = fromFront ? k : n - 2 - k;
    const a = pts[i];
    const b = pts[i + 1];
    if ((a[1] - y) * (b[1] - y) <= 0 && a[1] !== b[1]) return a[0] + ((b[0] - a[0]) * (y - a[1])) / (b[1] - a[1]);
  }
  return fromFront ? pts[0][0] : pts[n - 1][0];
}

export function drawCar(svg: Svg, spec: BodySpec, look: CarLook, cam: Camera): void {
  const P = prepare(spec);
  const L2 = spec.length / 2;
  const light = normalize(look.light);
  const scr = (p: P3): P2 => {
    const q = project(p, cam);
    return [q[0], -q[1]];
  };
  const depth = (p: P3) => project(p, cam)[2];
  const onSide = (x: number, y: number, s: number, out = 0): P3 => [x - L2, y, s * (P.hw(y) + out)];
  const lit = (base: string, n: P3, k = 1) => {
    const t = dot(normalize(n), light);
    const up = Math.max(0, normalize(n)[1]);
    const c = t >= 0 ? mix(base, shade(base, 0.5), t * 0.6 * k) : mix(base, shade(base, -0.6), -t * 0.55 * k);
    return mix(c, look.sky, up * 0.12);
  };
  const dark = "#17181b";
  const frontVis = facing([-1, 0, 0], cam) > 0.05;
  const rearVis = facing([1, 0, 0], cam) > 0.05;
  const sideVis = (s: number) => facing([0, 0, s], cam) > 0.05;

  // Ground shadow.
  const fp: P3[] = [
    [-L2 - 60, 0, -spec.width / 2 - 60],
    [L2 + 60, 0, -spec.width / 2 - 60],
    [L2 + 60, 0, spec.width / 2 + 60],
    [-L2 - 60, 0, spec.width / 2 + 60],
  ];
  svg.poly(fp.map(scr), "#000", `opacity="0.38" filter="${svg.blur(110)}"`);
  svg.poly(fp.map((p) => scr([p[0] * 0.9, 0, p[2] * 0.85])), "#000", `opacity="0.35" filter="${svg.blur(35)}"`);

  const tyre = (axleX: number, s: number) => {
    const zo = s * (spec.width / 2 - 30);
    const zi = s * (spec.width / 2 - 30 - spec.tyreW);
    const ring = circle(axleX - L2, spec.wheelR, spec.wheelR, 40);
    const pts = [...ring.map(([x, y]) => scr([x, y, zo])), ...ring.map(([x, y]) => scr([x, y, zi]))];
    svg.poly(hull(pts), TYRE);
    if (!sideVis(s)) return;
    const face = (r: number, n = 40) => circle(axleX - L2, spec.wheelR, r, n).map(([x, y]) => scr([x, y, zo + s * 2]));
    svg.poly(face(spec.wheelR), "#2a2c30");
    svg.poly(face(spec.wheelR * 0.97), "#232528");
    svg.poly(face(spec.rimR), "#9aa0a6");
    svg.poly(face(spec.rimR * 0.9), "#2d3034");
    svg.poly(face(spec.rimR * 0.62), "#6d7277");
    const cx = axleX - L2;
    for (let i = 0; i < look.spokes; i++) {
      const a = (i / look.spokes) * Math.PI * 2 + 0.3;
      const w = (spec.rimR * 0.5) / look.spokes + 12;
      const r0 = spec.rimR * 0.2;
      const r1 = spec.rimR * 0.92;
      const ca = Math.cos(a);
      const sa = Math.sin(a);
      const spoke: P2[] = [
        [r0 * ca - w * sa, r0 * sa + w * ca],
        [r1 * ca - w * 1.6 * sa, r1 * sa + w * 1.6 * ca],
        [r1 * ca + w * 1.6 * sa, r1 * sa - w * 1.6 * ca],
        [r0 * ca + w * sa, r0 * sa - w * ca],
      ];
      svg.poly(spoke.map(([u, v]) => scr([cx + u, spec.wheelR + v, zo + s * 3])), i % 2 ? "#c5cacf" : "#b7bcc2");
    }
    svg.poly(circle(cx, spec.wheelR, spec.rimR * 0.24, 24).map(([x, y]) => scr([x, y, zo + s * 4])), "#c9ced3");
    svg.poly(circle(cx, spec.wheelR, spec.rimR * 0.1, 16).map(([x, y]) => scr([x, y, zo + s * 5])), "#5b6066");
  };
  const axles = [spec.frontAxle, spec.frontAxle + spec.wheelbase];
  const nearSides = [1, -1].filter(sideVis);
  const farSides = [1, -1].filter((s) => !sideVis(s));
  for (const s of farSides) for (const a of axles) tyre(a, s);

  const boxFill = (b: Box) => ({ paint: look.paint, alloy: "#c3c8cd", dark: "#2b2d31", interior: "#3a3633", trim: TRIM })[b.fill];
  const drawBox = (b: Box, zc: number) => {
    const [x0, x1] = [b.x[0] - L2, b.x[1] - L2];
    const [y0, y1] = b.y;
    const [z0, z1] = [zc - b.hz, zc + b.hz];
    const faces: Array<[P3, P3[]]> = [
      [[0, 1, 0], [[x0, y1, z0], [x1, y1, z0], [x1, y1, z1], [x0, y1, z1]]],
      [[-1, 0, 0], [[x0, y0, z0], [x0, y1, z0], [x0, y1, z1], [x0, y0, z1]]],
      [[1, 0, 0], [[x1, y0, z0], [x1, y1, z0], [x1, y1, z1], [x1, y0, z1]]],
      [[0, 0, 1], [[x0, y0, z1], [x1, y0, z1], [x1, y1, z1], [x0, y1, z1]]],
      [[0, 0, -1], [[x0, y0, z0], [x1, y0, z0], [x1, y1, z0], [x0, y1, z0]]],
    ];
    for (const [n, q] of faces) {
      if (facing(n, cam) <= 0.01) continue;
      const c = lit(boxFill(b), n);
      svg.poly(q.map(scr), c, `stroke="${b.fill === "alloy" ? shade(c, -0.2) : c}" stroke-width="4" stroke-linejoin="round"`);
    }
  };
  const boxes = (layer: Box["layer"]) =>
    (spec.boxes ?? []).filter((b) => b.layer === layer).flatMap((b) => (b.pair ? [[b, b.z ?? 0], [b, -(b.z ?? 0)]] : [[b, b.z ?? 0]]) as Array<[Box, number]>)
      .sort((a, b) => depth([(a[0].x[0] + a[0].x[1]) / 2 - L2, a[0].y[1], a[1]]) - depth([(b[0].x[0] + b[0].x[1]) / 2 - L2, b[0].y[1], b[1]]));
  if (frontVis) for (const [b, z] of boxes("body")) drawBox(b, z);

  // Swept surfaces (bonnet, windscreen, roof, tailgate…).
  const strips: Array<{ d: number; draw: () => void }> = [];
  for (let i = 0; i < P.pts.length - 1; i++) {
    const a = P.pts[i];
    const b = P.pts[i + 1];
    const A = onSide(a[0], a[1], 1);
    const B = onSide(b[0], b[1], 1);
    const C = onSide(b[0], b[1], -1);
    const D = onSide(a[0], a[1], -1);
    const n = cross(sub(B, A), sub(D, A));
    if (facing(n, cam) <= 0.02) continue;
    const mat = P.mats[i];
    const base = mat === "dark" ? "#2a2c2f" : mat === "interior" ? "#3d3936" : look.paint;
    const fill = lit(base, n);
    strips.push({
      d: depth([(A[0] + B[0]) / 2, (A[1] + B[1]) / 2, 0]),
      draw: () => {
        svg.poly([A, B, C, D].map(scr), fill, `stroke="${fill}" stroke-width="3"`);
      },
    });
  }
  // Glass runs (windscreen, rear window) inset from the pillars, one polygon per run.
  for (let i = 0; i < P.pts.length - 1; i++) {
    if (P.mats[i] !== "glass") continue;
    let j = i;
    while (j < P.pts.length - 1 && P.mats[j] === "glass") j++;
    const run = P.pts.slice(i, j + 1);
    const a = run[0];
    const b = run[run.length - 1];
    const n: P3 = [-(b[1] - a[1]), b[0] - a[0], 0];
    if (facing(n, cam) > 0.02) {
      const pts = [...run.map(([x, y]) => onSide(x, y, 1, -75)), ...run.reverse().map(([x, y]) => onSide(x, y, -1, -75))];
      const g = mix(GLASS, look.sky, 0.12 + 0.3 * Math.max(0, normalize(n)[1]));
      strips.push({ d: Math.max(...run.map(([x, y]) => depth([x - L2, y, 0]))) + 1, draw: () => svg.poly(pts.map(scr), g, `stroke="${TRIM}" stroke-width="10" stroke-linejoin="round"`) });
    }
    i = j;
  }
  strips.sort((p, q) => p.d - q.d).forEach((s) => s.draw());

  // Visible side faces with their details.
  for (const s of nearSides) {
    const side = P.side.map(([x, y]) => scr(onSide(x, y, s)));
    const top = scr(onSide(spec.length / 2, P.roof, s));
    const bot = scr(onSide(spec.length / 2, 0, s));
    const sideLight = dot([0, 0, s], light) * 0.12;
    const base = shade(look.paint, sideLight);
    const bo = (P.roof - spec.belt) / P.roof;
    const grad = svg.linear(top[0], top[1], bot[0], bot[1], [
      [0, shade(base, 0.12)], [bo - 0.02, shade(base, 0.22)], [bo + 0.01, shade(base, 0.32)], [bo + 0.06, shade(base, 0.06)],
      [0.62, base], [0.8, shade(base, -0.16)], [1, shade(base, -0.4)],
    ]);
    svg.poly(side, grad, `stroke="${shade(look.paint, -0.35)}" stroke-width="6" stroke-linejoin="round"`);
    const pr = (pts: P2[], out = 0) => pts.map(([x, y]) => scr(onSide(x, y, s, out)));
    // Wheel wells and cladding.
    for (const cx of axles) {
      const ra = spec.wheelR + 45;
      if (cx + ra > P.pts[P.pts.length - 1][0] || cx - ra < P.pts[0][0]) continue;
      const arc: P2[] = [];
      for (let k = 0; k <= 16; k++) {
        const t = (Math.PI * k) / 16;
        arc.push([cx + Math.cos(t) * ra, spec.wheelR + Math.sin(t) * ra]);
      }
      svg.poly(pr([...arc, [cx - ra, Math.min(spec.sill, spec.wheelR)], [cx + ra, Math.min(spec.sill, spec.wheelR)]]), "#0f1012");
      if (spec.cladding) {
        const outer = arc.map(([x, y]): P2 => [cx + (x - cx) * 1.2, spec.wheelR + (y - spec.wheelR) * 1.2]);
        svg.poly(pr([...arc, ...outer.reverse()]), TRIM);
      }
    }
    if (spec.cladding) {
      const x0 = P.pts[0][0] + 150;
      const x1 = P.pts[P.pts.length - 1][0] - 150;
      svg.poly(pr([[x0, spec.sill + 90], [x1, spec.sill + 90], [x1, spec.sill], [x0, spec.sill]]), TRIM);
    }
    // Side glass, reflection and pillars.
    if (spec.dlo.length) {
      const dlo = pr(spec.dlo, -4);
      const t = scr(onSide(spec.length / 2, P.roof, s));
      const b = scr(onSide(spec.length / 2, spec.belt, s));
      svg.poly(dlo, svg.linear(t[0], t[1], b[0], b[1], [[0, shade(GLASS, -0.25)], [0.55, GLASS], [1, mix(GLASS, look.sky, 0.35)]]), `stroke="${TRIM}" stroke-width="14" stroke-linejoin="round"`);
      const clip = svg.clip(pathD(dlo));
      const xs = spec.dlo.map((p) => p[0]);
      const mid = (Math.min(...xs) + Math.max(...xs)) / 2;
      svg.poly(pr([[mid - 350, P.roof], [mid - 150, P.roof], [mid - 600, spec.belt], [mid - 800, spec.belt]], -3), "#ffffff", `opacity="0.13" clip-path="${clip}"`);
      svg.poly(pr([[mid + 500, P.roof], [mid + 560, P.roof], [mid + 160, spec.belt], [mid + 100, spec.belt]], -3), "#ffffff", `opacity="0.1" clip-path="${clip}"`);
      for (const [x, w, fin] of spec.pillars) {
        svg.poly(pr([[x - w / 2 + 50, P.roof], [x + w / 2 + 50, P.roof], [x + w / 2, spec.belt], [x - w / 2, spec.belt]], -2), fin === "trim" ? TRIM : shade(look.paint, 0.05), `clip-path="${clip}"`);
      }
    }
    const line = shade(look.paint, -0.38);
    for (const x of spec.doors) {
      let y0 = spec.sill + 25;
      for (const cx of axles) {
        const ra = spec.wheelR + 60;
        if (Math.abs(x - cx) < ra) y0 = Math.max(y0, spec.wheelR + Math.sqrt(ra * ra - (x - cx) ** 2));
      }
      const yTop = spec.dlo.length && x > spec.dlo[0][0] - 20 && x < spec.dlo[spec.dlo.length - 1][0] ? spec.belt - 5 : spec.belt;
      svg.line(pr([[x, y0], [x, yTop]]), line, 7);
    }
    svg.line(pr([[P.pts[0][0] + 250, spec.belt - 30], [P.pts[P.pts.length - 1][0] - 200, spec.belt - 30]]), shade(look.paint, 0.35), 10, 'opacity="0.55"');
    if (spec.rail) svg.line(pr([[spec.rail[0], spec.rail[2]], [spec.rail[1], spec.rail[2]]]), line, 10);
    for (const x of spec.handles) svg.poly(pr([[x - 150, spec.belt - 125], [x, spec.belt - 125], [x, spec.belt - 80], [x - 150, spec.belt - 80]]), shade(look.paint, -0.2), `stroke="${line}" stroke-width="4"`);
    // Lamps seen from the side.
    const f = spec.front.lampY;
    const fx = (y: number) => contourX(P.pts, y, true);
    svg.poly(pr([[fx(f[1]) + 8, f[1]], [fx(f[1]) + 420, f[1] + 15], [fx(f[0]) + 260, f[0] + 30], [fx(f[0]) + 8, f[0]]]), "#dfe6ea", `stroke="${TRIM}" stroke-width="8"`);
    const r = spec.rear.lampY;
    const rx = (y: number) => (spec.rearFaceX ? spec.rearFaceX : contourX(P.pts, y, false));
    const dep = r[1] - r[0] > 260 ? 110 : 300;
    if (!spec.rearFaceX) svg.poly(pr([[rx(r[1]) - 8, r[1]], [rx(r[1]) - dep, r[1] - 10], [rx(r[0]) - dep * 0.75, r[0] + 10], [rx(r[0]) - 8, r[0]]]), "#b3141c", `stroke="#5a0c10" stroke-width="8"`);
  }
  if (!frontVis) for (const [b, z] of boxes("body")) drawBox(b, z);
  for (const s of nearSides) for (const a of axles) tyre(a, s);

  // Front and rear faces.
  const faceDetail = (front: boolean) => {
    const fr = front ? spec.front : spec.rear;
    const xAt = (y: number) => (front ? contourX(P.pts, y, true) - 4 : (spec.rearFaceX ?? contourX(P.pts, y, false)) + 4);
    const at = (pts: P2[]) => pts.map(([u, y]) => scr([xAt(y) - L2, y, u]));
    const H = spec.width / 2;
    const rounded = (u0: number, u1: number, y0: number, y1: number, r = 40) =>
      at(roundCorners([{ x: u0, y: y0, r }, { x: u1, y: y0, r }, { x: u1, y: y1, r }, { x: u0, y: y1, r }], true, 4));
    if (front) {
      if (fr.grilleY && fr.grilleU) {
        const [g0, g1] = fr.grilleY;
        svg.poly(rounded(-fr.grilleU * H, fr.grilleU * H, g0, g1, 60), dark, `stroke="${TRIM}" stroke-width="10"`);
        for (let y = g0 + 45; y < g1 - 20; y += 55) svg.line(at([[-fr.grilleU * H + 40, y], [fr.grilleU * H - 40, y]]), "#34373c", 10);
      }
      if (fr.intakeY && fr.intakeU) svg.poly(rounded(-fr.intakeU * H, fr.intakeU * H, fr.intakeY[0], fr.intakeY[1], 50), "#202226");
    } else {
      svg.poly(rounded(-0.8 * H, 0.8 * H, spec.sill - 20, spec.sill + 90, 30), TRIM);
      if (spec.cabRearWindow && !spec.rearFaceX) {
        const y0 = spec.belt + 120;
        const y1 = P.roof - 110;
        svg.poly(rounded(-0.62 * P.hw(y0), 0.62 * P.hw(y0), y0, y1, 40), GLASS, `stroke="${TRIM}" stroke-width="12"`);
      }
      if (spec.rearDoors) {
        svg.line(at([[0, spec.sill + 120], [0, P.roof - 60]]), shade(look.paint, -0.4), 8);
        for (const sgn of [-1, 1]) svg.poly(rounded(sgn * 0.1 * H, sgn * 0.78 * H, spec.belt + 180, P.roof - 200, 40), GLASS, `stroke="${TRIM}" stroke-width="10"`);
      }
    }
    for (const sgn of [-1, 1]) {
      const [u0, u1] = fr.lampU;
      const [y0, y1] = fr.lampY;
      const lens = front ? "#e4eaee" : "#b5161f";
      const shape = at([[sgn * u0 * H, y0 + (y1 - y0) * 0.35], [sgn * u0 * H, y1], [sgn * u1 * H, y1 + 10], [sgn * u1 * H, y0]]);
      svg.poly(shape, lens, `stroke="${front ? TRIM : "#5a0c10"}" stroke-width="10" stroke-linejoin="round"`);
      const um = ((u0 + u1) / 2) * H * sgn;
      void um;
      if (front) {
        svg.poly(at([[sgn * (u0 + 0.04) * H, y0 + (y1 - y0) * 0.62], [sgn * (u1 - 0.03) * H, y0 + (y1 - y0) * 0.72], [sgn * (u1 - 0.03) * H, y0 + (y1 - y0) * 0.52], [sgn * (u0 + 0.04) * H, y0 + (y1 - y0) * 0.42]]), "#ffffff");
        svg.poly(at([[sgn * (u0 + 0.12) * H, y0 + 18], [sgn * (u1 - 0.06) * H, y0 + 18], [sgn * (u1 - 0.06) * H, y0 + (y1 - y0) * 0.38], [sgn * (u0 + 0.12) * H, y0 + (y1 - y0) * 0.3]]), "#aab3bb");
      } else svg.poly(at([[sgn * (u0 + 0.06) * H, y1 - 25], [sgn * (u1 - 0.04) * H, y1 - 20], [sgn * (u1 - 0.04) * H, y1 - 45], [sgn * (u0 + 0.06) * H, y1 - 50]]), "#f05a5f");
    }
  };
  if (frontVis) faceDetail(true);
  if (rearVis) faceDetail(false);

  // Mirrors and things standing on top of the body.
  const mirrorX = spec.dlo.length ? spec.dlo[0][0] + 40 : (spec.windscreenOnly?.[0] ?? 1500) + 80;
  for (const s of [1, -1]) {
    if (!sideVis(s) && nearSides.length) continue;
    drawBox({ x: [mirrorX, mirrorX + 110], y: [spec.belt + 10, spec.belt + 120], hz: 65, fill: "paint", layer: "top" }, s * (spec.width / 2 + 40));
  }
  const tops = boxes("top");
  const ws = spec.windscreenOnly;
  const drawWs = () => {
    if (!ws) return;
    const q: P3[] = [
      [ws[0] - L2, ws[1], spec.width * 0.46],
      [ws[2] - L2, ws[3], spec.width * 0.43],
      [ws[2] - L2, ws[3], -spec.width * 0.43],
      [ws[0] - L2, ws[1], -spec.width * 0.46],
    ];
    svg.poly(q.map(scr), mix(GLASS, look.sky, 0.3), `opacity="0.72" stroke="${shade(look.paint, -0.3)}" stroke-width="26" stroke-linejoin="round"`);
  };
  const wsDepth = ws ? depth([(ws[0] + ws[2]) / 2 - L2, ws[3], 0]) : 0;
  let wsDone = false;
  for (const [b, z] of tops) {
    if (!wsDone && depth([(b.x[0] + b.x[1]) / 2 - L2, b.y[1], z]) > wsDepth) {
      drawWs();
      wsDone = true;
    }
    drawBox(b, z);
  }
  if (!wsDone) drawWs();
}

/** Projected bounds of the vehicle (model units, y down) for framing. */
export function carBounds(spec: BodySpec, cam: Camera): { x0: number; x1: number; y0: number; y1: number } {
  const P = prepare(spec);
  const pts: P3[] = [];
  for (const s of [1, -1]) for (const [x, y] of P.side) pts.push([x - spec.length / 2, y, s * (P.hw(y) + (y > spec.belt ? 0 : 90))]);
  for (const a of [spec.frontAxle, spec.frontAxle + spec.wheelbase]) for (const s of [1, -1]) pts.push([a - spec.length / 2, 0, s * spec.width / 2]);
  for (const b of spec.boxes ?? []) {
    for (const x of b.x) for (const y of b.y) for (const s of [1, -1]) pts.push([x - spec.length / 2, y, (b.z ?? 0) + s * b.hz]);
  }
  const q = pts.map((p) => project(p, cam));
  const xs = q.map((p) => p[0]);
  const ys = q.map((p) => p[1]);
  return { x0: Math.min(...xs), x1: Math.max(...xs), y0: -Math.max(...ys), y1: -Math.min(...ys) };
}
