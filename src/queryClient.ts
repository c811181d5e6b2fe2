import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api/errors';
import { queryKeys } from './api/keys';

/**
 * One QueryClient for the app. A 401 from any request means the session has gone
 * (expired, or signed out in another tab): mark "me" as signed out so the guard
 * sends the user to the sign-in page. Client errors (4xx) are never retried.
 */
export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (err, query) => onAuthLost(err, query.queryKey) }),
    mutationCache: new MutationCache({ onError: (err) => onAuthLost(err, null) }),
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        retry: (failures, err) => !(isApiError(err) && err.status < 500) && failures < 2,
        refetchOnWindowFocus: true,
      },
    },
  });

  function onAuthLost(err: unknown, key: readonly unknown[] | null) {
    if (!isApiError(err, 401)) return;
    if (key && key[0] === queryKeys.me[0]) return; // useMe already maps 401 to null
    if (err.code === 'invalid_credentials') return; // a failed sign-in, not a lost session
    client.setQueryData(queryKeys.me, null);
  }

  return client;
}
