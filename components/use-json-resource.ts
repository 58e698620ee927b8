"use client";

import { useCallback, useState } from "react";
import { requestJson, messageOf } from "./api-client";

/** One resource read from a route handler: starts from what the server rendered, reloads on demand. */
export function useJsonResource<T, R>(url: string, initial: R, pick: (body: T) => R) {
  const [data, setData] = useState<R>(initial);
  const [loadError, setLoadError] = useState<string | null>(null);
  const reload = useCallback(async () => {
    try {
      setData(pick(await requestJson<T>(url)));
      setLoadError(null);
    } catch (error) {
      setLoadError(messageOf(error));
    }
    // `pick` is a pure selector given inline by callers; the URL identifies the resource.
  }, [url]);
  return { data, reload, loadError };
}
