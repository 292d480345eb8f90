import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow } from "../http/auth";
import { ROLES } from "../../shared/roles";
import { getBillingSettings, saveBillingSettings, setPaymentTerms } from "./billing-settings.service";
import { billingSettingsSchema, idParamSchema, paymentTermsSchema, remindersSwitchSchema } from "../../shared/schemas/billing";
import { setRemindersOn } from "./reminders.service";
import type { BillingSettingsResponse, PaymentTermsResponse } from "../../shared/contracts/billing";

/** The bakery's billing settings: everyone signed in reads them, the owner changes them. */
export function billingSettingsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ROLES), async (_req, res) => {
    res.json({ settings: await getBillingSettings(ctx) } satisfies BillingSettingsResponse);
  });
  r.put("/", allow("owner"), async (req, res) => {
    const input = parse(billingSettingsSchema, req.body);
    res.json({ settings: await saveBillingSettings(ctx, input) } satisfies BillingSettingsResponse);
  });
  // The reminder schedule is the bookkeeper's to turn on too (chasing payment is their job).
  r.put("/reminders", allow("owner", "bookkeeper"), async (req, res) => {
    const { on } = parse(remindersSwitchSchema, req.body);
    await setRemindersOn(ctx, on);
    res.json({ settings: await getBillingSettings(ctx) } satisfies BillingSettingsResponse);
  });
  return r;
}

/** An account's payment terms (mounted at /accounts; owner). */
export function accountTermsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.put("/:id/terms", allow("owner"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const { paymentTerms } = parse(paymentTermsSchema, req.body);
    res.json((await setPaymentTerms(ctx, id, paymentTerms)) satisfies PaymentTermsResponse);
  });
  return r;
}
