import { useEffect, useState } from "react";

/** The value as it was when it last stood still for `ms` milliseconds: typing sends one request, not one a key. */
export function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}
