import { AsyncLocalStorage } from 'node:async_hooks';
import type { Sequelize } from 'sequelize';

/**
 * SQLite through Sequelize has one connection per database, so two requests' transactions
 * overlapped on it: the second BEGIN failed ("cannot start a transaction within a
 * transaction"), the first COMMIT then found no transaction, and both answered 500 — and a
 * query of a third request could run inside someone else's transaction and be rolled back with
 * it. Here managed transactions take turns, and while one is open or waiting, queries from
 * outside it wait their turn too. Inside a transaction's callback (the same async context)
 * everything runs at once, as before. PostgreSQL has a connection pool and real isolation: not
 * applied there.
 */
export function serializeSqliteTransactions(sequelize: Sequelize): void {
  const inside = new AsyncLocalStorage<true>();
  let tail: Promise<unknown> = Promise.resolve();
  let pending = 0;
  const exclusive = <T>(f: () => Promise<T>): Promise<T> => {
    pending++;
    const run = tail.then(() => f(), () => f());
    tail = run.then(
      () => { pending--; },
      () => { pending--; },
    );
    return run;
  };

  type Fn = (...args: unknown[]) => Promise<unknown>;
  const s = sequelize as unknown as { transaction: Fn; query: Fn };
  const transaction = s.transaction.bind(sequelize);
  const query = s.query.bind(sequelize);
  s.transaction = (...args: unknown[]) => {
    const managed = args.some((a) => typeof a === 'function');
    if (!managed || inside.getStore()) return transaction(...args);
    return exclusive(() => inside.run(true, () => transaction(...args)));
  };
  s.query = (...args: unknown[]) => {
    if (pending === 0 || inside.getStore()) return query(...args);
    return exclusive(() => query(...args));
  };
}
