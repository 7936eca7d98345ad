import { AsyncLocalStorage, AsyncResource } from 'node:async_hooks';
import { Sequelize, type Transaction } from 'sequelize';

type Store = Map<string, unknown>;
const storage = new AsyncLocalStorage<Store>();

/**
 * The namespace Sequelize's CLS support expects (get, set, run, bind), on Node's AsyncLocalStorage.
 * Inside `sequelize.transaction(async () => …)` every query that does not name a transaction runs on that
 * transaction, so a forgotten `{ transaction }` can no longer take a second pooled connection and deadlock.
 */
const namespace = {
  run<T>(fn: (store: Store) => T): T {
    const store: Store = new Map(storage.getStore() ?? []);
    return storage.run(store, () => fn(store));
  },
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  bind<F extends (...args: any[]) => unknown>(fn: F): F {
    return AsyncResource.bind(fn) as F;
  },
  get(key: string): unknown {
    return storage.getStore()?.get(key);
  },
  set(key: string, value: unknown): void {
    storage.getStore()?.set(key, value);
  },
};

let enabled = false;
/** Turns the transaction context on for every Sequelize instance of this process (idempotent). */
export function enableTransactionContext(): void {
  if (enabled) return;
  Sequelize.useCLS(namespace);
  enabled = true;
}

/** The managed transaction the calling code runs in, if any (to act after it commits). */
export function currentTransaction(): Transaction | undefined {
  return namespace.get('transaction') as Transaction | undefined;
}
