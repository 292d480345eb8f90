import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow } from "../http/auth";
import { idParamSchema } from "../../shared/schemas/common";
import { outboxListQuerySchema } from "../../shared/schemas/outbox";
import { listOutbox, resend } from "./outbox.service";

/** The owner's view of outgoing mail: what was sent, what is waiting, what failed (and send it again). */
export function outboxRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow("owner"));
  r.get("/", async (req, res) => {
    const { status } = parse(outboxListQuerySchema, req.query);
    res.json({ mails: await listOutbox(ctx, status) });
  });
  r.post("/:id/resend", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    await resend(ctx, id);
    res.status(202).json({ queued: true });
  });
  return r;
}
