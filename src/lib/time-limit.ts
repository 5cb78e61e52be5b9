/**
 * Waits for `promise` at most `ms`: its value, or `fallback` once the time is up (the promise then runs on,
 * unwatched). The timer is cleared when the promise settles first, so nothing waits on it afterwards.
 */
export async function settledWithin<T, F>(promise: Promise<T>, ms: number, fallback: F): Promise<T | F> {
  let timer: NodeJS.Timeout | undefined;
  try {
    return await Promise.race([
      promise,
      new Promise<F>((resolve) => {
        timer = setTimeout(resolve, ms, fallback);
      }),
    ]);
  } finally {
    clearTimeout(timer);
  }
}
