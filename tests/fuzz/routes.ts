import { buildContext } from "../../server/context";
import { listApiRoutes } from "../../server/app";

/** Every API route as "METHOD /api/path", read off the server's own router (nothing connects). */
export function apiRouteList(): string[] {
  const ctx = buildContext();
  try {
    return listApiRoutes(ctx);
  } finally {
    ctx.mailer.close();
  }
}
