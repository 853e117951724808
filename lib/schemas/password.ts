import { z } from "zod";

/** bcrypt uses only the first 72 bytes of a password; anything after them would not count (bcrypt, Provos and Mazières 1999). */
export const PASSWORD_MAX_BYTES = 72;
/** Long enough to resist guessing at bcrypt's cost without rules on character classes (NIST SP 800-63B asks at least 8; 12 is our floor). */
export const PASSWORD_MIN_CHARS = 12;

export const passwordSchema = z
  .string({ error: "is required" })
  .min(PASSWORD_MIN_CHARS, { message: `must be at least ${PASSWORD_MIN_CHARS} characters` })
  .refine((p) => new TextEncoder().encode(p).length <= PASSWORD_MAX_BYTES, {
    message: `must be at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} letters, fewer with accents or symbols): longer passwords are not fully checked`,
  });
