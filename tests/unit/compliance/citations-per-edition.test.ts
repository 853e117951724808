/**
 * Citations are exact to the edition: every NEC or IFC reference a demo project's results carry, under each
 * of NEC 2017, 2020 and 2023, is in that edition's reviewed map. IRC and NFPA references follow the
 * residential code the jurisdiction names, and "submittal requirements" the jurisdiction's own list, so
 * they are not edition-bound and not walked here. Section numbers below: from memory (see the map's tags).
 */
import { describe, expect, it } from "vitest";
import { CITATIONS, isMappedCitation } from "@/lib/compliance/tables";
import { NEC_EDITIONS } from "@/lib/schemas/project-record";
import { equipment, exampleJson, result, run, type ExampleName } from "./fixtures";

const DEMOS: ExampleName[] = ["market-stall", "tamarack-hut", "ferncliff-farmhouse"];

describe("citations per edition", () => {
  it.each(NEC_EDITIONS)("every NEC and IFC citation of the demo projects under NEC %s is in the map", (edition) => {
    const unmapped: string[] = [];
    for (const demo of DEMOS) {
      for (const r of run(exampleJson(demo), edition).results) {
        for (const ref of r.codeRefs) {
          if (/^(NEC|IFC) /.test(ref) && !isMappedCitation(edition, ref)) unmapped.push(`${demo} ${r.id}: ${ref}`);
        }
      }
    }
    expect(unmapped).toEqual([]);
  });

  it("tags every entry with where it was confirmed", () => {
    for (const edition of NEC_EDITIONS) for (const c of CITATIONS[edition]) expect(c.confirmed.length, c.ref).toBeGreaterThan(0);
  });

  it("cites storage circuit current as 706.20(A) in 2017 and 706.30(A) from 2020, for storage over 60 V", () => {
    const j = exampleJson("ferncliff-farmhouse");
    // A 102.4 V bank: above the 60 V DC of 2017 706.1, so Article 706 applies in every edition.
    equipment(j, "BAT-1").nominalVoltageV = 102.4;
    expect(result(run(j, "2017"), "circuit-current:C-3").codeRefs).toContain("NEC 2017 706.20(A)");
    expect(result(run(j, "2020"), "circuit-current:C-3").codeRefs).toContain("NEC 2020 706.30(A)");
  });

  it("puts a 24 V battery under Article 480 in 2017 and Article 706 from 2020", () => {
    const hut = exampleJson("tamarack-hut");
    expect(result(run(hut, "2017"), "disconnects:BAT-1").codeRefs).toContain("NEC 2017 480.7(A)");
    expect(result(run(hut, "2017"), "disconnects:BAT-1").codeRefs.some((c) => c.includes("706."))).toBe(false);
    expect(result(run(hut, "2020"), "disconnects:BAT-1").codeRefs).toContain("NEC 2020 706.15");
  });

  it("cites the stand-alone plaque as 690.56(A) in 2017 (no 710.10 there) and 710.10 from 2020", () => {
    const refsOf = (edition: "2017" | "2020") => run(exampleJson("tamarack-hut"), edition).results.flatMap((r) => r.codeRefs);
    expect(refsOf("2017")).not.toContain("NEC 2017 710.10");
    expect(refsOf("2017")).toContain("NEC 2017 690.56(A)");
    expect(refsOf("2020")).toContain("NEC 2020 710.10");
  });

  it("pairs a 2017 NEC jurisdiction with the 2018 IFC", () => {
    const refs = run(exampleJson("tamarack-hut"), "2017").results.flatMap((r) => r.codeRefs);
    expect(refs).toContain("IFC 2018 1206");
    expect(refs.some((c) => c.startsWith("IFC 2021") || c.startsWith("IFC 2024"))).toBe(false);
  });

  it("cites the busbar items in each edition's numbering", () => {
    const r2017 = result(run(exampleJson("ferncliff-farmhouse"), "2017"), "panel-busbar:P-1");
    const r2023 = result(run(exampleJson("ferncliff-farmhouse"), "2023"), "panel-busbar:P-1");
    expect(r2017.codeRefs).toContain("NEC 2017 705.12(B)(2)(3)(b)");
    expect(r2023.codeRefs).toContain("NEC 2023 705.12(B)(3)(2)");
  });
});
