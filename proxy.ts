// Early redirect to the sign-in page for anonymous visitors. Authorization itself happens on the
// server in every page, action and route handler (lib/auth/access.ts).
import { withAuth } from "next-auth/middleware";

export default withAuth({ pages: { signIn: "/signin" } });

export const config = { matcher: ["/", "/courses/:path*", "/lessons/:path*"] };
