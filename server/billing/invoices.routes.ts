import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import * as invoices from "./invoices.service";
import { remindAllOverdue, remindInvoice } from "./reminders.service";
import { confirmDispatch } from "./dispatch.service";
import { dispatchConfirmSchema, dispatchDateSchema, idParamSchema, invoiceListQuerySchema, statementsSchema } from "../../shared/schemas/billing";
import type { DispatchResponse, InvoiceDetailDto, InvoiceListDto, RemindAllResponse, StatementsResponse } from "../../shared/contracts/billing";

export const OFFICE = ["owner", "bookkeeper"] as const;

/** A day's dispatch confirmed: its orders delivered, card accounts invoiced at once. */
export function deliveryRoutes(ctx: AppContext): Router {
  const r = Router();
  r.post("/:date/confirm", allow("owner", "baker"), async (req, res) => {
    const { date } = parse(dispatchDateSchema, req.params);
    const { adjustments } = parse(dispatchConfirmSchema, req.body);
    res.json({ result: await confirmDispatch(ctx, date, adjustments) } satisfies DispatchResponse);
  });
  return r;
}

/** Invoices: the list, statements by hand, one invoice and its PDF. Payments on an invoice: payments.routes.ts. */
export function invoiceRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...OFFICE, "buyer"), async (req, res) => {
    res.json((await invoices.listInvoices(ctx, currentUser(req), parse(invoiceListQuerySchema, req.query))) satisfies InvoiceListDto);
  });
  r.post("/reminders", allow(...OFFICE), async (req, res) => {
    res.json((await remindAllOverdue(ctx, currentUser(req))) satisfies RemindAllResponse);
  });
  r.post("/:id/reminders", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.status(201).json({ reminder: await remindInvoice(ctx, currentUser(req), id) });
  });
  r.post("/statements", allow(...OFFICE), async (req, res) => {
    const { through } = parse(statementsSchema, req.body);
    res.json((await invoices.issueStatementsByHand(ctx, through)) satisfies StatementsResponse);
  });
  r.get("/:id", allow(...OFFICE, "buyer"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json((await invoices.getInvoiceFor(ctx, currentUser(req), id)) satisfies InvoiceDetailDto);
  });
  r.get("/:id/pdf", allow(...OFFICE, "buyer"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const { filename, pdf } = await invoices.invoicePdfFor(ctx, currentUser(req), id);
    res.type("application/pdf").set("Content-Disposition", `inline; filename="${filename}"`).send(pdf);
  });
  return r;
}
