import { Bakery } from "../bakery/bakery.entity";
import { BakeryClosure } from "../calendar/closure.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { AuthToken } from "../auth/auth-token.entity";
import { AuthRateCounter } from "../auth/rate-counter.entity";
import { RateLimitPoints } from "../http/rate-limit-points.entity";
import { Product } from "../catalog/product.entity";
import { PriceList, PriceListItem } from "../catalog/price-list.entity";
import { ProductComponent } from "../catalog/product-component.entity";
import { IdempotencyRecord, Order, OrderLine } from "../orders/order.entity";
import { StandingOrder, StandingOrderLine } from "../orders/standing-order.entity";
import { BakeDay, BakehouseMixer, BakehouseOven, Formula, FormulaVersion, Ingredient, ProductionSettings } from "../production/production.entity";
import { OutboxMail } from "../mail/outbox.entity";
import { CheckoutSessionRecord, CreditNote, DeliveryAdjustment, Invoice, InvoiceLine, NumberCounter, Payment, PayoutReconciliation, Refund, StripeEventRecord, StripeSyncState, TaxCertificate } from "../billing/billing.entity";

/** Every entity, listed once: the DataSource, the CLI and the tests all take it from here. */
export const entities = [
  Bakery, BakeryClosure, CustomerAccount, User, AuthToken, AuthRateCounter, RateLimitPoints,
  Product, ProductComponent, PriceList, PriceListItem, Order, OrderLine, IdempotencyRecord, StandingOrder, StandingOrderLine,
  Ingredient, Formula, FormulaVersion, BakeDay, ProductionSettings, BakehouseMixer, BakehouseOven, OutboxMail,
  NumberCounter, Invoice, InvoiceLine, Payment, CreditNote, Refund, CheckoutSessionRecord, StripeEventRecord, StripeSyncState, PayoutReconciliation, TaxCertificate, DeliveryAdjustment,
];
