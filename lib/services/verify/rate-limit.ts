import "server-only";
import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";

/**
 * The public check at /verify needs no account, so it is limited per client
 * address: a permit counter checks a handful of files, while guessing hashes
 * or hashing large uploads over and over would cost the server. 20 checks a
 * minute per address is ample for a person and little for a script.
 */
export const VERIFY_POINTS = 20;
export const VERIFY_WINDOW_SECONDS = 60;

let limiter = new RateLimiterMemory({ keyPrefix: "verify", points: VERIFY_POINTS, duration: VERIFY_WINDOW_SECONDS });

/** For tests: a fresh limiter, optionally with other bounds. */
export function resetVerifyLimiter(points = VERIFY_POINTS, duration = VERIFY_WINDOW_SECONDS): void {
  limiter = new RateLimiterMemory({ keyPrefix: "verify", points, duration });
}

/** The client's address as the proxy in front reports it, or the socket's stand-in when there is none. */
export function clientAddress(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || headers.get("x-real-ip")?.trim() || "local";
}

/** Null when the check may go ahead, or the seconds to wait. */
export async function takeVerifyPoint(address: string): Promise<number | null> {
  try {
    await limiter.consume(address);
    return null;
  } catch (error) {
    if (error instanceof RateLimiterRes) return Math.max(1, Math.ceil(error.msBeforeNext / 1000));
    throw error;
  }
}
