import createMDX from "@next/mdx";

/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate build folder lets tests or a second checkout build without touching the served one.
  distDir: process.env.SHUNTWISE_DIST_DIR || ".next",
  pageExtensions: ["ts", "tsx", "md", "mdx"],
  serverExternalPackages: ["pg", "pg-boss", "@node-rs/argon2", "nodemailer", "s3rver", "smtp-server"],
  poweredByHeader: false,
  // `forbidden()` from next/navigation: a page a member's role does not allow answers 403.
  experimental: { authInterrupts: true },
  // Pages get their headers (with a per-request script nonce) from proxy.ts. The proxy does not run for
  // the API (so request bodies reach the route handlers as streams, unbuffered) or for built files;
  // these get fixed headers here.
  async headers() {
    const common = [
      { key: "X-Content-Type-Options", value: "nosniff" },
      { key: "Referrer-Policy", value: "same-origin" },
    ];
    return [
      {
        source: "/api/:path*",
        headers: [
          ...common,
          { key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
      { source: "/_next/:path*", headers: common },
    ];
  },
};

const withMDX = createMDX({
  options: {
    // Under Turbopack the plugins are named as strings so the options stay serialisable.
    // remark-gfm: GitHub-flavoured tables (and strikethrough, autolinks) in the lessons.
    remarkPlugins: ["remark-gfm", "remark-math"],
    rehypePlugins: [["rehype-katex", { strict: false, output: "html" }]],
  },
});

export default withMDX(nextConfig);
