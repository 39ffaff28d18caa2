"use server";
// "Sign out" in the header, as a server action: next-auth keeps a session in its signed cookie alone (JWT
// sessions), so signing out on this device is expiring that cookie. A plain form posts it (no
// next-auth client code in every page's JavaScript, and it works before the page has hydrated); Next.js
// checks the action's Origin. "Sign out on every device" (settings) revokes the other copies.
import { cookies } from "next/headers";
import { redirect } from "next/navigation";

const SESSION_COOKIE = /^(__Secure-)?next-auth\.session-token(\.\d+)?$/;

export async function signOutHere(): Promise<void> {
  const jar = await cookies();
  for (const { name } of jar.getAll()) {
    if (SESSION_COOKIE.test(name)) jar.set(name, "", { path: "/", maxAge: 0, httpOnly: true, sameSite: "lax", secure: name.startsWith("__Secure-") });
  }
  redirect("/signin");
}
