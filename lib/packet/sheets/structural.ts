import type { ProjectRecord } from "../../schemas/project-record";
import type { Block } from "../markup";
import { notGiven } from "../record-words";
import type { PacketInput } from "../types";

function attached(record: ProjectRecord, kind: "structural-letter" | "attachment-detail"): string[] {
  return record.attachments.filter((a) => a.kind === kind).map((a) => a.fileName || "attached");
}

/**
 * The structural block a reviewer asks for: the racking and its listing, the
 * footing or attachment detail and the structural letter, each as attached
 * (merged at the end of the packet) or named as missing.
 */
export function structuralBlocks(input: PacketInput): Block[] {
  const { record } = input;
  const roof = record.site.mounting === "roof";
  const letters = attached(record, "structural-letter");
  const details = attached(record, "attachment-detail");
  const letterRequired = record.jurisdiction.requiredDocuments.includes("structural-letter") && roof;
  return [
    { kind: "heading", level: 2, text: "Structural and attachment" },
    {
      kind: "fields",
      rows: [
        ["Mounting", roof ? "Roof mount" : "Ground mount"],
        ["Racking product", record.site.rackingProduct || notGiven(record, "site.rackingProduct")],
        ["Racking listing", record.site.rackingListing || notGiven(record, "site.rackingListing")],
        [
          roof ? "Roof attachment detail" : "Footing detail",
          details.length ? `attached, merged after the sheets: ${details.join(", ")}` : "NOT GIVEN: attach a footing or attachment detail (Attachments page)",
        ],
        [
          "Structural letter",
          letters.length
            ? `attached, merged after the sheets: ${letters.join(", ")}`
            : letterRequired
              ? `NOT GIVEN: ${record.jurisdiction.name} requires a structural letter for a roof mount (Attachments page)`
              : "not attached; the jurisdiction may require one",
        ],
      ],
    },
  ];
}
