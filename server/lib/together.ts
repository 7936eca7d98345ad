import type { Transaction } from 'sequelize';

type Thunks = readonly (() => Promise<unknown>)[];
type Results<T extends Thunks> = { [K in keyof T]: Awaited<ReturnType<T[K]>> };

/** Runs independent reads together, or one after another on a transaction's single connection. */
export async function together<T extends Thunks>(transaction: Transaction | undefined, steps: T): Promise<Results<T>> {
  if (!transaction) return (await Promise.all(steps.map((step) => step()))) as Results<T>;
  const out: unknown[] = [];
  for (const step of steps) out.push(await step());
  return out as Results<T>;
}
