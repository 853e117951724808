import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { packetRevisions, reviewNoteReplies, reviewNotes, reviews, users } from "../../../db/schema";
import { can } from "../../auth/permissions";
import { formatIssues } from "../../schemas/fields";
import { noteActionVerdict, noteResponseSchema, noteState, type NoteState } from "../../schemas/review-thread";
import { audit, type ServiceContext } from "../context";
import { conflict, forbidden, invalid, notFound } from "../errors";

export interface NoteReplyView {
  id: string;
  action: "reply" | "addressed" | "closed" | "reopened";
  body: string;
  who: string | null;
  at: string;
}

export interface NoteThread {
  state: NoteState;
  replies: NoteReplyView[];
}

/** The conversations under the given notes (already scoped to the organisation by their reviews). */
export function threadsFor(ctx: ServiceContext, noteIds: readonly string[]): Map<string, NoteThread> {
  const threads = new Map<string, NoteThread>(noteIds.map((id) => [id, { state: "open" as NoteState, replies: [] }]));
  if (noteIds.length === 0) return threads;
  const rows = ctx.db
    .select({ reply: reviewNoteReplies, who: users.name })
    .from(reviewNoteReplies)
    .leftJoin(users, eq(users.id, reviewNoteReplies.userId))
    .where(and(eq(reviewNoteReplies.orgId, ctx.orgId), inArray(reviewNoteReplies.noteId, [...noteIds])))
    .orderBy(asc(reviewNoteReplies.createdAt))
    .all();
  for (const { reply, who } of rows) {
    threads.get(reply.noteId)?.replies.push({ id: reply.id, action: reply.action, body: reply.body, who, at: reply.createdAt });
  }
  for (const t of threads.values()) t.state = noteState(t.replies.map((r) => r.action));
  return threads;
}

/** Notes of the project's returned reviews still waiting on someone (open or addressed but not closed). */
export function openNoteCount(ctx: ServiceContext, projectId: string): { open: number; addressed: number } {
  const ids = ctx.db
    .select({ id: reviewNotes.id })
    .from(reviewNotes)
    .innerJoin(reviews, and(eq(reviews.id, reviewNotes.reviewId), eq(reviews.orgId, ctx.orgId)))
    .innerJoin(packetRevisions, and(eq(packetRevisions.id, reviews.revisionId), eq(packetRevisions.projectId, projectId)))
    .all()
    .map((r) => r.id);
  const threads = [...threadsFor(ctx, ids).values()];
  return { open: threads.filter((t) => t.state === "open").length, addressed: threads.filter((t) => t.state === "addressed").length };
}

export interface NoteResponse {
  noteId: string;
  state: NoteState;
  message: string;
}

/**
 * One step in a note's conversation. The designer (who sends revisions)
 * replies and marks notes addressed; the reviewer replies, closes and reopens.
 * A step that does not fit the note's state is refused with the reason.
 */
export function respondToNote(ctx: ServiceContext, input: unknown): NoteResponse {
  const parsed = noteResponseSchema.safeParse(input);
  if (!parsed.success) throw invalid("The reply was not saved: some fields are not valid.", formatIssues(parsed.error));
  const { noteId, action, body, seen } = parsed.data;
  const designer = can(ctx.roles, "review:send");
  const reviewer = can(ctx.roles, "review:decide");
  if (!designer && !reviewer) throw forbidden("answer review notes");
  if (action === "addressed" && !designer) throw forbidden("mark a note addressed; the designer does that");
  if ((action === "closed" || action === "reopened") && !reviewer) throw forbidden("close or reopen a note; the reviewer does that");

  const note = ctx.db
    .select({ id: reviewNotes.id, text: reviewNotes.text, reviewId: reviews.id, revisionId: reviews.revisionId })
    .from(reviewNotes)
    .innerJoin(reviews, and(eq(reviews.id, reviewNotes.reviewId), eq(reviews.orgId, ctx.orgId)))
    .where(eq(reviewNotes.id, noteId))
    .get();
  if (!note) throw notFound("Review note");
  const thread = threadsFor(ctx, [note.id]).get(note.id)!;
  if (seen !== undefined && seen !== thread.replies.length) throw conflict("Someone answered this note since you opened it; reload the page to read the reply.");
  const refusal = noteActionVerdict(thread.state, action);
  if (refusal) throw invalid(refusal, [{ path: "action", message: refusal }]);

  ctx.db.transaction((tx) => {
    tx.insert(reviewNoteReplies).values({ orgId: ctx.orgId, noteId: note.id, userId: ctx.user.id, action, body }).run();
    audit(tx, ctx, `review.note.${action}`, "revision", note.revisionId, { noteId: note.id, body });
  });
  const state = noteState([...thread.replies.map((r) => r.action), action]);
  const words = { reply: "Reply added.", addressed: "Marked addressed.", closed: "Note closed.", reopened: "Note reopened." } as const;
  return { noteId: note.id, state, message: words[action] };
}
