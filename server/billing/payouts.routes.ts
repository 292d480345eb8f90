import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { listPayouts, payoutDetail, reconcilePayout, undoReconcile } from "./payouts.service";
import { aging, exportCsv } from "./reports.service";
import { OFFICE } from "./invoices.routes";
import { exportFileSchema, exportRangeSchema, payoutIdSchema, reconcileSchema, undoReconcileSchema } from "../../shared/schemas/billing";
import type { AgingResponse, PayoutDetailDto, PayoutListResponse } from "../../shared/contracts/billing";

/** The card processor's payouts to the bank, matched to Panwise's payments and refunds (office). */
export function payoutRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow(...OFFICE));
  r.get("/", async (_req, res) => {
    res.json({ payouts: await listPayouts(ctx) } satisfies PayoutListResponse);
  });
  r.get("/:id", async (req, res) => {
    const { id } = parse(payoutIdSchema, req.params);
    res.json((await payoutDetail(ctx, id)) satisfies PayoutDetailDto);
  });
  r.post("/:id/reconcile", async (req, res) => {
    const { id } = parse(payoutIdSchema, req.params);
    const { note, force } = parse(reconcileSchema, req.body);
    res.json((await reconcilePayout(ctx, currentUser(req), id, note, force)) satisfies PayoutDetailDto);
  });
  r.post("/:id/undo-reconcile", async (req, res) => {
    const { id } = parse(payoutIdSchema, req.params);
    const { reason } = parse(undoReconcileSchema, req.body);
    res.json((await undoReconcile(ctx, currentUser(req), id, reason)) satisfies PayoutDetailDto);
  });
  return r;
}

/** Aging and the CSV exports (office). */
export function reportRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow(...OFFICE));
  r.get("/aging", async (_req, res) => {
    res.json({ aging: await aging(ctx) } satisfies AgingResponse);
  });
  r.get("/exports/:file", async (req, res) => {
    const { file } = parse(exportFileSchema, req.params);
    const range = parse(exportRangeSchema, req.query);
    const name = range.from || range.to ? file.replace(".csv", `-${range.from ?? "start"}-to-${range.to ?? "now"}.csv`) : file;
    res.type("text/csv; charset=utf-8").attachment(name).send(await exportCsv(ctx, file, range));
  });
  return r;
}
