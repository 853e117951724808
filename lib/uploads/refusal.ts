import { ServiceError } from "../services/errors";

/** Why an upload was turned away; each maps to the HTTP status a client can act on. */
export type UploadRefusalReason = "empty" | "too-large" | "unsupported-type" | "wrong-kind" | "corrupt" | "encrypted" | "missing-field" | "too-many-pixels" | "inflates-too-large";

export const UPLOAD_REFUSAL_STATUS: Record<UploadRefusalReason, number> = {
  empty: 400,
  "missing-field": 400,
  corrupt: 400,
  encrypted: 400,
  "too-large": 413,
  "too-many-pixels": 413,
  "inflates-too-large": 413,
  "unsupported-type": 415,
  "wrong-kind": 415,
};

/**
 * A refused upload. It is an "invalid" service error, so any edge maps it to
 * 400; the upload route maps it to 413 or 415 where those say more.
 */
export class UploadRefusedError extends ServiceError {
  constructor(
    readonly reason: UploadRefusalReason,
    message: string,
  ) {
    super("invalid", message);
    this.name = "UploadRefusedError";
  }

  get httpStatus(): number {
    return UPLOAD_REFUSAL_STATUS[this.reason];
  }
}
