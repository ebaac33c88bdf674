// Shows one of loading, error (with retry) or the content, from a query's state.
import type { ReactNode } from 'react';
import { errorMessage } from './format';
import { ErrorState, LoadingState } from './states';

export interface LoadableState<T> {
  data: T | undefined;
  isLoading: boolean;
  error: unknown;
  onRetry: () => void;
  isRetrying?: boolean;
}

export interface LoadableProps<T> {
  state: LoadableState<T>;
  loadingLabel?: string;
  errorTitle?: string;
  children: (data: T) => ReactNode;
  testID?: string;
}

export function Loadable<T>({ state, loadingLabel, errorTitle, children, testID }: LoadableProps<T>) {
  if (state.data !== undefined) return <>{children(state.data)}</>;
  if (state.error) {
    return (
      <ErrorState
        title={errorTitle}
        message={errorMessage(state.error)}
        onRetry={state.onRetry}
        retrying={state.isRetrying}
        testID={testID ? `${testID}-error` : undefined}
      />
    );
  }
  return <LoadingState label={loadingLabel} testID={testID ? `${testID}-loading` : undefined} />;
}
