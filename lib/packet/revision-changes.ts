import type { ProjectRecord } from "../schemas/project-record";

/**
 * What changed in the design record between two revisions, in a reviewer's
 * words: the tags added, removed or changed per part of the record, and the
 * site or jurisdiction when any of their fields moved. A reviewer checking a
 * resubmittal reads this first, so it names things, not counts.
 */
export function describeRecordChanges(before: ProjectRecord | null, after: ProjectRecord): string {
  if (!before) return "First issue";
  const parts: string[] = [];
  const byKey = <T>(list: T[], key: (t: T) => string) => new Map(list.map((t) => [key(t), JSON.stringify(t)]));
  const section = <T>(name: string, a: T[], b: T[], key: (t: T) => string) => {
    const x = byKey(a, key);
    const y = byKey(b, key);
    const added = [...y.keys()].filter((k) => !x.has(k));
    const removed = [...x.keys()].filter((k) => !y.has(k));
    const changed = [...y.keys()].filter((k) => x.has(k) && x.get(k) !== y.get(k));
    const words = [
      added.length ? `added ${added.join(", ")}` : "",
      removed.length ? `removed ${removed.join(", ")}` : "",
      changed.length ? `changed ${changed.join(", ")}` : "",
    ].filter(Boolean);
    if (words.length) parts.push(`${name}: ${words.join("; ")}`);
  };
  section("equipment", before.equipment, after.equipment, (e) => e.tag);
  section("arrays", before.arrays, after.arrays, (a) => a.tag);
  section("circuits", before.circuits, after.circuits, (c) => c.tag);
  section("loads", before.loads, after.loads, (l) => l.name);
  if (JSON.stringify(before.site) !== JSON.stringify(after.site)) parts.push("site data changed");
  if (JSON.stringify(before.jurisdiction) !== JSON.stringify(after.jurisdiction)) parts.push("jurisdiction data changed");
  if (JSON.stringify(before.attachments) !== JSON.stringify(after.attachments)) parts.push("attachments changed");
  return parts.length ? parts.join(". ") : "Regenerated without changes to the design record";
}
