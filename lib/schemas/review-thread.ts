import { z } from "zod";

export const NOTE_REPLY_MAX_CHARS = 2000;
export const NOTE_STATES = ["open", "addressed", "closed"] as const;
export type NoteState = (typeof NOTE_STATES)[number];
export const NOTE_STATE_LABELS: Record<NoteState, string> = { open: "Open", addressed: "Addressed", closed: "Closed" };

/**
 * One step in a note's conversation. The designer replies and marks a note
 * addressed; the reviewer replies, closes it, or reopens it. Marking addressed
 * needs a word on how; closing and reopening may stand alone.
 */
export const noteResponseSchema = z
  .object({
    noteId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64),
    action: z.enum(["reply", "addressed", "closed", "reopened"], { error: "must be reply, addressed, closed or reopened" }),
    body: z.string().trim().max(NOTE_REPLY_MAX_CHARS, { message: `must be at most ${NOTE_REPLY_MAX_CHARS} characters` }).optional().default(""),
    /** The number of steps the page showed; a note answered since is refused. */
    seen: z.coerce.number().int().min(0).optional(),
  })
  .superRefine((v, ctx) => {
    if ((v.action === "reply" || v.action === "addressed") && v.body.length === 0) {
      ctx.addIssue({ code: "custom", path: ["body"], message: v.action === "reply" ? "is required: write the reply" : "is required: say how the note was addressed" });
    }
  });

/** Which actions may follow a state, and who may take them. */
export function noteActionVerdict(state: NoteState, action: "reply" | "addressed" | "closed" | "reopened"): string | null {
  if (action === "reply") return state === "closed" ? "The note is closed; reopen it to continue the conversation." : null;
  if (action === "addressed") return state === "open" ? null : state === "addressed" ? "The note is already marked addressed." : "The note is closed.";
  if (action === "closed") return state === "closed" ? "The note is already closed." : null;
  return state === "open" ? "The note is already open." : null;
}

/** A note's state from its conversation: the latest step that is not a plain reply. */
export function noteState(actions: readonly string[]): NoteState {
  for (let i = actions.length - 1; i >= 0; i--) {
    const a = actions[i];
    if (a === "addressed") return "addressed";
    if (a === "closed") return "closed";
    if (a === "reopened") return "open";
  }
  return "open";
}
