// A small observable value for React's useSyncExternalStore: get, set (shallow merge), subscribe.
export class Store<T extends object> {
  private listeners = new Set<() => void>();

  constructor(private value: T) {}

  get = (): T => this.value;

  set(patch: Partial<T> | ((current: T) => Partial<T>)): void {
    const next = typeof patch === 'function' ? patch(this.value) : patch;
    let changed = false;
    for (const key of Object.keys(next) as (keyof T)[]) if (this.value[key] !== next[key]) changed = true;
    if (!changed) return;
    this.value = { ...this.value, ...next };
    for (const l of [...this.listeners]) l();
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };
}
