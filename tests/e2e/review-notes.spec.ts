import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

/** The seeded hut revision waits for review; this spec returns it with a note, answers it, sends it back and closes the note. */
const PROJECT = "Tamarack backcountry hut";

test("a reviewer's note is a conversation: the designer replies and marks it addressed, the reviewer closes it", async ({ browser }) => {
  test.setTimeout(150_000);
  const noteText = `Say where the 75 °C terminal limit shows (${Date.now().toString(36)}).`;

  const reviewer = await (await browser.newContext()).newPage();
  await signInAs(reviewer, "reviewer");
  await reviewer.goto("/reviews");
  await reviewer.getByRole("table", { name: "Awaiting review" }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).click();
  await expect(reviewer).toHaveURL(/\/reviews\/[0-9a-f-]{36}$/);
  const revisionUrl = reviewer.url();
  const firstCheck = reviewer.getByRole("region", { name: "Fail checks", exact: true }).getByRole("article").first();
  await firstCheck.getByRole("button", { name: /^Add a note on/ }).click();
  await firstCheck.getByRole("textbox", { name: /^Note on/ }).fill(noteText);
  await reviewer.getByRole("button", { name: "Return with notes" }).click();
  await reviewer.getByRole("dialog").getByRole("button", { name: /^Return revision \d+$/ }).click();
  await expect(reviewer.getByRole("status").filter({ hasText: /returned to/ })).toBeVisible();

  // The designer answers on the packet tab: an empty reply is not offered, a real one marks the note addressed.
  const designer = await (await browser.newContext()).newPage();
  await signInAs(designer, "designer");
  await designer.goto(revisionUrl);
  const projectHref = await designer.getByRole("region", { name: "Revision and project", exact: true }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).getAttribute("href");
  await designer.goto(projectHref!);
  const note = designer.getByRole("region", { name: "Review notes" }).getByRole("listitem").filter({ hasText: noteText }).first();
  await expect(note.locator("[data-note-state]")).toHaveAttribute("data-note-state", "open");
  await expect(designer.getByTestId("review-notes-count")).toContainText("open");
  await expect(note.getByRole("button", { name: "Reply and mark addressed" })).toBeDisabled();
  await note.getByRole("textbox").fill("Shown on E-004, row C-2, terminal column.");
  await note.getByRole("button", { name: "Reply and mark addressed" }).click();
  await expect(note.locator("[data-note-state]")).toHaveAttribute("data-note-state", "addressed");
  await expect(note).toContainText("marked it addressed");
  // The designer cannot close it; that is the reviewer's.
  await expect(note.getByRole("button", { name: "Close note" })).toHaveCount(0);
  await designer.reload();
  await expect(designer.getByRole("region", { name: "Review notes" }).getByRole("listitem").filter({ hasText: noteText }).first()).toContainText("Shown on E-004, row C-2");

  // Sent back as it is, so the hut ends where it began: waiting for review.
  await designer.goto(revisionUrl);
  await designer.getByRole("button", { name: /^Send again unchanged/ }).click();
  await designer.getByLabel("Message to the reviewer").fill("The limit is already on E-004; see my reply on the note.");
  await designer.getByRole("button", { name: "Send it again" }).click();
  await expect(designer.getByText("Awaiting review", { exact: true })).toBeVisible({ timeout: 30_000 });

  // The reviewer reads the reply beside the note and closes it.
  await reviewer.goto(revisionUrl);
  const onReview = reviewer.getByRole("list", { name: "Review decisions" }).getByRole("listitem").filter({ hasText: noteText }).first();
  await expect(onReview).toContainText("Shown on E-004, row C-2");
  await onReview.getByRole("button", { name: "Close note" }).click();
  await expect(onReview.locator("[data-note-state]")).toHaveAttribute("data-note-state", "closed");
  await reviewer.reload();
  await expect(reviewer.getByRole("list", { name: "Review decisions" }).getByRole("listitem").filter({ hasText: noteText }).first().locator("[data-note-state]")).toHaveAttribute("data-note-state", "closed");
});
