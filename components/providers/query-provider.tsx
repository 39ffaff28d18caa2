"use client";
// The @tanstack/react-query client. Not in a layout: each page whose client components query or mutate
// wraps them in <QueryProvider> (the server page renders it around them), so a page without any, such as
// a student's lab page or a lesson, loads no react-query code. One client per server render, one for the
// whole browser session (shared by every provider on the page), as Next.js's guide to TanStack Query sets
// it up. Queries fetch through lib/http/client.ts.
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import type { ReactNode } from "react";
import { isApiError } from "@/lib/http/client";

function makeClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        // Pages read fresh data on the server; the browser does not refetch on every focus.
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        // A 4xx will not change on a retry; a dropped connection or a 5xx may.
        retry: (failures, e) => failures < 2 && !(isApiError(e) && e.status >= 400 && e.status < 500),
      },
      mutations: { retry: false },
    },
  });
}

let browserClient: QueryClient | undefined;

function getClient() {
  if (typeof window === "undefined") return makeClient();
  browserClient ??= makeClient();
  return browserClient;
}

export function QueryProvider({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={getClient()}>{children}</QueryClientProvider>;
}
