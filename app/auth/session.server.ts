import { createCookie, createSessionStorage, redirect, type Session } from "react-router";
import { Op, Sequelize } from "sequelize";
import { env } from "~/env.server";
import { UserSession } from "~/models/index.server";
import { oncePerRequest } from "~/http/request-scope.server";
import { hashToken, newToken } from "~/services/tokens.server";

type SessionData = { userId: string; userAgent: string };
type SessionFlash = { toast: string };
type AppSession = Session<SessionData, SessionFlash>;

const secure = env().APP_URL.startsWith("https://");
const maxAgeS = env().SESSION_MAX_DAYS * 86_400;
/** A visitor's session only carries a message to the next page. */
const VISITOR_SESSION_MS = 3_600_000;
/** last_seen_at is written at most this often, not on every request. */
const TOUCH_EVERY_MS = 60_000;

// The cookie carries only the session's random id, signed; httpOnly and SameSite=Lax as before.
// Over https the __Host- prefix pins it to this host, path / and Secure.
const cookie = createCookie(secure ? "__Host-tenderflow" : "tenderflow", {
  httpOnly: true,
  sameSite: "lax",
  path: "/",
  secrets: [env().SESSION_SECRET],
  secure,
  maxAge: maxAgeS,
});

const TOKEN = /^[\w-]{43}$/;
const live = () => ({
  revokedAt: null,
  expiresAt: { [Op.gt]: Sequelize.fn("now") },
  [Op.or]: [{ userId: null }, { lastSeenAt: { [Op.gt]: Sequelize.literal(`now() - interval '${env().SESSION_IDLE_MINUTES} minutes'`) } }],
});

function split(data: Record<string, unknown>) {
  const { userId, userAgent, ...rest } = data;
  return { userId: typeof userId === "string" ? userId : null, userAgent: typeof userAgent === "string" ? userAgent.slice(0, 300) : null, rest };
}

// The framework's session API over the `sessions` table. A session is live until signed out,
// revoked, idle for SESSION_IDLE_MINUTES or SESSION_MAX_DAYS old, all by the database's clock.
const storage = createSessionStorage<SessionData, SessionFlash>({
  cookie,
  async createData(data) {
    const { token, tokenHash } = newToken();
    const { userId, userAgent, rest } = split(data);
    const expiresAt = new Date(Date.now() + (userId ? maxAgeS * 1000 : VISITOR_SESSION_MS));
    await UserSession.create({ id: tokenHash, userId, userAgent, data: rest, expiresAt, revokedAt: null });
    if (Math.random() < 0.05) await UserSession.purgeEnded();
    return token;
  },
  async readData(token) {
    if (typeof token !== "string" || !TOKEN.test(token)) return null;
    const row = await UserSession.findOne({ where: { id: hashToken(token), ...live() } });
    if (!row) return null;
    if (row.userId && Date.now() - row.lastSeenAt.getTime() > TOUCH_EVERY_MS) {
      await UserSession.update({ lastSeenAt: new Date() }, { where: { id: row.id, revokedAt: null } });
    }
    return { ...row.data, ...(row.userId ? { userId: row.userId } : {}), ...(row.userAgent ? { userAgent: row.userAgent } : {}) };
  },
  async updateData(token, data) {
    if (!TOKEN.test(token)) return;
    const { rest } = split(data);
    // Never brings back a revoked session, and never changes whose session it is.
    await UserSession.update({ data: rest }, { where: { id: hashToken(token), revokedAt: null } });
  },
  async deleteData(token) {
    if (!TOKEN.test(token)) return;
    await UserSession.update({ revokedAt: new Date() }, { where: { id: hashToken(token), revokedAt: null } });
  },
});

// The root loader and the page's loader ask for the same request's session: read it once.
const SESSION = Symbol("session");

function getSession(request: Request): Promise<AppSession> {
  return oncePerRequest(SESSION, request, () => storage.getSession(request.headers.get("Cookie")));
}

export async function getSessionUserId(request: Request): Promise<string | undefined> {
  return (await getSession(request)).get("userId");
}

/** The browser sent a session cookie (live or not). */
export async function hasSessionCookie(request: Request) {
  return Boolean(await cookie.parse(request.headers.get("Cookie")));
}

/**
 * Starts a signed-in session and redirects. The browser's old session ends and a new id is
 * issued, so an id planted before sign-in is worth nothing after it.
 */
export async function signInRedirect(request: Request, userId: string, to: string) {
  const old = await getSession(request);
  if (old.id) await storage.destroySession(old);
  const session = await storage.getSession();
  session.set("userId", userId);
  session.set("userAgent", request.headers.get("User-Agent") ?? "");
  return redirect(to, { headers: { "Set-Cookie": await storage.commitSession(session) } });
}

/** Ends this browser's session; with a toast, a fresh visitor's session carries it to `to`. */
export async function signOutRedirect(request: Request, to = "/", toast?: string) {
  const session = await getSession(request);
  const cleared = await storage.destroySession(session);
  if (!toast) return redirect(to, { headers: { "Set-Cookie": cleared } });
  const visitor = await storage.getSession();
  visitor.flash("toast", toast);
  return redirect(to, { headers: { "Set-Cookie": await storage.commitSession(visitor) } });
}

/** A one-time message shown on the next page (e.g. "Invitation sent"). */
export async function redirectWithToast(request: Request, to: string, toast: string) {
  const current = await getSession(request);
  // A visitor's cookie may name an ended session, where the message would be lost: start afresh.
  const session = current.has("userId") ? current : await storage.getSession();
  session.flash("toast", toast);
  return redirect(to, { headers: { "Set-Cookie": await storage.commitSession(session) } });
}

export async function popToast(request: Request) {
  const session = await getSession(request);
  const toast = session.get("toast") ?? null;
  return { toast, headers: toast ? { "Set-Cookie": await storage.commitSession(session) } : undefined };
}

/** Ends every session of the user, this browser's included. */
export function signOutEverywhere(userId: string) {
  return UserSession.revokeAllOf(userId);
}

export interface SessionView {
  current: boolean;
  userAgent: string | null;
  createdAt: string;
  lastSeenAt: string;
}

/** The user's live sessions, newest activity first, marking this browser's. */
export async function liveSessionsOf(request: Request, userId: string): Promise<SessionView[]> {
  const session = await getSession(request);
  const currentId = session.id && TOKEN.test(session.id) ? hashToken(session.id) : null;
  const rows = await UserSession.findAll({ where: { userId, ...live() }, order: [["lastSeenAt", "DESC"]], limit: 50 });
  return rows.map((row) => ({
    current: row.id === currentId,
    userAgent: row.userAgent,
    createdAt: row.createdAt.toISOString(),
    lastSeenAt: row.lastSeenAt.toISOString(),
  }));
}
