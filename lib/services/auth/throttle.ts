import "server-only";
import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";

/**
 * Failed sign-ins counted in memory per e-mail address and per client
 * address, whether or not an account exists. Per e-mail, this is what makes an
 * unknown address answer "locked" exactly as a known one does after the same
 * number of failures, so the lock reveals nothing about which e-mails exist.
 * Per client, it slows one machine trying many e-mails (credential stuffing):
 * 10 failures per allowed failure of one account is generous for an office
 * behind one address (common practice).
 */
export interface SignInThrottle {
  /** Seconds until the next attempt is allowed, or null when it may go ahead. */
  blockedFor(email: string, client: string): Promise<{ scope: "email" | "client"; seconds: number } | null>;
  /** Counts a failure; true when that failure exhausted the e-mail's allowance. */
  fail(email: string, client: string): Promise<boolean>;
  succeed(email: string): Promise<void>;
}

export function memoryThrottle(maxFailures: number, lockMinutes: number): SignInThrottle {
  const perEmail = new RateLimiterMemory({ keyPrefix: "signin-email", points: maxFailures, duration: lockMinutes * 60 });
  const perClient = new RateLimiterMemory({ keyPrefix: "signin-client", points: maxFailures * 10, duration: lockMinutes * 60 });
  const waitOf = (res: RateLimiterRes | null, points: number) => (res && res.consumedPoints >= points ? Math.max(1, Math.ceil(res.msBeforeNext / 1000)) : null);
  return {
    async blockedFor(email, client) {
      const e = waitOf(await perEmail.get(email), maxFailures);
      if (e !== null) return { scope: "email", seconds: e };
      const c = waitOf(await perClient.get(client), maxFailures * 10);
      return c === null ? null : { scope: "client", seconds: c };
    },
    async fail(email, client) {
      await perClient.penalty(client, 1);
      const res = await perEmail.penalty(email, 1);
      return res.consumedPoints >= maxFailures;
    },
    async succeed(email) {
      await perEmail.delete(email);
    },
  };
}

const shared = new Map<string, SignInThrottle>();

/** One throttle per policy for the whole process. */
export function signInThrottle(maxFailures: number, lockMinutes: number): SignInThrottle {
  const key = `${maxFailures}/${lockMinutes}`;
  let throttle = shared.get(key);
  if (!throttle) {
    throttle = memoryThrottle(maxFailures, lockMinutes);
    shared.set(key, throttle);
  }
  return throttle;
}
