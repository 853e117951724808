import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { PDFDocument, StandardFonts } from "pdf-lib";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditLog, packetRevisions, packetSignatures, signingCertificates } from "../../db/schema";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { uploadAttachment } from "../../lib/services/attachments";
import { ServiceError } from "../../lib/services/errors";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { generateRevisionArtifacts, getRevisionFile, startRevision } from "../../lib/services/revisions";
import { approveAndSign, getOwnCertificate, saveOwnLicence, sendForReview, signStampedPacket, uploadSigningCertificate, uploadStampImage } from "../../lib/services/reviews";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makePng } from "../unit/packet/fixtures";
import { readPdfText } from "../unit/packet/pdf-text";
import { checkPdfSignature } from "../unit/signing/pdf-signature";
import { makeThrowawayCertificate } from "../unit/signing/throwaway-ca";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

vi.mock("server-only", () => ({}));
// The counter check is public: the route wrapper never asks for a session here.
vi.mock("@/lib/auth/session", () => ({
  requireContext: async () => {
    throw new Error("a public route asked for a session");
  },
}));
const { lookUpStampedFile } = await import("../../lib/services/verify/stamped-file");
const { resetVerifyLimiter } = await import("../../lib/services/verify/rate-limit");
const verifyRoute = await import("../../app/api/verify/route");

const env = tempDatabase();
const { db } = env;
// The public route reads the app's own connection; here that is the test database.
(globalThis as unknown as { sundocketDb?: typeof db }).sundocketDb = db;
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-signing-"));
const packetsDir = path.join(scratch, "packets");
setFileStore(new DiskFileStore(path.join(scratch, "uploads")));
afterAll(() => {
  setFileStore(undefined);
  env.cleanup();
  fs.rmSync(scratch, { recursive: true, force: true });
});

const certificateKey = Buffer.alloc(32, 41);
const noDelivery = async () => undefined;
const render = (id: string) => generateRevisionArtifacts(db, id, { packetsDir });
const options = { deliver: noDelivery, dispatch: render, packetsDir, certificateKey };

const org = makeOrg(db, "Signing Test Firm");
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const colleague = makeContext(db, org.id, ["reviewer"]);
const cert = makeThrowawayCertificate({ subjectName: reviewer.user.name });
const stall = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/market-stall.json", "utf8")));
const jurisdiction = makeJurisdiction(db, org.id, stall.jurisdiction.necEdition);

async function onePagePdf(label: string): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.addPage([612, 792]).drawText(label, { x: 72, y: 700, size: 14, font: await doc.embedFont(StandardFonts.Helvetica) });
  return doc.save();
}

async function revisionInReview(name: string): Promise<string> {
  const { id } = createProject(designer, { name, client: stall.client, systemKind: stall.systemKind, jurisdictionId: jurisdiction.id, address: stall.site.address });
  saveProjectRecord(designer, id, { ...stall, name }, getProjectRecord(designer, id).version);
  for (const tag of ["MOD-1", "CC-1", "BAT-1", "INV-1"]) {
    await uploadAttachment(designer, { projectId: id, kind: "datasheet", equipmentTag: tag, fileName: `${tag}.pdf`, bytes: await onePagePdf(`${tag} datasheet`) });
  }
  await uploadAttachment(designer, { projectId: id, kind: "storage-listing", equipmentTag: "BAT-1", fileName: "listing.pdf", bytes: await onePagePdf("storage listing") });
  await uploadAttachment(designer, { projectId: id, kind: "site-plan", fileName: "site.pdf", bytes: await onePagePdf("site plan") });
  const { revisionId } = startRevision(designer, id, { dispatch: () => undefined });
  expect((await render(revisionId)).state).toBe("ready");
  await sendForReview(designer, revisionId, { deliver: noDelivery });
  return revisionId;
}

function pdfsig(bytes: Uint8Array): string {
  const file = path.join(scratch, `${Math.random().toString(36).slice(2)}.pdf`);
  fs.writeFileSync(file, bytes);
  try {
    return execFileSync("pdfsig", [file], { encoding: "utf8" });
  } catch (error) {
    return String((error as { stdout?: string }).stdout ?? "");
  }
}

async function refusal(fn: () => unknown): Promise<ServiceError> {
  const error = await Promise.resolve()
    .then(fn)
    .then(
      () => undefined,
      (e: unknown) => e,
    );
  expect(error, "the call was refused").toBeInstanceOf(ServiceError);
  return error as ServiceError;
}

const revision = (id: string) => db.select().from(packetRevisions).where(eq(packetRevisions.id, id)).get()!;
let revisionId = "";

beforeAll(async () => {
  for (const ctx of [reviewer, colleague]) saveOwnLicence(ctx, { licenceNumber: "PE-E-300400", region: "Westmark", discipline: "Electrical", expiresOn: "2030-01-01" });
  await uploadStampImage(reviewer, { fileName: "stamp.png", bytes: makePng(240, 240, [150, 20, 30]) });
  revisionId = await revisionInReview("Signed market stall");
}, 120_000);

describe("a reviewer's signing certificate", () => {
  it("is stored only when its password opens it, sealed so the stored text is not the file, and the password is kept nowhere", async () => {
    const wrong = await refusal(() => uploadSigningCertificate(reviewer, { fileName: "seal.p12", bytes: cert.p12, password: "guess" }, { certificateKey }));
    expect(wrong.issues[0]?.path).toBe("certificatePassword");
    expect(getOwnCertificate(reviewer)).toBeNull();

    const view = uploadSigningCertificate(reviewer, { fileName: "seal.p12", bytes: cert.p12, password: cert.password }, { certificateKey });
    expect(view.subjectName).toBe(reviewer.user.name);
    expect(view.issuerName).toBe("Test Licensing Board CA");
    const row = db.select().from(signingCertificates).where(eq(signingCertificates.id, view.id)).get()!;
    expect(row.sealed.startsWith("v1.")).toBe(true);
    expect(row.sealed).not.toContain(Buffer.from(cert.p12).toString("base64").slice(0, 32));
    expect(row.sealed).not.toContain(Buffer.from(cert.p12).toString("base64url").slice(0, 32));
    // Nowhere in the database: not in the certificate row, not in the audit log.
    const dump = JSON.stringify([db.select().from(signingCertificates).all(), db.select().from(auditLog).all()]);
    expect(dump).not.toContain(cert.password);
  });
});

describe("approving with a signature", () => {
  it("refuses a wrong password before recording anything", async () => {
    const error = await refusal(() => approveAndSign(reviewer, { revisionId, confirmStamp: true }, { password: "not it" }, options));
    expect(error.issues[0]?.path).toBe("certificatePassword");
    expect(revision(revisionId).reviewState).toBe("in-review");
  });

  it("stamps and signs: the signature covers the whole file, pdfsig accepts it, and changing one byte breaks it", async () => {
    // Every attest item of the stall's checks needs the reviewer's disposition before a stamp.
    const attest = (revision(revisionId).resultsSnapshot as { results: { id: string; status: string }[] }).results.filter((r) => r.status === "attest");
    const dispositions = attest.map((r) => ({ resultId: r.id, disposition: "accepted", note: `Confirmed on the site photos (${r.id}).` }));
    const done = await approveAndSign(reviewer, { revisionId, confirmStamp: true, generalNotes: "Reviewed.", dispositions }, { password: cert.password }, options);
    expect(done.signed).toBe(true);
    const row = revision(revisionId);
    expect(row).toMatchObject({ reviewState: "approved", state: "ready" });
    const file = await getRevisionFile(designer, revisionId, "pdf", { packetsDir });
    expect(file.sha256).toBe(row.pdfSha256);

    const check = checkPdfSignature(file.bytes);
    expect(check.coversWholeFile).toBe(true);
    expect(check.digestMatches).toBe(true);
    expect(check.signatureValid).toBe(true);
    expect(check.signerCommonName).toBe(reviewer.user.name);
    const report = pdfsig(file.bytes);
    expect(report).toContain("Total document signed");
    expect(report).toContain("Signature is Valid.");

    // The stamp block still names the licensee, licence number, region and date on every page of the signed file.
    const text = await readPdfText(file.bytes);
    text.pages.forEach((page, i) => {
      for (const want of [reviewer.user.name, "PE-E-300400", "Westmark", new Date().toISOString().slice(0, 10)]) expect(page, `page ${i + 1}`).toContain(want);
    });

    const sig = db.select().from(packetSignatures).where(eq(packetSignatures.revisionId, revisionId)).get()!;
    expect(sig.signedPdfSha256).toBe(row.pdfSha256);
    expect(sig.signerId).toBe(reviewer.user.id);

    const tampered = Buffer.from(file.bytes);
    const at = Math.floor(check.byteRange[1] / 2);
    tampered[at] = tampered[at]! ^ 0x20;
    expect(checkPdfSignature(tampered).digestMatches).toBe(false);
    expect(pdfsig(tampered)).not.toContain("Signature is Valid.");
  }, 120_000);

  it("is not signed twice, nor by a reviewer who did not stamp it", async () => {
    expect((await refusal(() => signStampedPacket(reviewer, revisionId, { password: cert.password }, options))).code).toBe("conflict");
    const other = makeThrowawayCertificate({ subjectName: colleague.user.name });
    uploadSigningCertificate(colleague, { fileName: "c.p12", bytes: other.p12, password: other.password }, { certificateKey });
    const error = await refusal(() => signStampedPacket(colleague, revisionId, { password: other.password }, options));
    expect(error.message).toMatch(/Only the reviewer who approved and stamped/);
  });
});

describe("checking a file from the counter, without an account", () => {
  const sha = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

  it("says this exact file is a stamped revision, of which project, by whom and when, and nothing else", async () => {
    const file = await getRevisionFile(designer, revisionId, "pdf", { packetsDir });
    const answer = lookUpStampedFile(db, file.sha256);
    expect(answer).toMatchObject({ stamped: true, projectName: "Signed market stall", revisionNumber: 1, reviewerName: reviewer.user.name, licenceNumber: "PE-E-300400", licenceRegion: "Westmark" });
    expect(Object.keys(answer).sort()).toEqual(["approvedAt", "licenceNumber", "licenceRegion", "projectName", "reviewerName", "revisionNumber", "sha256", "signature", "stamped"]);
    expect(answer.stamped && answer.signature?.subjectName).toBe(reviewer.user.name);

    const tampered = Buffer.from(file.bytes);
    tampered[100] = tampered[100]! ^ 0x01;
    expect(lookUpStampedFile(db, sha(tampered))).toEqual({ stamped: false, sha256: sha(tampered) });
    // The unsigned rendering the signature replaced is not the issued packet.
    const sig = db.select().from(packetSignatures).where(eq(packetSignatures.revisionId, revisionId)).get()!;
    expect(lookUpStampedFile(db, sig.unsignedPdfSha256).stamped).toBe(false);
  });

  it("answers an unstamped revision's own PDF as not stamped", async () => {
    const draft = await revisionInReview("Not yet stamped");
    expect(lookUpStampedFile(db, revision(draft).pdfSha256!).stamped).toBe(false);
  }, 120_000);

  it("takes the PDF itself or its hash through the route, and limits how often one address may ask", async () => {
    resetVerifyLimiter(3, 60);
    const file = await getRevisionFile(designer, revisionId, "pdf", { packetsDir });
    const headers = { "x-forwarded-for": "203.0.113.7" };
    const byHash = await verifyRoute.GET(new Request(`http://localhost/api/verify?sha256=${file.sha256.toUpperCase()}`, { headers }));
    expect(byHash.status).toBe(200);
    expect(await byHash.json()).toMatchObject({ stamped: true, projectName: "Signed market stall" });
    const byFile = await verifyRoute.POST(new Request("http://localhost/api/verify", { method: "POST", body: Buffer.from(file.bytes), headers: { ...headers, "content-type": "application/pdf" } }));
    expect(await byFile.json()).toMatchObject({ stamped: true, sha256: file.sha256 });
    const form = new FormData();
    form.set("file", new File([file.bytes.slice(0, 500)], "part.pdf", { type: "application/pdf" }));
    const partial = await verifyRoute.POST(new Request("http://localhost/api/verify", { method: "POST", body: form, headers }));
    expect(await partial.json()).toMatchObject({ stamped: false });
    const limited = await verifyRoute.GET(new Request(`http://localhost/api/verify?sha256=${file.sha256}`, { headers }));
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);
    // Another address is not held up by the first.
    const other = await verifyRoute.GET(new Request(`http://localhost/api/verify?sha256=${file.sha256}`, { headers: { "x-forwarded-for": "198.51.100.2" } }));
    expect(other.status).toBe(200);
    expect((await verifyRoute.GET(new Request("http://localhost/api/verify?sha256=abc", { headers: { "x-forwarded-for": "198.51.100.3" } }))).status).toBe(400);
  });
});
