"use server";
// "Sign out" in the header, as a server action: the session's row is deleted on the server (a copy of the
// cookie stops working at once) and the cookie expired on this device. A plain form posts it (no
// next-auth client code in every page's JavaScript, and it works before the page has hydrated); Next.js
// checks the action's Origin. The settings page ends the other sessions.
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { deleteSession } from "@/db/queries/sessions";
import { currentSessionId, currentUser } from "./access";

const SESSION_COOKIE = /^(__Secure-)?next-auth\.session-token(\.\d+)?$/;

export async function signOutHere(): Promise<void> {
  const [user, sessionId] = await Promise.all([currentUser(), currentSessionId()]);
  if (user && sessionId) await deleteSession(db, user.id, sessionId);
  const jar = await cookies();
  for (const { name } of jar.getAll()) {
    if (SESSION_COOKIE.test(name)) jar.set(name, "", { path: "/", maxAge: 0, httpOnly: true, sameSite: "lax", secure: name.startsWith("__Secure-") });
  }
  redirect("/signin");
}
