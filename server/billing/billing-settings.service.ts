import type { z } from "zod";
import type { AppContext } from "../http/context";
import { notFound } from "../http/errors";
import { Bakery } from "../bakery/bakery.entity";
import { getBakery } from "../bakery/bakery.service";
import { CustomerAccount } from "../accounts/account.entity";
import type { PaymentTerms } from "../../shared/billing";
import type { billingSettingsSchema } from "../../shared/schemas/billing";
import type { BillingSettingsDto, PaymentTermsResponse } from "../../shared/contracts/billing";

/** The bakery's billing settings: sales tax, invoice prefix, credit-hold days and payment instructions. */
export async function getBillingSettings(ctx: AppContext): Promise<BillingSettingsDto> {
  const b = await getBakery(ctx);
  return { salesTaxRateBp: b.salesTaxRateBp, invoicePrefix: b.invoicePrefix, creditHoldDays: b.creditHoldDays, paymentInstructions: b.paymentInstructions, remindersOn: b.remindersOn };
}

/** The owner saves them; the answer is what was saved. */
export async function saveBillingSettings(ctx: AppContext, input: z.output<typeof billingSettingsSchema>): Promise<BillingSettingsDto> {
  await ctx.dataSource.getRepository(Bakery).update({ id: (await getBakery(ctx)).id }, input);
  return getBillingSettings(ctx);
}

/** How an account pays: card on each invoice, or weekly statements on net terms (owner). */
export async function setPaymentTerms(ctx: AppContext, accountId: number, paymentTerms: PaymentTerms): Promise<PaymentTermsResponse> {
  const repo = ctx.dataSource.getRepository(CustomerAccount);
  if (!(await repo.existsBy({ id: accountId }))) throw notFound("That account");
  await repo.update({ id: accountId }, { paymentTerms });
  return { paymentTerms };
}
