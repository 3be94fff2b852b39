"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import type { ComponentType, ReactNode } from "react";

function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: 15_000, retry: 1, refetchOnWindowFocus: false },
    },
  });
}

/** One cache for the whole tab, kept across client-side navigations. */
let browserClient: QueryClient | undefined;

function getQueryClient(): QueryClient {
  // On the server every render gets its own client, so that no request sees another's cache.
  if (typeof window === "undefined") return makeQueryClient();
  browserClient ??= makeQueryClient();
  return browserClient;
}

/**
 * Gives the components below it the tab's query cache. Only the components that fetch with
 * queries or mutations use it, so pages without them do not load the query library at all.
 */
export function QueryProvider({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={getQueryClient()}>{children}</QueryClientProvider>;
}

/** Wraps a component that uses queries or mutations in {@link QueryProvider}. */
export function withQueryClient<P extends object>(Component: ComponentType<P>): ComponentType<P> {
  function WithQueryClient(props: P) {
    return (
      <QueryProvider>
        <Component {...props} />
      </QueryProvider>
    );
  }
  WithQueryClient.displayName = Component.displayName ?? Component.name;
  return WithQueryClient;
}
