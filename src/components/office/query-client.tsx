// One TanStack Query client per page, shared by every island on it, so saving in one island
// refreshes what the others show.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import { ApiError } from './api';

let client: QueryClient | undefined;

function queryClient() {
  client ??= new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        refetchOnWindowFocus: true,
        // A 4xx will not go away by asking again.
        retry: (failures, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && failures < 2,
      },
    },
  });
  return client;
}

/** Wraps an island so it can use queries; the server render gets its own client. */
export function island<P extends object>(Component: ComponentType<P>) {
  function Island(props: P) {
    const shared = typeof window === 'undefined' ? new QueryClient() : queryClient();
    return (
      <QueryClientProvider client={shared}>
        <Component {...props} />
      </QueryClientProvider>
    );
  }
  Island.displayName = `Island(${Component.displayName ?? Component.name})`;
  return Island;
}
