import { useSearchParams } from "react-router-dom";

/** List filters kept in the URL, so a filtered list can be bookmarked and shared. */
export function useFilterParams(): [URLSearchParams, (key: string, value: string) => void] {
  const [params, setParams] = useSearchParams();
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  return [params, set];
}
