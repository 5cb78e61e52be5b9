import { AUTH_CACHE_TTL_MS } from "@/lib/auth/auth-cache";
import { authCache } from "@/lib/auth/auth-memory";

/**
 * Resolves at this process's next clear of its memory of who a request is (a change made or a notification heard),
 * or rejects after the memory's TTL. Call it before the change, await it after: a change made through the test's
 * own connection reaches the app's memory the way another app process's change does, through NOTIFY.
 */
export function nextAuthClear(): Promise<void> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      stop();
      reject(new Error(`no change was heard within the ${AUTH_CACHE_TTL_MS} ms TTL`));
    }, AUTH_CACHE_TTL_MS);
    const stop = authCache.onClear(() => {
      clearTimeout(timer);
      stop();
      resolve();
    });
  });
}
