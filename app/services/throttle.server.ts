import { RateLimiterPostgres, type RateLimiterRes } from "rate-limiter-flexible";
import { sequelize } from "~/db.server";
import { clientKey, type RequestArgs } from "./rate-limit.server";

// Brute-force and mail throttles, counted in PostgreSQL (the `rate_limits` table) so every app
// server shares them. Nothing here locks anyone out for good: blocks are short and capped, and
// the reset link by e-mail always works (it signs the person in and clears the account's count).

const limiters = new Map<string, RateLimiterPostgres>();
function limiter(keyPrefix: string, points: number, durationS: number) {
  let found = limiters.get(keyPrefix);
  if (!found) {
    found = new RateLimiterPostgres({
      storeClient: sequelize,
      storeType: "sequelize",
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix,
      points,
      duration: durationS,
    });
    limiters.set(keyPrefix, found);
  }
  return found;
}

/**
 * Who is asking, for the per-client counts: the same key the API's rate limit uses. Routes pass
 * their loader/action arguments, so this is the one line to change if that key needs more.
 */
export const clientOf = (args: RequestArgs) => clientKey(args);

const MINUTE = 60;
const HOUR = 3600;

/** An attempt refused for now; `message` is for the person, `retryAfterS` for the Retry-After header. */
export class Throttled extends Error {
  constructor(
    message: string,
    public readonly retryAfterS: number,
  ) {
    super(message);
    this.name = "Throttled";
  }
}

const minutes = (ms: number) => {
  const n = Math.max(1, Math.ceil(ms / 60_000));
  return `${n} minute${n === 1 ? "" : "s"}`;
};

const blockedFor = (res: RateLimiterRes | null, limit: number) => (res && res.consumedPoints > limit ? res.msBeforeNext : 0);

// --- Sign-in -------------------------------------------------------------------------------
// 1. One account from one client: 5 wrong passwords in a row, then a block of 5 minutes that
//    doubles with each new block that day, up to an hour. A success clears the count.
// 2. One account from every client together: 20 wrong passwords in an hour block it until the
//    hour is over, so many addresses can't guess at one account either. This is the only count
//    others can drive, and it is short; the reset link still gets the owner in.
// 3. One client across accounts: 30 wrong passwords in 15 minutes block it for the rest of them.
// The keys are the typed address, known or not, so a block reveals no account.
export const SIGN_IN_LIMITS = { perAccountClient: 5, perAccount: 20, perClient: 30 } as const;
const accountClientFails = () => limiter("signin-account-client", SIGN_IN_LIMITS.perAccountClient, HOUR);
const accountClientBlocks = () => limiter("signin-account-client-blocks", 1000, 24 * HOUR);
const accountFails = () => limiter("signin-account", SIGN_IN_LIMITS.perAccount, HOUR);
const clientFails = () => limiter("signin-client", SIGN_IN_LIMITS.perClient, 15 * MINUTE);

const blockSeconds = (blocksToday: number) => Math.min(5 * MINUTE * 2 ** (blocksToday - 1), HOUR);

const accountThrottledMessage = (ms: number) => `Too many attempts for this account. Try again in ${minutes(ms)}, or reset your password by e-mail.`;

/**
 * Runs a password check under the sign-in throttles. While blocked it throws Throttled before
 * any password is compared. `verify` answers null for a wrong password, which is counted; any
 * other answer clears this account's count from this client.
 */
export async function throttledPasswordCheck<T>(client: string, email: string, verify: () => Promise<T | null>): Promise<T | null> {
  const accountClient = `${email}|${client}`;
  const [byAccountClient, byAccount, byClient] = await Promise.all([
    accountClientFails().get(accountClient),
    accountFails().get(email),
    clientFails().get(client),
  ]);
  const accountWait = Math.max(blockedFor(byAccountClient, SIGN_IN_LIMITS.perAccountClient - 1), blockedFor(byAccount, SIGN_IN_LIMITS.perAccount - 1));
  if (accountWait > 0) throw new Throttled(accountThrottledMessage(accountWait), Math.ceil(accountWait / 1000));
  const clientWait = blockedFor(byClient, SIGN_IN_LIMITS.perClient - 1);
  if (clientWait > 0) {
    throw new Throttled(`Too many failed sign-ins from your network. Try again in ${minutes(clientWait)}.`, Math.ceil(clientWait / 1000));
  }
  const result = await verify();
  if (result === null) await countFailure(accountClient, email, client);
  else await Promise.all([accountClientFails().delete(accountClient), accountClientBlocks().delete(accountClient)]);
  return result;
}

async function countFailure(accountClient: string, email: string, client: string) {
  const [fails] = await Promise.all([accountClientFails().penalty(accountClient), accountFails().penalty(email), clientFails().penalty(client)]);
  if (fails.consumedPoints >= SIGN_IN_LIMITS.perAccountClient) {
    const blocks = await accountClientBlocks().penalty(accountClient);
    await accountClientFails().block(accountClient, blockSeconds(blocks.consumedPoints));
  }
}

/** After a reset by e-mail the owner has proved who they are: their account's counts start over. */
export async function clearSignInThrottle(client: string, email: string) {
  const accountClient = `${email}|${client}`;
  await Promise.all([accountClientFails().delete(accountClient), accountClientBlocks().delete(accountClient), accountFails().delete(email)]);
}

// --- Mail ----------------------------------------------------------------------------------
// Anonymous forms that send mail (password reset, sign-up) are limited per client, with a
// plain 429; and each address gets at most a few such mails an hour. Over the address's limit
// the form answers exactly as usual and sends nothing, so the limit reveals nothing either.
export const MAIL_LIMITS = { perClientHour: 20, perAddressHour: 3, invitationsPerUserHour: 20 } as const;
export type MailKind = "password-reset" | "sign-up" | "account-notice";

async function consume(rl: RateLimiterPostgres, key: string): Promise<number> {
  const res = await rl.penalty(key);
  return res.consumedPoints > rl.points ? res.msBeforeNext : 0;
}

/** Counts one anonymous mail form post from this client; Throttled when over the limit. */
export async function throttleMailForm(client: string) {
  const wait = await consume(limiter("mail-form-client", MAIL_LIMITS.perClientHour, HOUR), client);
  if (wait > 0) throw new Throttled(`Too many requests from your network. Try again in ${minutes(wait)}.`, Math.ceil(wait / 1000));
}

/** Whether another mail of this kind may go to this address now (counted when it may). */
export async function mayMail(kind: MailKind, address: string): Promise<boolean> {
  return (await consume(limiter(`mail-${kind}`, MAIL_LIMITS.perAddressHour, HOUR), address.toLowerCase())) === 0;
}

/** Invitations a signed-in person sends: enough for a team, not for a mailing list. */
export async function throttleInvitations(userId: string) {
  const wait = await consume(limiter("invitations-user", MAIL_LIMITS.invitationsPerUserHour, HOUR), userId);
  if (wait > 0) {
    throw new Throttled(
      `You have sent ${MAIL_LIMITS.invitationsPerUserHour} invitations in the last hour. Send more in ${minutes(wait)}.`,
      Math.ceil(wait / 1000),
    );
  }
}
