import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { layoutOneLine } from "@/lib/diagram/layout";
import { circuitText, conductorsPerSet, sizeText } from "@/lib/diagram/describe";
import { danglingRecord, emptyRecord, hybrid, large, parseRecord, standAlone } from "./fixtures";
import { expectSoundGeometry, overlaps, pairs, wireCrossings, wiresThroughCallouts } from "./geometry";

describe("one-line layout", () => {
  it("draws the sample systems without crossing wires or wires through callouts", async () => {
    for (const record of [standAlone(), hybrid(), large(), danglingRecord()]) {
      for (const wrap of [true, false]) {
        const layout = await layoutOneLine(record, { wrap });
        expect(wireCrossings(layout), record.name).toEqual([]);
        expect(wiresThroughCallouts(layout), record.name).toEqual([]);
      }
    }
  });

  it("draws every circuit of the stand-alone system as exactly one edge, with no overlapping boxes", async () => {
    const record = standAlone();
    const layout = await layoutOneLine(record);
    expectSoundGeometry(layout, record);
    const tags = layout.nodes.map((n) => n.tag);
    for (const t of ["PV-1", "CC-1", "BUS-1", "BAT-1", "INV-1", "GEN-1", "PNL-1"]) expect(tags).toContain(t);
  });

  it("does the same for the hybrid and the larger system, wrapped or in a single row", async () => {
    for (const record of [hybrid(), standAlone(), large(), danglingRecord()]) {
      expectSoundGeometry(await layoutOneLine(record, { wrap: false }), record);
      expectSoundGeometry(await layoutOneLine(record), record);
    }
  });

  it("runs PV on the left and the AC panel on the right in a single row", async () => {
    const layout = await layoutOneLine(standAlone(), { wrap: false });
    const x = (tag: string) => layout.nodes.find((n) => n.tag === tag)!.x;
    expect(x("PV-1")).toBeLessThan(x("CC-1"));
    expect(x("CC-1")).toBeLessThan(x("BUS-1"));
    expect(x("INV-1")).toBeLessThan(x("PNL-1"));
  });

  it("draws breakers, fuses and disconnects named by a circuit on its wire, not as boxes", async () => {
    const layout = await layoutOneLine(standAlone());
    const tags = layout.nodes.map((n) => n.tag);
    for (const t of ["DC-PV", "CB-CC", "F-BAT", "CB-INV", "DS-GEN"]) expect(tags).not.toContain(t);
    const c3 = layout.edges.find((e) => e.circuitTag === "C-3")!;
    expect(c3.devices).toEqual(["F-BAT"]);
    expect(c3.deviceMarks).toHaveLength(1);
    expect(c3.deviceMarks[0]!.kind).toBe("fuse");
    // The same breaker named as OCPD and as disconnect is one device.
    const c4 = layout.edges.find((e) => e.circuitTag === "C-4")!;
    expect(c4.devices).toEqual(["CB-INV"]);
    // A device mark sits on its wire.
    for (const e of layout.edges) {
      for (const m of e.deviceMarks) {
        const onWire = e.points.some((a, i) => {
          const b = e.points[i + 1];
          if (!b) return false;
          return (
            m.x >= Math.min(a.x, b.x) - 0.01 && m.x <= Math.max(a.x, b.x) + 0.01 &&
            m.y >= Math.min(a.y, b.y) - 0.01 && m.y <= Math.max(a.y, b.y) + 0.01
          );
        });
        expect(onWire, `${m.tag} on ${e.circuitTag}`).toBe(true);
      }
    }
  });

  it("lists equipment on no circuit in a row below the flow", async () => {
    const layout = await layoutOneLine(standAlone());
    const rsd = layout.nodes.find((n) => n.tag === "RSD-1")!;
    expect(rsd.placement).toBe("unconnected");
    const flowBottom = Math.max(...layout.nodes.filter((n) => n.placement === "circuit").map((n) => n.y + n.height));
    expect(rsd.y).toBeGreaterThan(flowBottom);
    // Modules are described inside their array's box rather than drawn again.
    expect(layout.nodes.map((n) => n.tag)).not.toContain("PV-M1");
    expect(layout.nodes.find((n) => n.tag === "PV-1")!.lines.join(" ")).toContain("PV-M1");
  });

  it("draws a PV circuit that names the module from the array built of it", async () => {
    const layout = await layoutOneLine(hybrid());
    const sb = layout.edges.find((e) => e.circuitTag === "S-B")!;
    expect(sb.fromTag).toBe("PV-B");
    expect(layout.nodes.map((n) => n.tag)).not.toContain("PV-M2");
  });

  it("puts size, material, insulation, EGC and raceway in each callout", async () => {
    const layout = await layoutOneLine(standAlone());
    const c1 = layout.edges.find((e) => e.circuitTag === "C-1")!;
    expect(c1.callout).toEqual(["2 #10 AWG Cu PV WIRE 90 °C", "1 #10 EGC", "3/4 in PVC-40, 60 ft"]);
    const c3 = layout.edges.find((e) => e.circuitTag === "C-3")!;
    expect(c3.callout[0]).toBe("2 4/0 AWG Cu THHN 90 °C");
    // 120/240 V single-phase: two lines and a neutral.
    const c6 = layout.edges.find((e) => e.circuitTag === "C-6")!;
    expect(c6.callout[0]).toBe("3 #6 AWG Cu THWN-2 90 °C");
    expect(c6.callout[1]).toBe("1 #10 EGC");
    const ac2 = (await layoutOneLine(hybrid())).edges.find((e) => e.circuitTag === "AC-2")!;
    expect(ac2.callout).toEqual(["3 #6 AWG Al XHHW-2", "1 #8 Al EGC", "1 in PVC-40"]);
    for (const e of layout.edges) {
      expect(e.callout.join(" ")).toMatch(/AWG|kcmil/);
      expect(e.callout.join(" ")).toMatch(/Cu|Al/);
      expect(e.callout.join(" ")).toMatch(/EGC/);
      expect(e.calloutAnchor).toEqual({ x: e.calloutBox.x, y: e.calloutBox.y });
    }
  });

  it("writes sizes as a schedule does", () => {
    expect(sizeText("10")).toBe("#10 AWG");
    expect(sizeText("2/0")).toBe("2/0 AWG");
    expect(sizeText("250")).toBe("250 kcmil");
    expect(sizeText("8", false)).toBe("#8");
  });

  it("counts parallel sets and raceway conductors in the callout", () => {
    const r = standAlone();
    const c = { ...r.circuits[3]!, parallelSets: 2, currentCarryingConductors: 4 };
    const text = circuitText(c, r);
    expect(text.callout[0]).toBe("2 sets of 2 2/0 AWG Cu THHN 90 °C");
    // 4 current-carrying conductors equals 2 sets × 2, so no separate note.
    expect(text.callout[2]).toBe("1-1/4 in EMT, 5 ft");
    expect(conductorsPerSet({ ...c, kind: "ac-branch", fromTag: "X", toTag: "Y" }, r)).toBeUndefined();
  });

  it("flags what a reviewer would return: missing size and EGC, tags the record lacks", async () => {
    const layout = await layoutOneLine(danglingRecord());
    const b1 = layout.edges.find((e) => e.circuitTag === "B-1")!;
    expect(b1.trouble).toEqual(["conductor size not given", "EGC size not given", "F-9 not in the equipment list"]);
    expect(b1.deviceMarks[0]?.trouble).toBe(true);
    const ghost = layout.nodes.find((n) => n.tag === "SUBP-9")!;
    expect(ghost.kind).toBe("unknown");
    expect(ghost.trouble.length).toBeGreaterThan(0);
    expect(layout.edges.find((e) => e.circuitTag === "AC-2")!.trouble).toContain("runs to a tag not in the record");
    // A clean record shows no trouble at all.
    const clean = await layoutOneLine(standAlone());
    expect(clean.edges.flatMap((e) => e.trouble)).toEqual([]);
    expect(clean.nodes.flatMap((n) => n.trouble)).toEqual([]);
  });

  it("gives the same layout for the same record", async () => {
    const a = await layoutOneLine(standAlone());
    const b = await layoutOneLine(standAlone());
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
    const h1 = await layoutOneLine(hybrid());
    const h2 = await layoutOneLine(hybrid());
    expect(h2).toEqual(h1);
  });

  it("lays out an empty record without throwing", async () => {
    const layout = await layoutOneLine(emptyRecord());
    expect(layout.nodes).toEqual([]);
    expect(layout.edges).toEqual([]);
    expect(layout.width).toBeGreaterThan(0);
    expect(layout.height).toBeGreaterThan(0);
  });

  it("lays out equipment with no circuits at all", async () => {
    const r = standAlone();
    r.circuits = [];
    const layout = await layoutOneLine(r);
    expect(layout.edges).toEqual([]);
    expect(layout.nodes.every((n) => n.placement === "unconnected")).toBe(true);
    expect(layout.nodes.map((n) => n.tag)).toContain("PV-1");
    for (const [a, b] of pairs(layout.nodes)) expect(overlaps(a, b)).toBe(false);
  });

  it("keeps every circuit as one edge and boxes apart for generated chains and branches", async () => {
    const kinds = ["charge-controller", "battery", "inverter", "ac-panel", "busbar"] as const;
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.constantFrom(...kinds), { maxLength: 6 }),
        fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 5 }),
        async (chain, extra) => {
          // The array feeds a controller (the schema refuses anything else), then the generated chain.
          const equipment = ["charge-controller" as const, ...chain].map((kind, i) => ({ tag: `E-${i}`, kind }));
          const tags = ["PV-1", ...equipment.map((e) => e.tag)];
          const circuits = tags.slice(1).map((to, i) => ({
            tag: `C-${i}`,
            fromTag: tags[i]!,
            toTag: to,
            kind: i === 0 ? ("pv-output" as const) : ("battery" as const),
            size: "6" as const,
            egcSize: "10" as const,
          }));
          extra.forEach(([a, b], j) => {
            const from = 1 + (a % (tags.length - 1));
            const to = 1 + (b % (tags.length - 1));
            if (from !== to) {
              circuits.push({ tag: `X-${j}`, fromTag: tags[from]!, toTag: tags[to]!, kind: "battery", size: "6", egcSize: "10" });
            }
          });
          const record = parseRecord({
            name: "Generated",
            systemKind: "stand-alone",
            site: { occupancy: "other-building", mounting: "ground" },
            jurisdiction: { name: "Test", necEdition: "2020" },
            equipment: [{ tag: "M-1", kind: "pv-module" }, ...equipment],
            arrays: [{ tag: "PV-1", moduleTag: "M-1", modulesInSeries: 2, stringsInParallel: 1, feedsTag: "E-0" }],
            circuits,
          });
          expectSoundGeometry(await layoutOneLine(record), record);
        },
      ),
      { numRuns: 25, seed: 20261201 },
    );
  });
});
