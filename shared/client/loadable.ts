// Turns a query's result into the plain state that components/ui/loadable.tsx renders.
import type { UseQueryResult } from '@tanstack/react-query';

export function loadable<T>(query: UseQueryResult<T>) {
  return {
    data: query.data,
    isLoading: query.isPending,
    error: query.error,
    onRetry: () => void query.refetch(),
    isRetrying: query.isFetching,
  };
}
