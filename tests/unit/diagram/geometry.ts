/** Geometry checks shared by the one-line diagram tests. */
import { expect } from "vitest";
import type { Box, OneLineLayout, Point } from "@/lib/diagram/layout";
import type { ProjectRecord } from "@/lib/schemas/project-record";

export function overlaps(a: Box, b: Box, gap = 0): boolean {
  return a.x < b.x + b.width + gap && b.x < a.x + a.width + gap && a.y < b.y + b.height + gap && b.y < a.y + a.height + gap;
}

export function pairs<T>(items: T[]): [T, T][] {
  const out: [T, T][] = [];
  for (let i = 0; i < items.length; i++) for (let j = i + 1; j < items.length; j++) out.push([items[i]!, items[j]!]);
  return out;
}

export function expectSoundGeometry(layout: OneLineLayout, record: ProjectRecord) {
  // Every circuit is drawn once, between the boxes it names.
  expect(layout.edges).toHaveLength(record.circuits.length);
  expect(layout.edges.map((e) => e.circuitTag).sort()).toEqual(record.circuits.map((c) => c.tag).sort());
  const nodeTags = new Set(layout.nodes.map((n) => n.tag));
  for (const e of layout.edges) {
    expect(nodeTags.has(e.fromTag)).toBe(true);
    expect(nodeTags.has(e.toTag)).toBe(true);
    expect(e.points.length).toBeGreaterThanOrEqual(2);
    // Orthogonal routing: each segment is horizontal or vertical.
    for (let i = 0; i + 1 < e.points.length; i++) {
      const a = e.points[i]!;
      const b = e.points[i + 1]!;
      expect(Math.abs(a.x - b.x) < 0.01 || Math.abs(a.y - b.y) < 0.01).toBe(true);
    }
  }
  for (const [a, b] of pairs(layout.nodes)) {
    expect(overlaps(a, b), `${a.tag} overlaps ${b.tag}`).toBe(false);
  }
  for (const e of layout.edges) {
    for (const n of layout.nodes) {
      expect(overlaps(e.calloutBox, n), `callout ${e.circuitTag} overlaps box ${n.tag}`).toBe(false);
    }
  }
  for (const [a, b] of pairs(layout.edges)) {
    expect(overlaps(a.calloutBox, b.calloutBox), `callouts ${a.circuitTag} and ${b.circuitTag} overlap`).toBe(false);
  }
  for (const box of [...layout.nodes, ...layout.edges.map((e) => e.calloutBox), layout.legend]) {
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(layout.width);
    expect(box.y + box.height).toBeLessThanOrEqual(layout.height);
  }
  for (const n of layout.nodes) expect(overlaps(n, layout.legend), `${n.tag} overlaps the legend`).toBe(false);
}

type Seg = { tag: string; a: Point; b: Point };

function segments(layout: OneLineLayout): Seg[] {
  return layout.edges.flatMap((e) => e.points.slice(1).map((b, i) => ({ tag: e.circuitTag, a: e.points[i]!, b })));
}

/** Places where a horizontal run of one circuit passes through a vertical run of another. */
export function wireCrossings(layout: OneLineLayout): string[] {
  const segs = segments(layout);
  const out: string[] = [];
  for (const [s, t] of pairs(segs)) {
    if (s.tag === t.tag) continue;
    const sh = Math.abs(s.a.y - s.b.y) < 0.01;
    const th = Math.abs(t.a.y - t.b.y) < 0.01;
    if (sh === th) continue;
    const h = sh ? s : t;
    const v = sh ? t : s;
    const inH = v.a.x > Math.min(h.a.x, h.b.x) + 0.5 && v.a.x < Math.max(h.a.x, h.b.x) - 0.5;
    const inV = h.a.y > Math.min(v.a.y, v.b.y) + 0.5 && h.a.y < Math.max(v.a.y, v.b.y) - 0.5;
    if (inH && inV) out.push(`${s.tag} crosses ${t.tag}`);
  }
  return out;
}

/** Wires of other circuits running through a callout block. */
export function wiresThroughCallouts(layout: OneLineLayout): string[] {
  const out: string[] = [];
  for (const e of layout.edges) {
    const b = e.calloutBox;
    for (const s of segments(layout)) {
      if (s.tag === e.circuitTag) continue;
      const seg: Box = {
        x: Math.min(s.a.x, s.b.x),
        y: Math.min(s.a.y, s.b.y),
        width: Math.abs(s.a.x - s.b.x),
        height: Math.abs(s.a.y - s.b.y),
      };
      if (overlaps(seg, { x: b.x + 0.5, y: b.y + 0.5, width: b.width - 1, height: b.height - 1 })) {
        out.push(`${s.tag} runs through the callout of ${e.circuitTag}`);
      }
    }
  }
  return out;
}
