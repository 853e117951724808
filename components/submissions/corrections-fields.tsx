"use client";

import { useMemo, useState } from "react";
import { splitCorrections, type CorrectionItem } from "@/lib/schemas/corrections";
import { FormField } from "./field";

/**
 * The comments of a plan-review letter, pasted as the AHJ numbered them: the
 * list is split as it is typed, and the office checks each comment's sheet and
 * citation before recording. The split list goes to the server as JSON.
 */
export function CorrectionsFields({
  assignable,
  defaultAssigneeId,
  issueFor,
}: {
  assignable: { id: string; name: string; roles: string[] }[];
  defaultAssigneeId: string;
  issueFor: (name: string) => string | undefined;
}) {
  const [text, setText] = useState("");
  const [edits, setEdits] = useState<Record<number, Partial<CorrectionItem>>>({});
  const [assigneeId, setAssigneeId] = useState(defaultAssigneeId);
  const items = useMemo(() => splitCorrections(text).map((item, i) => ({ ...item, ...edits[i] })), [text, edits]);
  const edit = (i: number, patch: Partial<CorrectionItem>) => setEdits((e) => ({ ...e, [i]: { ...e[i], ...patch } }));

  return (
    <>
      <FormField
        id="event-corrections"
        label="The AHJ's comments"
        hint="Paste the letter's numbered comments; each becomes an item the designer or reviewer answers."
        issue={issueFor("corrections")}
        className="sm:col-span-2"
      >
        {(d, bad) => (
          <textarea
            id="event-corrections"
            rows={5}
            className="input w-full"
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder={"1. Sheet E-002: show the battery disconnect rating. NEC 706.15\n2. Provide the storage listing."}
            aria-describedby={d}
            aria-invalid={bad || undefined}
          />
        )}
      </FormField>
      <FormField id="event-assignee" label="Assign to" hint="Each comment can be passed on later." issue={issueFor("assigneeId")}>
        {(d, bad) => (
          <select id="event-assignee" name="assigneeId" className="input w-full" value={assigneeId} onChange={(e) => setAssigneeId(e.target.value)} aria-describedby={d} aria-invalid={bad || undefined}>
            {assignable.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name} ({a.roles.join(", ")})
              </option>
            ))}
          </select>
        )}
      </FormField>
      <input type="hidden" name="corrections" value={items.length ? JSON.stringify(items) : ""} />
      {items.length > 0 ? (
        <div className="sm:col-span-3">
          <table className="data-table" aria-label="Comments to record">
            <thead>
              <tr>
                <th>No.</th>
                <th>Comment</th>
                <th>Sheet</th>
                <th>Citation</th>
              </tr>
            </thead>
            <tbody>
              {items.map((item, i) => (
                <tr key={i}>
                  <td className="figure">{i + 1}</td>
                  <td className="text-sm">{item.comment}</td>
                  <td>
                    <input aria-label={`Sheet of comment ${i + 1}`} className="input figure w-24" value={item.sheet} onChange={(e) => edit(i, { sheet: e.target.value })} />
                  </td>
                  <td>
                    <input aria-label={`Citation of comment ${i + 1}`} className="input figure w-40" value={item.citation} onChange={(e) => edit(i, { citation: e.target.value })} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </>
  );
}
