/**
 * Lets tests wait for something a local fake has yet to receive (an e-mail, an SMS): each
 * arrival wakes the waiters, and each waiter looks again for what it wants.
 */
export class Waiters {
  private waiting = new Set<() => void>();

  /** Resolves with the first thing `find` returns, checking now and after every arrival. */
  waitFor<T>(find: () => T | undefined, timeoutMs: number, what: string): Promise<T> {
    return new Promise((resolve, reject) => {
      const check = () => {
        const found = find();
        if (found === undefined) return false;
        cleanup();
        resolve(found);
        return true;
      };
      const timer = setTimeout(() => {
        cleanup();
        reject(new Error(`no matching ${what} arrived in time`));
      }, timeoutMs);
      const cleanup = () => {
        clearTimeout(timer);
        this.waiting.delete(wake);
      };
      const wake = () => void check();
      if (!check()) this.waiting.add(wake);
    });
  }

  /** Something arrived. */
  wake() {
    for (const wake of [...this.waiting]) wake();
  }
}
