import "server-only";
import { eq } from "drizzle-orm";
import { packetRevisions } from "../../../db/schema";
import type { ServiceContext } from "../context";
import { decideReview, type Decided, type DecideOptions } from "./decide";
import { openSigningCertificate, signStampedPacket, type SigningSecret, type SignOptions } from "./sign";

/** The stamped rendering of a packet with many datasheets takes a minute or two on a small server; ten is a stuck worker. */
const SIGN_WAIT_MS = 10 * 60_000;
const SIGN_POLL_MS = 1_000;

export interface ApprovedAndSigned extends Decided {
  /** True when the signed PDF is already in place; false while the stamped rendering runs and the signature follows it. */
  signed: boolean;
}

/**
 * Approves a revision and signs its stamped packet in one step. The
 * certificate is opened with its password before the approval is recorded, so
 * a mistyped password changes nothing. The stamped PDF is rendered by the
 * packet worker; the signature is applied as soon as that rendering is ready,
 * holding the certificate and password in this process's memory only until
 * then. If the server stops first, the packet stays stamped and unsigned and
 * the reviewer signs it from the review page.
 */
export async function approveAndSign(ctx: ServiceContext, input: Record<string, unknown>, secret: SigningSecret, options: DecideOptions & SignOptions = {}): Promise<ApprovedAndSigned> {
  openSigningCertificate(ctx, secret, options);
  const decided = await decideReview(ctx, { ...input, decision: "approved" }, options);
  const sign = () => signStampedPacket(ctx, decided.revisionId, secret, options);
  if (stateOf(ctx, decided.revisionId) === "ready") {
    await sign();
    return { ...decided, signed: true, message: `${decided.message.split(".")[0]}. The stamped packet is signed with your certificate.` };
  }
  void signWhenRendered(ctx, decided.revisionId, sign);
  return { ...decided, signed: false, message: `${decided.message} It is signed with your certificate as soon as it is rendered.` };
}

function stateOf(ctx: ServiceContext, revisionId: string) {
  return ctx.db.select({ state: packetRevisions.state }).from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get()?.state;
}

async function signWhenRendered(ctx: ServiceContext, revisionId: string, sign: () => Promise<unknown>): Promise<void> {
  const until = Date.now() + SIGN_WAIT_MS;
  while (Date.now() < until) {
    await new Promise((resolve) => setTimeout(resolve, SIGN_POLL_MS));
    const state = stateOf(ctx, revisionId);
    if (state === "generating") continue;
    if (state === "ready") {
      await sign().catch((error: unknown) => console.error("signing the stamped packet after rendering failed", error));
    }
    return;
  }
}
