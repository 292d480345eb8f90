import type { Job } from "./scheduler";
import { purgeExpired } from "../auth/auth.service";

/** Every scheduled job the server runs. */
export const jobs: Job[] = [
  { name: "purge-expired-tokens", everyMs: 60 * 60 * 1000, run: purgeExpired },
];
