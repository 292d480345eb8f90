import { createTestDatabase } from "./helpers/db";

/**
 * The billing tables' foreign keys (migration BillingForeignKeys): money rows refuse to lose what they point
 * at (ON DELETE RESTRICT); only an invoice's lines and a delivery adjustment go with their parent (CASCADE).
 */
let db: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => {
  db = await createTestDatabase();
}, 60_000);
afterAll(() => db?.drop());

const EXPECTED = [
  "checkout_session.invoiceId -> invoice RESTRICT",
  "credit_note.accountId -> customer_account RESTRICT",
  "credit_note.carriedToInvoiceId -> invoice RESTRICT",
  "credit_note.invoiceId -> invoice RESTRICT",
  "delivery_adjustment.creditNoteId -> credit_note RESTRICT",
  "delivery_adjustment.orderId -> customer_order CASCADE",
  "delivery_adjustment.productId -> product RESTRICT",
  "invoice.accountId -> customer_account RESTRICT",
  "invoice_line.invoiceId -> invoice CASCADE",
  "invoice_line.orderId -> customer_order RESTRICT",
  "invoice_line.orderLineId -> order_line RESTRICT",
  "payment.invoiceId -> invoice RESTRICT",
  "payment.recordedById -> user RESTRICT",
  "payout_reconciliation.reconciledById -> user RESTRICT",
  "refund.creditNoteId -> credit_note RESTRICT",
  "refund.invoiceId -> invoice RESTRICT",
  "stripe_event.invoiceId -> invoice RESTRICT",
  "tax_certificate.accountId -> customer_account RESTRICT",
  "tax_certificate.reviewedById -> user RESTRICT",
];
const BILLING_TABLES = ["checkout_session", "credit_note", "delivery_adjustment", "invoice", "invoice_line", "number_counter", "payment", "payout_reconciliation", "refund", "stripe_event", "stripe_sync_state", "tax_certificate"];

it("every id column of the billing tables is a foreign key, with the delete rule its meaning asks for", async () => {
  const rows: { t: string; c: string; rt: string; rule: string }[] = await db.dataSource.query(
    `SELECT k.TABLE_NAME AS t, k.COLUMN_NAME AS c, k.REFERENCED_TABLE_NAME AS rt, r.DELETE_RULE AS rule
       FROM information_schema.KEY_COLUMN_USAGE k
       JOIN information_schema.REFERENTIAL_CONSTRAINTS r ON r.CONSTRAINT_SCHEMA = k.CONSTRAINT_SCHEMA AND r.CONSTRAINT_NAME = k.CONSTRAINT_NAME
      WHERE k.TABLE_SCHEMA = DATABASE() AND k.TABLE_NAME IN (?)`, [BILLING_TABLES]);
  expect(rows.map((r) => `${r.t}.${r.c} -> ${r.rt} ${r.rule}`).sort()).toEqual(EXPECTED);
});

it("a payment, certificate or checkout session naming a missing invoice or account is refused by the database", async () => {
  const refused = (sql: string) => db.dataSource.query(sql).then(() => null, (err: { driverError?: { errno?: number }; errno?: number }) => err.driverError?.errno ?? err.errno);
  // MariaDB error 1452 ER_NO_REFERENCED_ROW_2: "Cannot add or update a child row: a foreign key constraint fails".
  expect(await refused("INSERT INTO payment (invoiceId, method, amountCents, reference, receivedOn) VALUES (999999, 'cash', 100, '', '2026-01-05')")).toBe(1452);
  expect(await refused("INSERT INTO tax_certificate (accountId, file, contentType, expiresOn) VALUES (999999, 'x.pdf', 'application/pdf', '2027-01-01')")).toBe(1452);
  expect(await refused("INSERT INTO checkout_session (id, invoiceId, amountCents, url, expiresAt) VALUES ('cs_orphan', 999999, 100, 'http://x', NOW())")).toBe(1452);
});
