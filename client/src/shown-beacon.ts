/**
 * Reports to the server, once per load, that the finder showed an answer it worked out in the browser: only after the
 * rider has paused typing (`settleMs`), or at once when they act on it (add to cart, leave the page). An answer the
 * server itself served for a load is already counted there, so that load is not reported again.
 */
export function createShownBeacon(send: (fitmentId: string) => Promise<unknown>, settleMs = 1_500) {
  const reported = new Set<string>();
  let pending: { key: string; fitmentId: string } | null = null;
  let timer: ReturnType<typeof setTimeout> | undefined;

  function flush(): void {
    clearTimeout(timer);
    if (!pending) return;
    reported.add(pending.key);
    void send(pending.fitmentId).catch(() => undefined);
    pending = null;
  }

  return {
    /** An answer for this load is on screen now. */
    shown(key: string, fitmentId: string): void {
      clearTimeout(timer);
      pending = reported.has(key) ? null : { key, fitmentId };
      if (pending) timer = setTimeout(flush, settleMs);
    },
    /** The server answered this load itself (and counted it). */
    servedByServer(key: string): void {
      reported.add(key);
      if (pending?.key === key) {
        clearTimeout(timer);
        pending = null;
      }
    },
    flush,
  };
}
