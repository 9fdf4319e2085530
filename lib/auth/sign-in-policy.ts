/**
 * How repeated failed sign-ins are answered. A limit per e-mail alone is a switch anyone can
 * throw: five wrong passwords from anywhere would lock a signatory out before a deadline. So
 * failures are counted three ways within a window:
 *  - per (account, address): an address that keeps failing on one account is refused there;
 *  - per address: an address failing on many accounts is refused for all of them;
 *  - per account, across addresses: answered with a growing delay on every attempt, the
 *    correct password included, and the account holder is told by e-mail, once per window.
 * The correct password from an address that has not failed is never refused, only slowed.
 */
export const SIGN_IN_WINDOW_MINUTES = 15;
export const MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS = 5;
export const MAX_FAILURES_PER_ADDRESS = 30;
/** Account-wide failures before attempts are slowed and the holder is told. */
export const SLOW_DOWN_AFTER_ACCOUNT_FAILURES = 5;
export const FIRST_DELAY_MS = 250;
export const MAX_DELAY_MS = 8_000;

export interface FailureCounts {
  /** This account from this address. */
  accountAndAddress: number;
  /** This address, any account. */
  address: number;
  /** This account, any address. */
  account: number;
}

export type SignInVerdict = { refuse: true } | { refuse: false; delayMs: number };

export function signInVerdict(c: FailureCounts): SignInVerdict {
  if (c.accountAndAddress >= MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS || c.address >= MAX_FAILURES_PER_ADDRESS) return { refuse: true };
  const over = c.account - SLOW_DOWN_AFTER_ACCOUNT_FAILURES;
  return { refuse: false, delayMs: over < 0 ? 0 : Math.min(FIRST_DELAY_MS * 2 ** over, MAX_DELAY_MS) };
}

/** True for the failure that makes the account-wide count reach the threshold: the one that sends the notice. */
export const isNoticeFailure = (accountFailuresAfter: number) => accountFailuresAfter === SLOW_DOWN_AFTER_ACCOUNT_FAILURES;
