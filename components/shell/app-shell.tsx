import { AppHeader } from "@/components/shell/app-header";
import { currentUser } from "@/lib/auth/access";

/**
 * The signed-in shell: the app header (wordmark, the user's links) and the main column. `wide` gives
 * tables such as the gradebook the whole window width. No query client here: a page whose client components
 * query or mutate through react-query wraps them in QueryProvider, so the others load none of its code.
 */
export async function AppShell({ children, wide = false }: { children: React.ReactNode; wide?: boolean }) {
  const user = await currentUser();
  const width = wide ? "max-w-none" : "max-w-5xl";
  return (
    <div className="min-h-screen">
      <AppHeader user={user} wide={wide} />
      <main className={`mx-auto ${width} px-4 py-8`}>
        {children}
      </main>
    </div>
  );
}
