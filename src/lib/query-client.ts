import { isServer, QueryClient } from "@tanstack/react-query";

function makeQueryClient() {
  return new QueryClient({
    defaultOptions: {
      // Server-rendered data is fresh for a while; refetching at once would only repeat it.
      queries: { staleTime: 30_000, retry: 1 },
    },
  });
}

let browserClient: QueryClient | undefined;

/** One client per request on the server, one for the whole tab in the browser. */
export function getQueryClient(): QueryClient {
  if (isServer) return makeQueryClient();
  browserClient ??= makeQueryClient();
  return browserClient;
}
