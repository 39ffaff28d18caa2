import type { Metadata } from "next";
import localFont from "next/font/local";
import { connection } from "next/server";
import "katex/dist/katex.min.css";
import "./globals.css";

const figtree = localFont({
  src: "./fonts/figtree-latin-wght-normal.woff2",
  variable: "--font-figtree",
  display: "swap",
  weight: "300 900",
});

export const metadata: Metadata = {
  title: { default: "Shuntwise", template: "%s · Shuntwise" },
  description: "Bench labs for measuring small currents, graded by recomputing the physics.",
  icons: {
    icon: [
      { url: "/icon.svg", type: "image/svg+xml" },
      { url: "/favicon-32.png", sizes: "32x32", type: "image/png" },
    ],
    apple: "/apple-touch-icon.png",
  },
  manifest: "/manifest.webmanifest",
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request: its scripts carry that request's nonce (see proxy.ts).
  await connection();
  return (
    <html lang="en" className={figtree.variable}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
