import { describe, expect, it } from "vitest";
import { CODE_REFS, CODE_TOPICS, codeRef, type CodeTopic } from "@/lib/compliance/tables";
import { NEC_EDITIONS, type NecEdition } from "@/lib/schemas/project-record";

describe("code references per edition", () => {
  const expected: [NecEdition, CodeTopic, string][] = [
    // NEC 2017 kept the ampacity tables inside 310.15(B); NEC 2020 renumbered them (medium voltage moved to Article 311).
    ["2017", "ampacity-table", "NEC 2017 Table 310.15(B)(16)"],
    ["2020", "ampacity-table", "NEC 2020 Table 310.16"],
    ["2023", "ampacity-table", "NEC 2023 Table 310.16"],
    ["2017", "ambient-correction", "NEC 2017 Table 310.15(B)(2)(a)"],
    ["2020", "ambient-correction", "NEC 2020 Table 310.15(B)(1)"],
    ["2023", "ambient-correction", "NEC 2023 Table 310.15(B)(1)(1)"],
    ["2017", "conductor-adjustment", "NEC 2017 Table 310.15(B)(3)(a)"],
    ["2020", "conductor-adjustment", "NEC 2020 Table 310.15(C)(1)"],
    ["2023", "conductor-adjustment", "NEC 2023 Table 310.15(C)(1)"],
    ["2017", "rooftop-adder", "NEC 2017 310.15(B)(3)(c)"],
    ["2020", "rooftop-adder", "NEC 2020 310.15(B)(2)"],
    ["2023", "rooftop-adder", "NEC 2023 310.15(B)(2)"],
    // NEC 2023 moved the DC source label into 690.7(D) and the building rapid-shutdown label into 690.12(D).
    ["2017", "dc-source-label", "NEC 2017 690.53"],
    ["2020", "dc-source-label", "NEC 2020 690.53"],
    ["2023", "dc-source-label", "NEC 2023 690.7(D)"],
    ["2017", "rapid-shutdown-label", "NEC 2017 690.56(C)"],
    ["2020", "rapid-shutdown-label", "NEC 2020 690.56(C)"],
    ["2023", "rapid-shutdown-label", "NEC 2023 690.12(D)"],
    // NEC 2023 put the standard ratings into Table 240.6(A).
    ["2020", "standard-ratings", "NEC 2020 240.6(A)"],
    ["2023", "standard-ratings", "NEC 2023 Table 240.6(A)"],
    // NEC 2020 rewrote Article 706: the storage disconnect became 706.15 (2017 706.7 from memory).
    ["2017", "ess-disconnect", "NEC 2017 706.7"],
    ["2020", "ess-disconnect", "NEC 2020 706.15"],
    ["2023", "ess-disconnect", "NEC 2023 706.15"],
    // Unchanged numbering across the three editions.
    ["2017", "voltage-correction-table", "NEC 2017 Table 690.7(A)"],
    ["2023", "voltage-correction-table", "NEC 2023 Table 690.7(A)"],
    ["2020", "pv-circuit-current", "NEC 2020 690.8(A)"],
    ["2020", "pv-ocpd", "NEC 2020 690.9"],
    ["2023", "small-conductor", "NEC 2023 240.4(D)"],
    ["2017", "terminal-rating", "NEC 2017 110.14(C)"],
    ["2020", "dc-resistance", "NEC 2020 Chapter 9, Table 8"],
    ["2023", "egc-table", "NEC 2023 Table 250.122"],
    ["2020", "pv-egc", "NEC 2020 690.45"],
    ["2020", "dc-gec", "NEC 2020 250.166"],
    ["2020", "pv-disconnect", "NEC 2020 690.13"],
    ["2020", "pv-equipment-disconnect", "NEC 2020 690.15"],
    ["2020", "generator-disconnect", "NEC 2020 445.18"],
    ["2023", "rapid-shutdown", "NEC 2023 690.12"],
    ["2020", "stand-alone-supply", "NEC 2020 710.15"],
    ["2020", "stand-alone-plaque", "NEC 2020 710.10"],
    ["2020", "arc-flash-label", "NEC 2020 110.16"],
    ["2020", "field-marking", "NEC 2020 110.21(B)"],
    ["2020", "listing-use", "NEC 2020 110.3(B)"],
    ["2020", "interrupting-rating", "NEC 2020 110.9"],
    ["2020", "pv-listing", "NEC 2020 690.4(B)"],
    ["2020", "ess-listing", "NEC 2020 706.5"],
    ["2020", "source-directory", "NEC 2020 705.10"],
  ];

  it.each(expected)("NEC %s %s → %s", (edition, topic, ref) => {
    expect(codeRef(edition, topic)).toBe(ref);
  });

  it("has a reference for every topic in every edition", () => {
    for (const topic of CODE_TOPICS) {
      for (const edition of NEC_EDITIONS) {
        const ref = codeRef(edition, topic);
        expect(ref.startsWith(`NEC ${edition} `), `${topic} ${edition}`).toBe(true);
        expect(CODE_REFS[topic][edition].length, `${topic} ${edition}`).toBeGreaterThan(2);
      }
    }
  });

  it("cites the edition's own numbering where 2017 and 2020 differ", () => {
    // The Article 310 renumbering of NEC 2020 is the difference most often missed on a permit set.
    for (const topic of ["ampacity-table", "ambient-correction", "conductor-adjustment", "rooftop-adder"] as const) {
      expect(CODE_REFS[topic]["2017"]).not.toBe(CODE_REFS[topic]["2020"]);
    }
  });
});
