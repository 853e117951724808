/**
 * The one-line drawing as a flat list of primitives (rectangles, paths,
 * text), grouped per box and per circuit. The SVG string, the React view
 * and the PDF sheet each translate the same scene, so they cannot drift.
 *
 * Coordinates are layout units with y pointing down (as in SVG).
 */
import type { DeviceKind, DeviceMark, OneLineEdge, OneLineLayout, OneLineNode, Point } from "./layout";
import { DEVICE_HALF, LABEL_METRICS, NODE_METRICS } from "./layout";
import { TEXT, lineHeight } from "./text";

/** Monochrome drafting palette; "trouble" is the one signal colour, used only for faults. */
export type Ink = "ink" | "muted" | "trouble" | "paper" | "band";

export const PALETTE: Record<Ink, string> = {
  ink: "#1c2230",
  muted: "#4a5262",
  trouble: "#b3261e",
  paper: "#ffffff",
  band: "#eef0f2",
};

export const LINE = {
  box: 0.9,
  wire: 1.1,
  rule: 0.5,
  symbol: 0.9,
} as const;

export type Prim =
  | { type: "rect"; x: number; y: number; width: number; height: number; fill?: Ink; stroke?: Ink; lineWidth?: number; dash?: number[] }
  | { type: "path"; d: string; fill?: Ink; stroke?: Ink; lineWidth?: number; dash?: number[] }
  | {
      type: "text";
      x: number;
      /** Baseline. */
      y: number;
      text: string;
      size: number;
      weight: "regular" | "bold";
      colour: Ink;
      anchor?: "start" | "middle" | "end";
      /** The room the layout gave this line; a renderer that can measure shrinks to it. */
      maxWidth?: number;
    };

export interface SceneGroup {
  id: string;
  role: "node" | "edge" | "legend" | "note";
  /** Equipment, array or circuit tag a click selects. */
  tag?: string;
  /** Accessible name: what the group is, in words. */
  label: string;
  trouble: boolean;
  prims: Prim[];
}

export interface Scene {
  width: number;
  height: number;
  groups: SceneGroup[];
}

const r2 = (n: number) => Math.round(n * 100) / 100;

/** Turns a symbol drawn for a horizontal wire so it follows a vertical one. */
type Tf = (x: number, y: number) => Point;
const at = (cx: number, cy: number, vertical: boolean): Tf =>
  vertical ? (x, y) => ({ x: cx - y, y: cy + x }) : (x, y) => ({ x: cx + x, y: cy + y });

function pathFrom(tf: Tf, cmds: (string | [number, number])[]): string {
  return cmds
    .map((c) => {
      if (typeof c === "string") return c;
      const p = tf(c[0], c[1]);
      return `${r2(p.x)} ${r2(p.y)}`;
    })
    .join(" ");
}

function circlePath(tf: Tf, x: number, y: number, radius: number): string {
  const a = tf(x - radius, y);
  const b = tf(x + radius, y);
  return `M ${r2(a.x)} ${r2(a.y)} A ${radius} ${radius} 0 1 0 ${r2(b.x)} ${r2(b.y)} A ${radius} ${radius} 0 1 0 ${r2(a.x)} ${r2(a.y)}`;
}

/** Drafting symbols for devices on a wire, centred on (cx, cy). */
export function deviceSymbol(kind: DeviceKind, cx: number, cy: number, vertical: boolean, colour: Ink): Prim[] {
  const tf = at(cx, cy, vertical);
  const h = DEVICE_HALF;
  const mask = (halfLen: number, halfWidth: number): Prim => {
    const a = tf(-halfLen, -halfWidth);
    const b = tf(halfLen, halfWidth);
    return {
      type: "rect",
      x: Math.min(a.x, b.x),
      y: Math.min(a.y, b.y),
      width: Math.abs(a.x - b.x),
      height: Math.abs(a.y - b.y),
      fill: "paper",
    };
  };
  const stroke = { stroke: colour, lineWidth: LINE.symbol } as const;
  switch (kind) {
    case "fuse":
      return [
        mask(7, 3.5),
        { type: "path", d: pathFrom(tf, ["M", [-7, -3], "L", [7, -3], "L", [7, 3], "L", [-7, 3], "Z"]), fill: "paper", ...stroke },
        { type: "path", d: pathFrom(tf, ["M", [-h, 0], "L", [h, 0]]), ...stroke },
      ];
    case "breaker":
      return [
        mask(6, 1.5),
        { type: "path", d: pathFrom(tf, ["M", [-h, 0], "L", [-6, 0], "M", [6, 0], "L", [h, 0]]), ...stroke },
        { type: "path", d: `${pathFrom(tf, ["M", [-6, 0]])} A 6 6 0 0 1 ${pathFrom(tf, [[6, 0]])}`, ...stroke },
        { type: "path", d: circlePath(tf, -6, 0, 1.2), fill: "paper", ...stroke },
        { type: "path", d: circlePath(tf, 6, 0, 1.2), fill: "paper", ...stroke },
      ];
    case "disconnect":
      return [
        mask(6, 1.5),
        { type: "path", d: pathFrom(tf, ["M", [-h, 0], "L", [-5, 0], "M", [5, 0], "L", [h, 0], "M", [-5, 0], "L", [5, -6]]), ...stroke },
        { type: "path", d: circlePath(tf, -5, 0, 1.2), fill: "paper", ...stroke },
        { type: "path", d: circlePath(tf, 5, 0, 1.2), fill: "paper", ...stroke },
      ];
    case "other":
      return [
        { type: "path", d: pathFrom(tf, ["M", [-4, -4], "L", [4, -4], "L", [4, 4], "L", [-4, 4], "Z"]), fill: "paper", ...stroke },
        { type: "path", d: pathFrom(tf, ["M", [-4, 4], "L", [4, -4]]), ...stroke },
      ];
  }
}

/** A small triangle with a bar: the shape that goes with every fault, so it reads in grey-scale too. */
export function troubleMark(x: number, y: number): Prim[] {
  return [
    { type: "path", d: `M ${r2(x)} ${r2(y - 7)} L ${r2(x + 4.5)} ${r2(y + 1)} L ${r2(x - 4.5)} ${r2(y + 1)} Z`, fill: "trouble" },
    { type: "path", d: `M ${r2(x)} ${r2(y - 4.6)} L ${r2(x)} ${r2(y - 1.9)}`, stroke: "paper", lineWidth: 1 },
  ];
}

/** Glyph in a box's header corner, so the kind reads at a glance (x, y: top-left of a 20 × 14 cell). */
function kindGlyph(kind: OneLineNode["kind"], x: number, y: number): Prim[] {
  const s = { stroke: "muted" as Ink, lineWidth: 0.7 };
  const p = (cmds: string): Prim => ({ type: "path", d: cmds, ...s });
  const X = (n: number) => r2(x + n);
  const Y = (n: number) => r2(y + n);
  switch (kind) {
    case "pv-array":
    case "pv-module":
      return [
        p(`M ${X(0)} ${Y(0)} L ${X(20)} ${Y(0)} L ${X(20)} ${Y(14)} L ${X(0)} ${Y(14)} Z`),
        p(`M ${X(6.67)} ${Y(0)} L ${X(6.67)} ${Y(14)} M ${X(13.33)} ${Y(0)} L ${X(13.33)} ${Y(14)} M ${X(0)} ${Y(7)} L ${X(20)} ${Y(7)}`),
      ];
    case "battery":
      return [
        p(`M ${X(0)} ${Y(7)} L ${X(7)} ${Y(7)} M ${X(13)} ${Y(7)} L ${X(20)} ${Y(7)}`),
        p(`M ${X(7)} ${Y(0)} L ${X(7)} ${Y(14)} M ${X(10)} ${Y(3.5)} L ${X(10)} ${Y(10.5)} M ${X(13)} ${Y(0)} L ${X(13)} ${Y(14)}`),
      ];
    case "generator":
      return [
        p(`M ${X(3)} ${Y(7)} A 7 7 0 1 0 ${X(17)} ${Y(7)} A 7 7 0 1 0 ${X(3)} ${Y(7)}`),
        { type: "text", x: x + 10, y: y + 10, text: "G", size: 8, weight: "bold", colour: "ink", anchor: "middle" },
      ];
    case "inverter":
    case "inverter-charger":
    case "hybrid-inverter":
    case "charge-controller":
      return [
        p(`M ${X(0)} ${Y(0)} L ${X(20)} ${Y(0)} L ${X(20)} ${Y(14)} L ${X(0)} ${Y(14)} Z M ${X(0)} ${Y(14)} L ${X(20)} ${Y(0)}`),
        // DC (bars) in the upper left; AC (wave) or DC again in the lower right.
        p(`M ${X(2.5)} ${Y(3.5)} L ${X(8.5)} ${Y(3.5)} M ${X(2.5)} ${Y(5.5)} L ${X(8.5)} ${Y(5.5)}`),
        kind === "charge-controller"
          ? p(`M ${X(11.5)} ${Y(9.5)} L ${X(17.5)} ${Y(9.5)} M ${X(11.5)} ${Y(11.5)} L ${X(17.5)} ${Y(11.5)}`)
          : p(`M ${X(11.5)} ${Y(10.5)} Q ${X(13)} ${Y(7.5)} ${X(14.5)} ${Y(10.5)} Q ${X(16)} ${Y(13.5)} ${X(17.5)} ${Y(10.5)}`),
      ];
    case "ac-panel":
    case "busbar":
      return [
        p(`M ${X(0)} ${Y(0)} L ${X(20)} ${Y(0)} L ${X(20)} ${Y(14)} L ${X(0)} ${Y(14)} Z`),
        p(`M ${X(10)} ${Y(2)} L ${X(10)} ${Y(12)} M ${X(4)} ${Y(5)} L ${X(16)} ${Y(5)} M ${X(4)} ${Y(9)} L ${X(16)} ${Y(9)}`),
      ];
    case "fuse":
      return deviceSymbol("fuse", x + 10, y + 7, false, "muted");
    case "breaker":
      return deviceSymbol("breaker", x + 10, y + 9, false, "muted");
    case "disconnect":
      return deviceSymbol("disconnect", x + 10, y + 9, false, "muted");
    case "rapid-shutdown":
      return [
        p(`M ${X(0)} ${Y(0)} L ${X(20)} ${Y(0)} L ${X(20)} ${Y(14)} L ${X(0)} ${Y(14)} Z`),
        { type: "text", x: x + 10, y: y + 10, text: "RSD", size: TEXT.markSize, weight: "bold", colour: "ink", anchor: "middle" },
      ];
    case "unknown":
      return [];
  }
}

function nodeGroup(n: OneLineNode): SceneGroup {
  const trouble = n.trouble.length > 0;
  const { padX, header } = NODE_METRICS;
  const prims: Prim[] = [
    { type: "rect", x: n.x, y: n.y, width: n.width, height: n.height, fill: "paper", stroke: trouble ? "trouble" : "ink", lineWidth: LINE.box, ...(n.kind === "unknown" ? { dash: [4, 2] } : {}) },
    { type: "rect", x: n.x + LINE.box / 2, y: n.y + LINE.box / 2, width: n.width - LINE.box, height: header - LINE.box / 2, fill: "band" },
    { type: "path", d: `M ${r2(n.x)} ${r2(n.y + header)} L ${r2(n.x + n.width)} ${r2(n.y + header)}`, stroke: "ink", lineWidth: LINE.rule },
    { type: "text", x: n.x + padX, y: n.y + 13, text: n.tag, size: TEXT.tagSize, weight: "bold", colour: trouble ? "trouble" : "ink", maxWidth: n.width - 2 * padX - 24 },
    { type: "text", x: n.x + padX, y: n.y + 23.5, text: n.title, size: TEXT.titleSize, weight: "bold", colour: "ink", maxWidth: n.width - 2 * padX - 24 },
    ...kindGlyph(n.kind, n.x + n.width - padX - 20, n.y + 7),
  ];
  let y = n.y + header + TEXT.bodySize + 2;
  for (const line of n.lines) {
    prims.push({ type: "text", x: n.x + padX, y, text: line, size: TEXT.bodySize, weight: "regular", colour: "ink", maxWidth: n.width - 2 * padX });
    y += lineHeight(TEXT.bodySize);
  }
  for (const line of n.trouble) {
    prims.push(...troubleMark(n.x + padX + 4.5, y));
    prims.push({ type: "text", x: n.x + padX + 12, y, text: line, size: TEXT.bodySize, weight: "regular", colour: "trouble", maxWidth: n.width - 2 * padX - 12 });
    y += lineHeight(TEXT.bodySize);
  }
  // The fix in bold black: it must read on a monochrome counter copy as well as the fault does in red.
  for (const line of n.remedies) {
    prims.push({ type: "text", x: n.x + padX + 12, y, text: line, size: TEXT.bodySize, weight: "bold", colour: "ink", maxWidth: n.width - 2 * padX - 12 });
    y += lineHeight(TEXT.bodySize);
  }
  const words = [n.tag, n.title.toLowerCase(), ...n.lines, ...n.trouble.map((t) => `problem: ${t}`), ...n.remedies];
  return { id: n.id, role: "node", tag: n.tag, label: words.join("; "), trouble, prims };
}

function polyline(points: Point[]): string {
  return points.map((p, i) => `${i === 0 ? "M" : "L"} ${r2(p.x)} ${r2(p.y)}`).join(" ");
}

function edgeGroup(e: OneLineEdge): SceneGroup {
  const trouble = e.trouble.length > 0;
  const prims: Prim[] = [];
  if (e.points.length >= 2) {
    prims.push({ type: "path", d: polyline(e.points), stroke: trouble ? "trouble" : "ink", lineWidth: LINE.wire });
  }
  const b = e.calloutBox;
  const pad = LABEL_METRICS.pad;
  const inner = b.width - 2 * pad;
  let y = b.y + pad + TEXT.calloutSize;
  const step = lineHeight(TEXT.calloutSize);
  prims.push({ type: "text", x: b.x + pad, y, text: e.heading, size: TEXT.calloutSize, weight: "bold", colour: "ink", maxWidth: inner });
  y += step;
  for (const line of e.callout) {
    prims.push({ type: "text", x: b.x + pad, y, text: line, size: TEXT.calloutSize, weight: "regular", colour: "ink", maxWidth: inner });
    y += step;
  }
  for (const line of e.deviceLines) {
    prims.push({ type: "text", x: b.x + pad, y, text: line, size: TEXT.calloutSize, weight: "regular", colour: "ink", maxWidth: inner });
    y += step;
  }
  for (const line of e.trouble) {
    prims.push(...troubleMark(b.x + pad + 4.5, y));
    prims.push({ type: "text", x: b.x + pad + 12, y, text: line, size: TEXT.calloutSize, weight: "regular", colour: "trouble", maxWidth: inner - 12 });
    y += step;
  }
  for (const line of e.remedies) {
    prims.push({ type: "text", x: b.x + pad + 12, y, text: line, size: TEXT.calloutSize, weight: "bold", colour: "ink", maxWidth: inner - 12 });
    y += step;
  }
  for (const m of e.deviceMarks) prims.push(...deviceMarkPrims(m, e.deviceMarks.length > 1));
  const words = [
    `circuit ${e.heading}`,
    `from ${e.fromTag} to ${e.toTag}`,
    ...e.callout,
    ...e.deviceLines,
    ...e.trouble.map((t) => `problem: ${t}`),
    ...e.remedies,
  ];
  return { id: e.id, role: "edge", tag: e.circuitTag, label: words.join("; "), trouble, prims };
}

function deviceMarkPrims(m: DeviceMark, withTag: boolean): Prim[] {
  const prims = deviceSymbol(m.kind, m.x, m.y, m.vertical, m.trouble ? "trouble" : "ink");
  if (withTag) {
    prims.push(
      m.vertical
        ? { type: "text", x: m.x + 10, y: m.y + 2.5, text: m.tag, size: TEXT.markSize, weight: "regular", colour: "ink" }
        : { type: "text", x: m.x, y: m.y + 11, text: m.tag, size: TEXT.markSize, weight: "regular", colour: "ink", anchor: "middle" },
    );
  }
  return prims;
}

function legendGroup(layout: OneLineLayout): SceneGroup {
  const b = layout.legend;
  const prims: Prim[] = [
    { type: "rect", x: b.x, y: b.y, width: b.width, height: b.height, fill: "paper", stroke: "ink", lineWidth: LINE.rule },
    { type: "text", x: b.x + 6, y: b.y + 11, text: "LEGEND", size: TEXT.titleSize, weight: "bold", colour: "ink" },
  ];
  const items: { kind: DeviceKind; text: string }[] = [
    { kind: "fuse", text: "fuse" },
    { kind: "breaker", text: "circuit breaker" },
    { kind: "disconnect", text: "disconnect" },
    { kind: "other", text: "built into equipment" },
  ];
  let x = b.x + 18;
  const rowY = b.y + 24;
  for (const it of items) {
    prims.push({ type: "path", d: `M ${r2(x - 12)} ${rowY} L ${r2(x + 12)} ${rowY}`, stroke: "ink", lineWidth: LINE.wire });
    prims.push(...deviceSymbol(it.kind, x, rowY, false, "ink"));
    prims.push({ type: "text", x: x + 16, y: rowY + 2.5, text: it.text, size: TEXT.calloutSize, weight: "regular", colour: "ink" });
    x += 16 + it.text.length * TEXT.calloutSize * 0.62 + 30;
  }
  prims.push(...troubleMark(b.x + 10.5, b.y + 41.5));
  prims.push({ type: "text", x: b.x + 18, y: b.y + 41, text: "needs attention before the set is sent", size: TEXT.calloutSize, weight: "regular", colour: "trouble" });
  prims.push({
    type: "text",
    x: b.x + 6,
    y: b.y + 54,
    text: "Callout: conductors, size, material, insulation, rating; EGC; raceway, one-way length.",
    size: TEXT.calloutSize,
    weight: "regular",
    colour: "ink",
    maxWidth: b.width - 12,
  });
  return { id: "legend", role: "legend", label: "Legend of the one-line diagram symbols", trouble: false, prims };
}

export function buildScene(layout: OneLineLayout): Scene {
  const groups: SceneGroup[] = [];
  if (layout.nodes.length === 0) {
    groups.push({
      id: "empty",
      role: "note",
      label: "No equipment or circuits entered yet",
      trouble: false,
      prims: [{ type: "text", x: 24, y: 32, text: "No equipment or circuits entered yet.", size: TEXT.bodySize, weight: "regular", colour: "ink" }],
    });
  }
  if (layout.unconnectedHeading) {
    groups.push({
      id: "unconnected",
      role: "note",
      label: "Equipment on no drawn circuit",
      trouble: false,
      prims: [
        { type: "text", x: layout.unconnectedHeading.x, y: layout.unconnectedHeading.y + 7, text: "EQUIPMENT ON NO DRAWN CIRCUIT", size: TEXT.titleSize, weight: "bold", colour: "ink" },
      ],
    });
  }
  // Wires under callouts under boxes: a box edge must never be hidden by a label mask.
  for (const e of layout.edges) groups.push(edgeGroup(e));
  for (const n of layout.nodes) groups.push(nodeGroup(n));
  groups.push(legendGroup(layout));
  return { width: layout.width, height: layout.height, groups };
}
