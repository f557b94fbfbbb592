// The one auth module: Lucia v3 sessions on the Drizzle adapter. Everything else asks this file
// who is signed in; keep Lucia's surface here so it can be replaced by its documented pattern.
import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { Lucia, TimeSpan, type Session, type User } from "lucia";
import { cookies } from "next/headers";
import { cache } from "react";
import { getDb } from "@/db/client";
import { sessions, users, type UserRole } from "@/db/schema";
import { isHttpsApp } from "./config";

let instance: Lucia<Record<never, never>, DatabaseUserAttributes> | null = null;

function lucia() {
  instance ??= new Lucia(new DrizzlePostgreSQLAdapter(getDb(), sessions, users), {
    sessionExpiresIn: new TimeSpan(12, "h"),
    sessionCookie: {
      name: "loopwright_session",
      expires: false,
      // httpOnly is always set by Lucia; sameSite lax; secure whenever the public URL is https.
      attributes: { secure: isHttpsApp(), sameSite: "lax" },
    },
    getUserAttributes: (row) => ({
      email: row.email,
      displayName: row.displayName,
      role: row.role,
      status: row.status,
      organizationId: row.organizationId,
    }),
  });
  return instance;
}

interface DatabaseUserAttributes {
  email: string;
  // the adapter hands over the Drizzle row, so these are the schema's field names
  displayName: string;
  role: UserRole;
  status: "active" | "deactivated";
  organizationId: string;
}

declare module "lucia" {
  interface Register {
    Lucia: Lucia<Record<never, never>, DatabaseUserAttributes>;
    DatabaseUserAttributes: DatabaseUserAttributes;
  }
}

export type SignedInUser = User & {
  email: string;
  displayName: string;
  role: UserRole;
  status: "active" | "deactivated";
  organizationId: string;
};

async function writeCookie(cookie: { name: string; value: string; attributes: object }) {
  const jar = await cookies();
  jar.set(cookie.name, cookie.value, cookie.attributes);
}

/** Starts a session for the user and sets its cookie (server actions and route handlers only). */
export async function startSession(userId: string): Promise<void> {
  const session = await lucia().createSession(userId, {});
  await writeCookie(lucia().createSessionCookie(session.id));
}

/** The signed-in user and session of this request, or nulls; a deactivated user counts as signed out. */
export const currentSession = cache(async (): Promise<{ user: SignedInUser; session: Session } | { user: null; session: null }> => {
  const jar = await cookies();
  const sessionId = jar.get(lucia().sessionCookieName)?.value ?? null;
  if (!sessionId) return { user: null, session: null };
  const result = await lucia().validateSession(sessionId);
  try {
    // Server components cannot set cookies; actions and route handlers refresh them here.
    if (result.session?.fresh) await writeCookie(lucia().createSessionCookie(result.session.id));
    if (!result.session) await writeCookie(lucia().createBlankSessionCookie());
  } catch {
    /* rendering a server component */
  }
  if (!result.user || (result.user as SignedInUser).status !== "active") return { user: null, session: null };
  return result as { user: SignedInUser; session: Session };
});

/** Ends this request's session on the server and clears the cookie. */
export async function endCurrentSession(): Promise<void> {
  const { session } = await currentSession();
  if (session) await lucia().invalidateSession(session.id);
  await writeCookie(lucia().createBlankSessionCookie());
}

/** Ends every session of a user (password reset, deactivation). */
export async function endAllSessionsOf(userId: string): Promise<void> {
  await lucia().invalidateUserSessions(userId);
}
