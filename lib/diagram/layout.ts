/**
 * One-line diagram geometry, computed with ELK's layered algorithm (PV on
 * the left, loads on the right, orthogonal wires). Renderer-neutral: the SVG
 * view, the React view and the PDF sheet all draw from this one result, so
 * the page and the packet show the same drawing.
 *
 * Drawing units are PDF points at 1:1; renderers scale to fit.
 */
import type { ElkExtendedEdge, ElkNode } from "elkjs/lib/elk-api";
import type { Circuit, Equipment, ProjectRecord, PvArray } from "../schemas/project-record";
import {
  arrayLines,
  circuitText,
  deviceRating,
  equipmentLines,
  equipmentTitle,
} from "./describe";
import { TEXT, estimateTextWidth, lineHeight, wrapLine } from "./text";

export type DiagramNodeKind = Equipment["kind"] | "pv-array" | "unknown";
export type DeviceKind = "fuse" | "breaker" | "disconnect" | "other";

export interface Point {
  x: number;
  y: number;
}
export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface OneLineNode extends Box {
  id: string;
  tag: string;
  kind: DiagramNodeKind;
  title: string;
  lines: string[];
  /** Problems a reviewer would trip over (drawn in the signal colour, with a mark and words). */
  trouble: string[];
  /** The engine's fix for each failure, wrapped ("FIX: Use 8 AWG Cu …"), drawn under the trouble lines. */
  remedies: string[];
  /** "circuit": placed by the layered layout; "unconnected": listed in the row below it. */
  placement: "circuit" | "unconnected";
}

export interface DeviceMark extends Point {
  tag: string;
  kind: DeviceKind;
  /** The wire runs vertically at the mark; the symbol is turned to follow it. */
  vertical: boolean;
  trouble: boolean;
}

export interface OneLineEdge {
  id: string;
  circuitTag: string;
  circuitKind: Circuit["kind"];
  fromTag: string;
  toTag: string;
  points: Point[];
  /** Conductor lines: "2 #10 AWG Cu PV WIRE 90 °C", "1 #10 EGC", "3/4 in EMT, 40 ft". */
  callout: string[];
  /** Top-left corner of the callout block. */
  calloutAnchor: Point;
  calloutBox: Box;
  /** Circuit tag and kind, first line of the callout block. */
  heading: string;
  /** OCPD first, then disconnects, as equipment tags. */
  devices: string[];
  /** Per device, "F-1 fuse" then its ratings "  15 A 600 V DC" (indented). */
  deviceLines: string[];
  deviceMarks: DeviceMark[];
  trouble: string[];
  /** The engine's fix for each failure on the conductor or its devices, wrapped, drawn under the trouble lines. */
  remedies: string[];
}

export interface OneLineLayout {
  width: number;
  height: number;
  nodes: OneLineNode[];
  edges: OneLineEdge[];
  /** Heading of the row of equipment that no circuit reaches, when there is any. */
  unconnectedHeading: Point | null;
  legend: Box;
}

const MARGIN = 24;
const NODE_PAD_X = 8;
const NODE_HEADER = 28;
const NODE_PAD_BOTTOM = 6;
const NODE_MIN_WIDTH = 120;
/** Room in the header's right corner for the kind glyph (PV, battery, generator …). */
const NODE_GLYPH_ROOM = 28;
const LABEL_PAD = 4;
/** Horizontal room per device symbol on the wire, and the symbol's half-length. */
export const DEVICE_PITCH = 30;
export const DEVICE_HALF = 9;
export const LEGEND_SIZE = { width: 430, height: 62 } as const;
const ROW_GAP = 24;

const PROTECTIVE_KINDS = new Set(["fuse", "breaker", "disconnect"]);
/** Longest line in a box or a callout before it wraps: keeps free-text notes from stretching the drawing. */
const NODE_LINE_CHARS = 44;
const CALLOUT_LINE_CHARS = 38;

const wrapAll = (lines: string[], max: number, indent = "") => lines.flatMap((l) => wrapLine(l, max, indent));

function nodeSize(title: string, tag: string, lines: string[], trouble: string[], remedies: string[] = []) {
  const widths = [
    Math.max(estimateTextWidth(tag, TEXT.tagSize, true), estimateTextWidth(title, TEXT.titleSize, true)) +
      NODE_GLYPH_ROOM,
    ...lines.map((l) => estimateTextWidth(l, TEXT.bodySize)),
    ...trouble.map((l) => estimateTextWidth(l, TEXT.bodySize) + 14),
    ...remedies.map((l) => estimateTextWidth(l, TEXT.bodySize, true) + 14),
  ];
  const width = Math.ceil(Math.max(NODE_MIN_WIDTH, ...widths) + 2 * NODE_PAD_X);
  const bodyLines = lines.length + trouble.length + remedies.length;
  const height = Math.ceil(NODE_HEADER + Math.max(1, bodyLines) * lineHeight(TEXT.bodySize) + NODE_PAD_BOTTOM);
  return { width, height };
}

/** Node geometry constants the renderers need to place text the way the layout sized it. */
export const NODE_METRICS = { padX: NODE_PAD_X, header: NODE_HEADER } as const;
export const LABEL_METRICS = { pad: LABEL_PAD } as const;

interface NodeSpec {
  id: string;
  tag: string;
  kind: DiagramNodeKind;
  title: string;
  lines: string[];
  trouble: string[];
}

function equipmentNode(e: Equipment): NodeSpec {
  return { id: `n:${e.tag}`, tag: e.tag, kind: e.kind, title: equipmentTitle(e), lines: equipmentLines(e), trouble: [] };
}

function arrayNode(a: PvArray, record: ProjectRecord): NodeSpec {
  const module = record.equipment.find((e) => e.tag === a.moduleTag);
  const trouble: string[] = [];
  if (!module) trouble.push(`module ${a.moduleTag} not in equipment list`);
  else if (module.kind !== "pv-module") trouble.push(`${a.moduleTag} is not a PV module`);
  return { id: `n:${a.tag}`, tag: a.tag, kind: "pv-array", title: "PV ARRAY", lines: arrayLines(a, module), trouble };
}

/**
 * A PV circuit may name the module instead of the array; it is drawn from
 * the array built of that module (the one the circuit names, or the only one).
 */
function resolveEndpoint(tag: string, circuit: Circuit, record: ProjectRecord): string {
  if (record.arrays.some((a) => a.tag === tag)) return tag;
  const eq = record.equipment.find((e) => e.tag === tag);
  if (eq?.kind === "pv-module") {
    const arrays = record.arrays.filter((a) => a.moduleTag === tag);
    const named = arrays.find((a) => a.tag === circuit.arrayTag);
    if (named) return named.tag;
    if (arrays.length === 1 && arrays[0]) return arrays[0].tag;
  }
  return tag;
}

function deviceKindOf(e: Equipment | undefined): DeviceKind {
  if (e && PROTECTIVE_KINDS.has(e.kind)) return e.kind as DeviceKind;
  return "other";
}

/** Tag and kind on one line, ratings on the next, to keep callouts narrow. */
function deviceLines(tag: string, e: Equipment | undefined, role: "ocpd" | "disconnect"): string[] {
  if (!e) return [`${tag} ${role === "ocpd" ? "OCPD" : "disconnect"}`];
  if (e.kind === "fuse" || e.kind === "breaker" || e.kind === "disconnect") {
    const rating = deviceRating(e);
    return rating ? [`${tag} ${e.kind}`, `  ${rating}`] : [`${tag} ${e.kind}`];
  }
  return [`${tag} ${role === "ocpd" ? "OCPD" : "disconnect"} in`, `  ${equipmentTitle(e).toLowerCase()}`];
}

interface EdgeSpec {
  id: string;
  circuit: Circuit;
  from: string;
  to: string;
  heading: string;
  callout: string[];
  trouble: string[];
  remedies: string[];
  devices: { tag: string; kind: DeviceKind; lines: string[]; missing: boolean; failing?: boolean }[];
  labelWidth: number;
  labelHeight: number;
}

function labelSize(heading: string, lines: string[], deviceLines: string[], trouble: string[], deviceCount: number, remedies: string[] = []) {
  const widths = [
    estimateTextWidth(heading, TEXT.calloutSize, true),
    ...lines.map((l) => estimateTextWidth(l, TEXT.calloutSize)),
    ...deviceLines.map((l) => estimateTextWidth(l, TEXT.calloutSize)),
    ...trouble.map((l) => estimateTextWidth(l, TEXT.calloutSize) + 12),
    ...remedies.map((l) => estimateTextWidth(l, TEXT.calloutSize, true) + 12),
    deviceCount * DEVICE_PITCH,
  ];
  const count = 1 + lines.length + deviceLines.length + trouble.length + remedies.length;
  return {
    width: Math.ceil(Math.max(...widths) + 2 * LABEL_PAD),
    height: Math.ceil(count * lineHeight(TEXT.calloutSize) + 2 * LABEL_PAD),
  };
}

const ROOT_OPTIONS: Record<string, string> = {
  "elk.algorithm": "layered",
  "elk.direction": "RIGHT",
  "elk.edgeRouting": "ORTHOGONAL",
  "elk.randomSeed": "1",
  "elk.padding": "[top=0,left=0,bottom=0,right=0]",
  "elk.spacing.nodeNode": "34",
  "elk.spacing.edgeNode": "16",
  "elk.spacing.edgeEdge": "12",
  "elk.spacing.edgeLabel": "3",
  "elk.spacing.componentComponent": "40",
  "elk.layered.spacing.nodeNodeBetweenLayers": "24",
  "elk.layered.spacing.edgeNodeBetweenLayers": "10",
  "elk.layered.spacing.edgeEdgeBetweenLayers": "12",
  "elk.layered.considerModelOrder.strategy": "NODES_AND_EDGES",
  "elk.layered.crossingMinimization.strategy": "LAYER_SWEEP",
  "elk.layered.nodePlacement.strategy": "NETWORK_SIMPLEX",
  "elk.layered.edgeLabels.sideSelection": "SMART_UP",
  "elk.layered.thoroughness": "12",
  "elk.separateConnectedComponents": "true",
};

function pointsOf(edge: ElkExtendedEdge): Point[] {
  const pts: Point[] = [];
  for (const s of edge.sections ?? []) {
    const run = [s.startPoint, ...(s.bendPoints ?? []), s.endPoint];
    for (const p of run) {
      const last = pts[pts.length - 1];
      if (!last || last.x !== p.x || last.y !== p.y) pts.push({ x: p.x, y: p.y });
    }
  }
  return pts;
}

/**
 * Places the device symbols on the wire next to their callout: on the
 * segment nearest the callout block that runs under (or beside) it.
 */
function placeDevices(points: Point[], label: Box, devices: EdgeSpec["devices"]): DeviceMark[] {
  if (devices.length === 0 || points.length < 2) return [];
  const cx = label.x + label.width / 2;
  const cy = label.y + label.height / 2;
  let best: { a: Point; b: Point; dist: number } | undefined;
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    const len = Math.abs(a.x - b.x) + Math.abs(a.y - b.y);
    if (len < 1) continue;
    const horizontal = Math.abs(a.y - b.y) < 0.5;
    const inRange = horizontal
      ? cx >= Math.min(a.x, b.x) && cx <= Math.max(a.x, b.x)
      : cy >= Math.min(a.y, b.y) && cy <= Math.max(a.y, b.y);
    // Prefer a segment that runs past the callout, then the nearest one.
    const gap = horizontal ? Math.abs(a.y - cy) : Math.abs(a.x - cx);
    const dist = (inRange ? 0 : 10000) + gap - len * 0.001;
    if (!best || dist < best.dist) best = { a, b, dist };
  }
  if (!best) return [];
  const { a, b } = best;
  const vertical = Math.abs(a.x - b.x) < 0.5;
  const span = DEVICE_PITCH * (devices.length - 1);
  const lo = (vertical ? Math.min(a.y, b.y) : Math.min(a.x, b.x)) + DEVICE_HALF + 2;
  const hi = (vertical ? Math.max(a.y, b.y) : Math.max(a.x, b.x)) - DEVICE_HALF - 2;
  const want = vertical ? cy : cx;
  let start = want - span / 2;
  if (hi - lo >= span) start = Math.min(Math.max(start, lo), hi - span);
  return devices.map((d, i) => {
    const along = start + i * DEVICE_PITCH;
    return vertical
      ? { tag: d.tag, kind: d.kind, x: a.x, y: along, vertical, trouble: d.missing || Boolean(d.failing) }
      : { tag: d.tag, kind: d.kind, x: along, y: a.y, vertical, trouble: d.missing || Boolean(d.failing) };
  });
}

export interface LayoutOptions {
  /** Width over height of the space the drawing will fill (default: a tabloid sheet's drawing area). */
  aspectRatio?: number;
  /** Width in points of the space on the sheet (default: a tabloid sheet's drawing area). */
  targetWidthPt?: number;
  /** Allow the flow to wrap into rows when that draws it much larger (default true). */
  wrap?: boolean;
  /** Failing check results, so the drawing marks the conductor or device each one concerns. */
  failures?: DiagramFailure[];
}

/** A failing check as the drawing marks it: the circuit, array or equipment tag, the check's id and the engine's remedy. */
export interface DiagramFailure {
  subject: string;
  checkId: string;
  remedy?: string;
}

/** The failing checks of a run, in the shape the drawing marks. */
export function failuresOf(results: { status: string; subject?: string; checkId: string; remedy?: { text: string } }[]): DiagramFailure[] {
  return results
    .filter((r) => r.status === "fail" && r.subject)
    .map((r) => (r.remedy?.text ? { subject: r.subject!, checkId: r.checkId, remedy: r.remedy.text } : { subject: r.subject!, checkId: r.checkId }));
}

/**
 * The remedies of the failures on these tags, each once (two checks failing on one conductor often share a fix),
 * wrapped to the block's width: printed under the FAIL marks so the reviewer sees the fix where the fault is drawn.
 */
function remedyLines(failures: DiagramFailure[], tags: string[], maxChars: number): string[] {
  const texts = [...new Set(failures.filter((f) => tags.includes(f.subject) && f.remedy).map((f) => f.remedy!))];
  return texts.flatMap((t) => wrapLine(`FIX: ${t}`, maxChars, "  "));
}

/** Checks whose failure on a circuit is also a failure of its overcurrent device (the device does not protect the conductor). */
const OCPD_CHECK = /overcurrent|ocpd|ampacity/;

function failLines(failures: DiagramFailure[], tag: string): string[] {
  return failures.filter((f) => f.subject === tag).map((f) => `FAIL ${f.checkId}`);
}

export async function layoutOneLine(record: ProjectRecord, options: LayoutOptions = {}): Promise<OneLineLayout> {
  const aspect = options.aspectRatio ?? 1.6;
  const targetWidth = options.targetWidthPt ?? 1150;
  const equipment = record.equipment ?? [];
  const arrays = record.arrays ?? [];
  const circuits = record.circuits ?? [];
  const failures = options.failures ?? [];
  const byTag = new Map<string, Equipment>();
  for (const e of equipment) if (!byTag.has(e.tag)) byTag.set(e.tag, e);

  // Edges first: they decide which tags are drawn as boxes in the flow.
  const endpointTags = new Set<string>();
  const protectiveUse = new Set<string>();
  const edgeSpecs: EdgeSpec[] = circuits.map((c, i) => {
    const from = resolveEndpoint(c.fromTag, c, record);
    const to = resolveEndpoint(c.toTag, c, record);
    endpointTags.add(from);
    endpointTags.add(to);
    const raw = circuitText(c, record);
    const text = { ...raw, callout: wrapAll(raw.callout, CALLOUT_LINE_CHARS, "  "), trouble: wrapAll(raw.trouble, CALLOUT_LINE_CHARS - 2) };
    const devTags: { tag: string; role: "ocpd" | "disconnect" }[] = [];
    if (c.ocpdTag) devTags.push({ tag: c.ocpdTag, role: "ocpd" });
    for (const t of c.disconnectTags ?? []) {
      if (!devTags.some((d) => d.tag === t)) devTags.push({ tag: t, role: "disconnect" });
    }
    const circuitFails = failures.filter((f) => f.subject === c.tag);
    const devices = devTags.map(({ tag, role }) => {
      protectiveUse.add(tag);
      const e = byTag.get(tag);
      const failing = failures.some((f) => f.subject === tag) || (role === "ocpd" && circuitFails.some((f) => OCPD_CHECK.test(f.checkId)));
      return { tag, kind: deviceKindOf(e), lines: deviceLines(tag, e, role), missing: !e, failing };
    });
    const trouble = [...text.trouble, ...circuitFails.map((f) => `FAIL ${f.checkId}`)];
    for (const d of devices) trouble.push(...failLines(failures, d.tag).map((l) => `${d.tag} ${l}`));
    for (const d of devices) if (d.missing) trouble.push(`${d.tag} not in the equipment list`);
    const remedies = remedyLines(failures, [c.tag, ...devices.map((d) => d.tag)], CALLOUT_LINE_CHARS);
    const size = labelSize(
      text.heading,
      text.callout,
      devices.flatMap((d) => d.lines),
      trouble,
      devices.length,
      remedies,
    );
    return {
      id: `e:${i}:${c.tag}`,
      circuit: c,
      from,
      to,
      heading: text.heading,
      callout: text.callout,
      trouble,
      remedies,
      devices,
      labelWidth: size.width,
      labelHeight: size.height,
    };
  });

  // Boxes in the flow, in record order: arrays, equipment, then tags the record lacks.
  const flowSpecs: NodeSpec[] = [];
  const placed = new Set<string>();
  for (const a of arrays) {
    if (endpointTags.has(a.tag) && !placed.has(a.tag)) {
      flowSpecs.push(arrayNode(a, record));
      placed.add(a.tag);
    }
  }
  for (const e of equipment) {
    if (endpointTags.has(e.tag) && !placed.has(e.tag)) {
      flowSpecs.push(equipmentNode(e));
      placed.add(e.tag);
    }
  }
  for (const spec of edgeSpecs) {
    for (const tag of [spec.from, spec.to]) {
      if (!placed.has(tag)) {
        flowSpecs.push({
          id: `n:${tag}`,
          tag,
          kind: "unknown",
          title: "NOT IN RECORD",
          lines: [],
          trouble: ["not in the equipment list"],
        });
        placed.add(tag);
      }
    }
  }
  for (const spec of edgeSpecs) {
    const fromNode = flowSpecs.find((n) => n.tag === spec.from);
    const toNode = flowSpecs.find((n) => n.tag === spec.to);
    if (fromNode?.kind === "unknown" || toNode?.kind === "unknown") {
      spec.trouble.push("runs to a tag not in the record");
      const size = labelSize(spec.heading, spec.callout, spec.devices.flatMap((d) => d.lines), spec.trouble, spec.devices.length, spec.remedies);
      spec.labelWidth = size.width;
      spec.labelHeight = size.height;
    }
  }

  // Everything no circuit reaches: listed below the flow so nothing in the record goes unshown.
  const modulesInArrays = new Set(arrays.map((a) => a.moduleTag));
  const looseSpecs: NodeSpec[] = [];
  for (const a of arrays) {
    if (!placed.has(a.tag)) {
      looseSpecs.push(arrayNode(a, record));
      placed.add(a.tag);
    }
  }
  for (const e of equipment) {
    if (placed.has(e.tag) || protectiveUse.has(e.tag)) continue;
    if (e.kind === "pv-module" && modulesInArrays.has(e.tag)) continue;
    looseSpecs.push(equipmentNode(e));
    placed.add(e.tag);
  }

  const sized = (spec: NodeSpec) => {
    const trouble = [...spec.trouble, ...failLines(failures, spec.tag)];
    const s = { ...spec, lines: wrapAll(spec.lines, NODE_LINE_CHARS), trouble: wrapAll(trouble, NODE_LINE_CHARS - 2), remedies: remedyLines(failures, [spec.tag], NODE_LINE_CHARS - 2) };
    return { ...s, ...nodeSize(s.title, s.tag, s.lines, s.trouble, s.remedies) };
  };
  const flowNodes = flowSpecs.map(sized);
  const looseNodes = looseSpecs.map(sized);

  const graph: ElkNode = {
    id: "root",
    layoutOptions: ROOT_OPTIONS,
    children: flowNodes.map((n) => ({
      id: n.id,
      width: n.width,
      height: n.height,
      layoutOptions: (n.kind === "pv-array" ? { "elk.layered.layering.layerConstraint": "FIRST" } : {}) as Record<string, string>,
    })),
    edges: edgeSpecs.map((s) => ({
      id: s.id,
      sources: [`n:${s.from}`],
      targets: [`n:${s.to}`],
      labels: [
        {
          id: `${s.id}:label`,
          text: s.heading,
          width: s.labelWidth,
          height: s.labelHeight,
          layoutOptions: { "elk.edgeLabels.placement": "CENTER" },
        },
      ],
    })),
  };

  // Loaded on first use: ELK is most of a megabyte of script, and the editor page should not wait for it to be interactive.
  const { default: ELK } = await import("elkjs/lib/elk.bundled.js");
  const elk = new ELK();
  let result: ElkNode = { ...graph, width: 0, height: 0 };
  if (flowNodes.length > 0) {
    // A long chain drawn in one row shrinks to unreadable lettering on a sheet;
    // wrapped into rows it reads larger but with wires that turn back. Keep the
    // single row while it prints at 80 % or more (7.5 pt callouts stay at 6 pt),
    // and otherwise wrap when that gains a clear fifth in scale.
    const straight = await elk.layout(structuredClone(graph));
    result = straight;
    const straightScale = Math.min(targetWidth / (straight.width ?? 1), targetWidth / aspect / (straight.height ?? 1));
    if (options.wrap !== false && straightScale < 0.8) {
      const wrapped = await elk.layout({
        ...structuredClone(graph),
        layoutOptions: {
          ...ROOT_OPTIONS,
          "elk.layered.wrapping.strategy": "MULTI_EDGE",
          "elk.aspectRatio": String(aspect),
        },
      });
      const fit = (g: ElkNode) => Math.min(aspect / (g.width ?? 1), 1 / (g.height ?? 1));
      if (fit(wrapped) > 1.2 * fit(straight)) result = wrapped;
    }
  }

  const nodes: OneLineNode[] = [];
  const positions = new Map((result.children ?? []).map((c) => [c.id, c]));
  for (const n of flowNodes) {
    const p = positions.get(n.id);
    nodes.push({
      id: n.id,
      tag: n.tag,
      kind: n.kind,
      title: n.title,
      lines: n.lines,
      trouble: n.trouble,
      remedies: n.remedies,
      placement: "circuit",
      x: MARGIN + (p?.x ?? 0),
      y: MARGIN + (p?.y ?? 0),
      width: n.width,
      height: n.height,
    });
  }

  const resultEdges = new Map((result.edges ?? []).map((e) => [e.id, e]));
  let flowRight = MARGIN + (result.width ?? 0);
  let flowBottom = MARGIN + (result.height ?? 0);
  const edges: OneLineEdge[] = edgeSpecs.map((s) => {
    const re = resultEdges.get(s.id);
    const points = (re ? pointsOf(re) : []).map((p) => ({ x: p.x + MARGIN, y: p.y + MARGIN }));
    const lab = re?.labels?.[0];
    const calloutBox: Box = {
      x: MARGIN + (lab?.x ?? 0),
      y: MARGIN + (lab?.y ?? 0),
      width: s.labelWidth,
      height: s.labelHeight,
    };
    for (const p of points) {
      flowRight = Math.max(flowRight, p.x);
      flowBottom = Math.max(flowBottom, p.y);
    }
    flowRight = Math.max(flowRight, calloutBox.x + calloutBox.width);
    flowBottom = Math.max(flowBottom, calloutBox.y + calloutBox.height);
    return {
      id: s.id,
      circuitTag: s.circuit.tag,
      circuitKind: s.circuit.kind,
      fromTag: s.from,
      toTag: s.to,
      points,
      callout: s.callout,
      calloutAnchor: { x: calloutBox.x, y: calloutBox.y },
      calloutBox,
      heading: s.heading,
      devices: s.devices.map((d) => d.tag),
      deviceLines: s.devices.flatMap((d) => d.lines),
      deviceMarks: placeDevices(points, calloutBox, s.devices),
      trouble: s.trouble,
      remedies: s.remedies,
    };
  });

  // Row(s) of unconnected equipment, wrapped at the flow's width.
  const rowWidth = Math.max(flowRight - MARGIN, 640);
  let y = flowNodes.length > 0 ? flowBottom + ROW_GAP * 1.5 : MARGIN;
  let unconnectedHeading: Point | null = null;
  let right = flowRight;
  if (looseNodes.length > 0) {
    unconnectedHeading = { x: MARGIN, y };
    y += 14;
    let x = MARGIN;
    let rowHeight = 0;
    for (const n of looseNodes) {
      if (x > MARGIN && x + n.width > MARGIN + rowWidth) {
        x = MARGIN;
        y += rowHeight + ROW_GAP;
        rowHeight = 0;
      }
      nodes.push({
        id: n.id,
        tag: n.tag,
        kind: n.kind,
        title: n.title,
        lines: n.lines,
        trouble: n.trouble,
        remedies: n.remedies,
        placement: "unconnected",
        x,
        y,
        width: n.width,
        height: n.height,
      });
      right = Math.max(right, x + n.width);
      x += n.width + ROW_GAP;
      rowHeight = Math.max(rowHeight, n.height);
    }
    y += rowHeight;
  }
  // The legend sits at the foot, or beside the unconnected row when there is room.
  const lastRow = nodes.filter((n) => n.placement === "unconnected");
  const lastRight = lastRow.length > 0 ? Math.max(...lastRow.map((n) => n.x + n.width)) : MARGIN;
  const lastTop = lastRow.length > 0 ? Math.max(...lastRow.map((n) => n.y)) : y;
  const besideX = lastRight + ROW_GAP * 2;
  const fitsBeside = lastRow.length > 0 && besideX + LEGEND_SIZE.width <= Math.max(right, MARGIN + rowWidth);
  const legend: Box = {
    x: fitsBeside ? Math.max(besideX, right - LEGEND_SIZE.width) : MARGIN,
    y: fitsBeside ? lastTop : y + ROW_GAP,
    width: LEGEND_SIZE.width,
    height: LEGEND_SIZE.height,
  };
  right = Math.max(right, legend.x + legend.width);
  return {
    width: Math.ceil(right + MARGIN),
    height: Math.ceil(Math.max(y, legend.y + legend.height) + MARGIN),
    nodes,
    edges,
    unconnectedHeading,
    legend,
  };
}
