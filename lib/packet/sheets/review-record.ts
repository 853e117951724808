import type { Block } from "../markup";
import type { PacketInput } from "../types";
import { table } from "./shared";

export function reviewBlocks(input: PacketInput): Block[] {
  const notes = input.reviewNotes ?? [];
  const blocks: Block[] = [];
  blocks.push(
    table(
      [["Target", 1], ["Note", 4], ["Author", 1.2]],
      notes.length ? notes.map((n) => [n.target, n.text, n.author]) : [["—", "No review notes on this revision.", ""]],
      "Review notes",
    ),
  );
  const open = input.run.results.filter((r) => r.status === "fail" || r.status === "needs-input" || r.status === "attest" || r.status === "warning");
  blocks.push(
    table(
      [["Status", 1.1], ["Check", 2.4], ["Subject", 0.8], ["Code reference", 1.8], ["Remedy", 3]],
      open.length
        ? open.map((r) => [{ text: "", status: r.status }, r.title, r.subject ?? "—", r.codeRefs.join("; "), r.remedy?.text ?? "—"])
        : [["—", "No open points.", "", "", ""]],
      "Points for the reviewer (fail, needs input, warning, attest)",
    ),
  );
  // What the stamp carries: the reviewer's disposition of each attest item.
  const dispositions = input.approval?.dispositions ?? [];
  if (input.approval) {
    blocks.push(
      table(
        [["Attest item", 3], ["Disposition", 1.1], ["Reviewer's note", 3.5]],
        dispositions.length
          ? dispositions.map((d) => [d.item, d.disposition === "accepted" ? "Accepted" : "Returned", d.note || "—"])
          : [["—", "", "No attest items in this revision."]],
        "Dispositions of the attest items",
      ),
    );
  }
  return blocks;
}
