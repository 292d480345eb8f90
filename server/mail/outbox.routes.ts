import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow } from "../http/auth";
import { idSchema } from "../../shared/schemas/common";
import { listOutbox, resend } from "./outbox.service";

/** The owner's view of outgoing mail: what was sent, what is waiting, what failed (and send it again). */
export function outboxRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow("owner"));
  r.get("/", async (req, res) => {
    const { status } = parse(z.object({ status: z.enum(["pending", "sending", "sent", "failed"]).optional() }), req.query);
    res.json({ mails: await listOutbox(ctx, status) });
  });
  r.post("/:id/resend", async (req, res) => {
    const { id } = parse(z.object({ id: idSchema }), req.params);
    await resend(ctx, id);
    res.status(202).json({ queued: true });
  });
  return r;
}
