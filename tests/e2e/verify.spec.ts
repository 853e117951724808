import { expect, test } from "@playwright/test";
import { makeThrowawayCertificate } from "../unit/signing/throwaway-ca";
import { demoUser, signInAs } from "./helpers";

/** The seeded market stall's approved revision: the stamped packet a permit counter would be handed. */
async function stampedPacket(page: import("@playwright/test").Page): Promise<Buffer> {
  const { projects } = (await (await page.request.get("/api/projects")).json()) as { projects: { id: string; name: string }[] };
  const stall = projects.find((p) => p.name.startsWith("Saturday market stall"));
  expect(stall, "the seeded market stall").toBeTruthy();
  const { revisions } = (await (await page.request.get(`/api/projects/${stall!.id}/revisions`)).json()) as { revisions: { id: string; reviewState: string }[] };
  const approved = revisions.find((r) => r.reviewState === "approved");
  expect(approved, "its approved revision").toBeTruthy();
  const pdf = await page.request.get(`/api/revisions/${approved!.id}/pdf`);
  expect(pdf.status()).toBe(200);
  return pdf.body();
}

test("a permit counter without an account checks the stamped packet at /verify, and a changed copy is not recognised", async ({ browser }) => {
  const office = await browser.newContext();
  const signedIn = await office.newPage();
  await signInAs(signedIn, "designer");
  const packet = await stampedPacket(signedIn);
  await office.close();

  const counter = await browser.newContext();
  const page = await counter.newPage();
  await page.goto("/verify");
  await expect(page).toHaveURL(/\/verify$/);
  await expect(page.getByRole("heading", { name: "Is this the packet the reviewer stamped?" })).toBeVisible();

  await page.getByLabel("The packet PDF").setInputFiles({ name: "packet.pdf", mimeType: "application/pdf", buffer: packet });
  const result = page.getByTestId("verify-result");
  await expect(result).toContainText("This exact file is a stamped packet.");
  await expect(result).toContainText("Saturday market stall");
  await expect(result).toContainText(demoUser("reviewer").name);

  const changed = Buffer.from(packet);
  changed[200] = changed[200]! ^ 0x01;
  await page.getByLabel("The packet PDF").setInputFiles({ name: "changed.pdf", mimeType: "application/pdf", buffer: changed });
  await expect(result).toContainText("This file is not a stamped packet.");
  await counter.close();
});

test("a reviewer keeps a signing certificate: a wrong password is refused, the right one stores it and shows whose it is", async ({ page }) => {
  test.setTimeout(90_000);
  const cert = makeThrowawayCertificate({ subjectName: demoUser("reviewer").name });
  await signInAs(page, "reviewer");
  await page.goto("/reviews/licence");
  const form = page.getByRole("form", { name: "Signing certificate" });
  await form.getByLabel(/Certificate file|Replace the certificate/).setInputFiles({ name: "seal.p12", mimeType: "application/x-pkcs12", buffer: Buffer.from(cert.p12) });
  await form.getByLabel("Certificate password").fill("not the password");
  await form.getByRole("button", { name: "Save certificate" }).click();
  await expect(form.getByRole("alert")).toContainText("password is not right");

  await form.getByLabel(/Certificate file|Replace the certificate/).setInputFiles({ name: "seal.p12", mimeType: "application/x-pkcs12", buffer: Buffer.from(cert.p12) });
  await form.getByLabel("Certificate password").fill(cert.password);
  await form.getByRole("button", { name: "Save certificate" }).click();
  await expect(form.getByRole("status")).toContainText("Signing certificate saved");
  await expect(page.getByTestId("certificate-on-file")).toContainText(demoUser("reviewer").name);
  await expect(page.getByTestId("certificate-on-file")).toContainText("Test Licensing Board CA");
});
