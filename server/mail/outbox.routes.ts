import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { outboxKindsFor } from "../../shared/mail";
import { idParamSchema } from "../../shared/schemas/common";
import { outboxListQuerySchema } from "../../shared/schemas/outbox";
import { listOutbox, resend } from "./outbox.service";

/**
 * Outgoing mail: what was sent, what is waiting, what failed (and send it again). The owner sees all of it, the
 * bookkeeper invoices and receipts (shared/mail.ts outboxKindsFor).
 */
export function outboxRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow("owner", "bookkeeper"));
  const kindsOf = (req: Parameters<typeof currentUser>[0]) => outboxKindsFor(currentUser(req).role as "owner" | "bookkeeper");
  r.get("/", async (req, res) => {
    const { status } = parse(outboxListQuerySchema, req.query);
    res.json({ mails: await listOutbox(ctx, status, kindsOf(req)) });
  });
  r.post("/:id/resend", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    await resend(ctx, id, kindsOf(req));
    res.status(202).json({ queued: true });
  });
  return r;
}
