import { useSearchParams } from "react-router-dom";

/** List filters kept in the URL, so a filtered list can be bookmarked and shared. */
export function useFilterParams(): [URLSearchParams, (key: string, value: string) => void] {
  const [params, setParams] = useSearchParams();
  // From the latest URL, so a debounced call does not undo a filter changed meanwhile.
  const set = (key: string, value: string) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );
  return [params, set];
}
