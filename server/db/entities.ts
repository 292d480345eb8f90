import { Bakery } from "../bakery/bakery.entity";
import { BakeryClosure } from "../calendar/closure.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { AuthToken } from "../auth/auth-token.entity";
import { AuthRateCounter } from "../auth/rate-counter.entity";
import { RateLimitPoints } from "../http/rate-limit-points.entity";
import { Product } from "../catalog/product.entity";
import { PriceList } from "../catalog/price-list.entity";
import { PriceListItem } from "../catalog/price-list-item.entity";
import { ProductComponent } from "../catalog/product-component.entity";
import { Order } from "../orders/order.entity";
import { OrderLine } from "../orders/order-line.entity";
import { IdempotencyRecord } from "../orders/idempotency-record.entity";
import { StandingOrder } from "../orders/standing-order.entity";
import { StandingOrderLine } from "../orders/standing-order-line.entity";
import { Ingredient } from "../production/ingredient.entity";
import { Formula } from "../production/formula.entity";
import { FormulaVersion } from "../production/formula-version.entity";
import { BakeDay } from "../production/bake-day.entity";
import { ProductionSettings } from "../production/production-settings.entity";
import { BakehouseMixer } from "../production/bakehouse-mixer.entity";
import { BakehouseOven } from "../production/bakehouse-oven.entity";
import { OutboxMail } from "../mail/outbox.entity";
import { CheckoutSessionRecord } from "../billing/checkout-session.entity";
import { CreditNote } from "../billing/credit-note.entity";
import { DeliveryAdjustment } from "../billing/delivery-adjustment.entity";
import { Invoice } from "../billing/invoice.entity";
import { InvoiceLine } from "../billing/invoice-line.entity";
import { NumberCounter } from "../billing/number-counter.entity";
import { Payment } from "../billing/payment.entity";
import { PayoutReconciliation } from "../billing/payout-reconciliation.entity";
import { Refund } from "../billing/refund.entity";
import { StripeEventRecord } from "../billing/stripe-event.entity";
import { StripeSyncState } from "../billing/stripe-sync-state.entity";
import { TaxCertificate } from "../billing/tax-certificate.entity";
import { InvoiceReminder } from "../billing/invoice-reminder.entity";
import { PayoutReconciliationEvent } from "../billing/payout-reconciliation-event.entity";

/** Every entity, listed once: the DataSource, the CLI and the tests all take it from here. */
export const entities = [
  Bakery, BakeryClosure, CustomerAccount, User, AuthToken, AuthRateCounter, RateLimitPoints,
  Product, ProductComponent, PriceList, PriceListItem, Order, OrderLine, IdempotencyRecord, StandingOrder, StandingOrderLine,
  Ingredient, Formula, FormulaVersion, BakeDay, ProductionSettings, BakehouseMixer, BakehouseOven, OutboxMail,
  NumberCounter, Invoice, InvoiceLine, Payment, CreditNote, Refund, CheckoutSessionRecord, StripeEventRecord, StripeSyncState, PayoutReconciliation, TaxCertificate, DeliveryAdjustment, InvoiceReminder, PayoutReconciliationEvent,
];
