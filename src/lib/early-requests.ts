// Requests started by src/early.ts before the app's code arrived: the API client takes each over once,
// so the first page's data travels while the code downloads. Later requests always go to the network.
declare global {
  interface Window {
    __rackturnEarly?: Record<string, Promise<Response>>;
  }
}

/** The early response for this exact URL, if one was started and not yet taken. */
export function takeEarly(url: string): Promise<Response> | undefined {
  const early = typeof window === 'undefined' ? undefined : window.__rackturnEarly;
  const res = early?.[url];
  if (res) delete early[url];
  return res;
}
