import { useEffect, useMemo, useState } from "react";
import { useBakeryQuery } from "../api/bakery";

/**
 * How far this device's clock is from the server's, from the bakery answer's `now` and the moment it
 * arrived. Latency makes it a little late, never by more than the request took.
 */
export function clockSkew(serverNow: string | undefined, receivedAt: number): number {
  if (!serverNow || !receivedAt) return 0;
  const t = Date.parse(serverNow);
  return Number.isNaN(t) ? 0 : t - receivedAt;
}

/**
 * "Now" by the server's clock (the device's clock corrected for skew), updated every `tickMs`
 * (default once a second) for live countdowns.
 */
export function useServerNow(tickMs = 1000): number {
  const bakery = useBakeryQuery();
  const skew = useMemo(() => clockSkew(bakery.data?.now, bakery.dataUpdatedAt), [bakery.data?.now, bakery.dataUpdatedAt]);
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), tickMs);
    return () => clearInterval(t);
  }, [tickMs]);
  return now + skew;
}
