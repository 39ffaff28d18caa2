import { signOutHere } from "@/lib/auth/sign-out";

/** Signs out on this device through a server action (a plain form: no client code of its own). */
export function SignOutButton() {
  return (
    <form action={signOutHere} className="contents">
      <button type="submit" className="btn-quiet py-1">
        Sign out
      </button>
    </form>
  );
}
