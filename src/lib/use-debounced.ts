import { useEffect, useMemo, useRef } from "react";

/** `fn`, called once typing pauses for `ms`: a filter sends one request per pause, not one per key. */
export function useDebouncedCallback<A extends unknown[]>(fn: (...args: A) => void, ms = 300): (...args: A) => void {
  const latest = useRef(fn);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => {
    latest.current = fn;
  });
  useEffect(() => () => clearTimeout(timer.current), []);
  return useMemo(
    () =>
      (...args: A) => {
        clearTimeout(timer.current);
        timer.current = setTimeout(() => latest.current(...args), ms);
      },
    [ms],
  );
}
