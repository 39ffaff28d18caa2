import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { AccountSwitch } from "@/components/admin/account-switch";
import { forPage, refused, requireAdmin } from "@/lib/auth/access";
import { findAccounts } from "@/lib/auth/accounts";
import { userSearchSchema } from "@/lib/validation/admin";

export const metadata: Metadata = { title: "Accounts" };
export const dynamic = "force-dynamic";

const ROLE: Record<string, string> = { student: "student", ta: "teaching assistant", instructor: "instructor" };

export default async function AccountsPage({ searchParams }: { searchParams: Promise<{ query?: string | string[] }> }) {
  const admin = await forPage(requireAdmin(), "/admin/users");
  if (refused(admin)) forbidden();
  const raw = (await searchParams).query;
  const parsed = userSearchSchema.safeParse({ query: typeof raw === "string" ? raw : undefined });
  const query = parsed.success ? parsed.data.query : "";
  const users = parsed.success && !/[\u0000-\u001f\u007f-\u009f]/.test(query) ? await findAccounts(query) : [];
  return (
    <>
      <h1 className="text-3xl">Accounts</h1>
      <p className="mt-1 max-w-prose text-sm text-ink-soft">
        Find an account by name or e-mail address. A disabled account is signed out everywhere at once and cannot sign in; its person is told to
        contact the course staff. Its attempts and grades stay.
      </p>
      <form method="get" role="search" className="mt-4 flex max-w-lg flex-wrap items-end gap-2">
        <div className="min-w-0 flex-1">
          <label htmlFor="account-query" className="field-label">
            Name or e-mail
          </label>
          <input id="account-query" name="query" type="search" defaultValue={query} maxLength={200} className="field-input" />
        </div>
        <button type="submit" className="btn-primary">
          Find
        </button>
      </form>
      {!parsed.success ? <p className="mt-3 text-sm text-verdict-wrong">{parsed.error.issues[0]?.message}</p> : null}
      <p className="mt-4 text-sm text-ink-soft" role="status">
        {users.length === 0 ? "No account matches." : `${users.length === 50 ? "The first 50" : users.length} account${users.length === 1 ? "" : "s"}${query ? ` matching “${query}”` : ""}.`}
      </p>
      <ul className="mt-3 space-y-3">
        {users.map((u) => (
          <li key={u.id} className="card flex flex-wrap items-center justify-between gap-3" data-testid="account">
            <div className="min-w-0">
              <p className="break-words font-medium">
                {u.name}
                {u.isAdmin ? <span className="ml-2 text-sm font-normal text-ink-soft">site admin</span> : null}
                {u.disabled ? <span className="ml-2 text-sm font-semibold text-verdict-wrong">disabled</span> : null}
              </p>
              <p className="break-all font-mono text-xs">{u.email}</p>
              <p className="mt-1 text-sm text-ink-soft">
                {u.courses.length ? u.courses.map((c) => `${c.code} (${ROLE[c.role] ?? c.role})`).join(", ") : "In no course"}
              </p>
            </div>
            {u.id === admin.id ? <span className="text-sm text-ink-soft">You</span> : <AccountSwitch userId={u.id} name={u.name} disabled={u.disabled} />}
          </li>
        ))}
      </ul>
    </>
  );
}
