import { describe, expect, it } from "vitest";
import { correctionListSchema, splitCorrections } from "../../../lib/schemas/corrections";

// A plan-review letter as AHJs commonly write them (invented wording, common practice in layout):
// a heading, numbered comments, some running over two lines, citations in the code's own form.
const LETTER = `Plan review comments, permit application 26-0412

1. Sheet E-002: show the rating of the battery disconnect and its location. NEC 706.15(C)
2) Provide the storage system's listing (UL 9540) with the resubmittal.
3. The PV output circuit C-3 conductor appears undersized for the conditions of use;
   show the ampacity calculation. 690.8(B)
(4) Label the rapid shutdown switch per NEC 2020 690.56(C)(1) on sheet PV-3.`;

describe("splitting a pasted plan-review letter into comments", () => {
  it("gives one comment per number, joins continuation lines and leaves the heading out", () => {
    const items = splitCorrections(LETTER);
    expect(items.map((i) => i.comment)).toEqual([
      "Sheet E-002: show the rating of the battery disconnect and its location. NEC 706.15(C)",
      "Provide the storage system's listing (UL 9540) with the resubmittal.",
      "The PV output circuit C-3 conductor appears undersized for the conditions of use; show the ampacity calculation. 690.8(B)",
      "Label the rapid shutdown switch per NEC 2020 690.56(C)(1) on sheet PV-3.",
    ]);
  });

  it("takes the citation and the sheet from the comment's own words", () => {
    const items = splitCorrections(LETTER);
    expect(items.map((i) => i.citation)).toEqual(["NEC 706.15(C)", "", "690.8(B)", "NEC 2020 690.56(C)(1)"]);
    expect(items[0]!.sheet).toBe("E-002");
    expect(items[3]!.sheet).toBe("PV-3");
    expect(items[1]!.sheet).toBe("");
    // C-3 is a circuit tag, not a sheet.
    expect(items[2]!.sheet).toBe("");
  });

  it("treats unnumbered text as one comment per paragraph, and blank text as none", () => {
    expect(splitCorrections("Show the grounding electrode conductor.\n\nAdd the generator's nameplate.").map((i) => i.comment)).toEqual([
      "Show the grounding electrode conductor.",
      "Add the generator's nameplate.",
    ]);
    expect(splitCorrections("  \n \n")).toEqual([]);
  });

  it("accepts the list as the form sends it (JSON) and refuses a comment with no text", () => {
    const ok = correctionListSchema.safeParse(JSON.stringify([{ comment: "Show the label.", sheet: "E-004" }]));
    expect(ok.success && ok.data).toEqual([{ comment: "Show the label.", citation: "", sheet: "E-004" }]);
    const bad = correctionListSchema.safeParse([{ comment: "   " }]);
    expect(bad.success).toBe(false);
    expect(correctionListSchema.safeParse("not json").success).toBe(false);
  });
});
