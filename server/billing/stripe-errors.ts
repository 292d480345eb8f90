import { HttpError } from "../http/errors";

/** Stripe could not be asked (network, or its API failing): the caller answers 503 so the person or Stripe tries again. */
export const isConnectionError = (err: unknown) => {
  const e = err as { type?: string; code?: string };
  return e?.type === "StripeConnectionError" || e?.type === "StripeAPIError" || e?.code === "ECONNREFUSED";
};
export const unavailable = () => new HttpError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was charged; please try again in a minute.");
/** Stripe answered that the object does not exist. */
export const isMissing = (err: unknown) => (err as { code?: string; statusCode?: number })?.code === "resource_missing" || (err as { statusCode?: number })?.statusCode === 404;
