// Reads part of an editor store in React, re-rendering only when that part changes.
import { useCallback, useRef, useSyncExternalStore } from 'react';
import type { Store } from '../session/store';

export function useStore<T extends object, S>(store: Store<T>, select: (value: T) => S): S {
  const last = useRef<{ value: T; selected: S } | null>(null);
  const get = useCallback(() => {
    const value = store.get();
    if (last.current && last.current.value === value) return last.current.selected;
    const selected = select(value);
    if (last.current && Object.is(last.current.selected, selected)) {
      last.current = { value, selected: last.current.selected };
      return last.current.selected;
    }
    last.current = { value, selected };
    return selected;
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [store]);
  return useSyncExternalStore(store.subscribe, get, get);
}
