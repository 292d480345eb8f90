import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { createOrder, withIdempotency } from "../../server/orders/orders.service";
import { IdempotencyRecord } from "../../server/orders/idempotency-record.entity";
import { Order } from "../../server/orders/order.entity";
import { toSessionUser } from "../../server/http/auth";
import { User } from "../../server/users/user.entity";

/**
 * The stored answer of an idempotent order write is saved in the order's own transaction. Before, it was
 * written after the commit: a database crash between the two left a saved order with no stored answer,
 * so the buyer's retry (same Idempotency-Key, as the IETF draft "The Idempotency-Key HTTP Header Field"
 * intends) got 409 order_exists instead of the first answer.
 */
const NOW = "2026-06-10T15:00:00Z"; // Wed 10 Jun 2026 10:00 CDT; Thu 11 Jun orderable until 14:00 CDT
let t: TestApp;
let buyer: string;
let user: User;
let product: { id: number };
beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds);
  const account = await makeAccount(t.ds);
  user = await makeUser(t.ds, "buyer", { accountId: account.id });
  buyer = await tokenFor(t, user);
  product = await makeProduct(t.ds);
});
afterAll(() => t.close());

it("a crash right after the order's commit still answers the retry with the first result", async () => {
  const body = { deliveryDate: "2026-06-11", lines: [{ productId: product.id, quantity: 2 }] };
  const key = "crash-after-commit-1";
  // The first attempt commits the order, then the connection is lost before the answer goes out.
  await expect(withIdempotency(t.ctx, user.id, key, body, async (save) => {
    await createOrder(t.ctx, toSessionUser(user), body, { inTransaction: save && ((m, dto) => save(m, 201, { order: dto })) });
    throw new Error("connection lost");
  })).rejects.toThrow("connection lost");
  const retry = await t.http().post("/api/orders").set(auth(buyer)).set("Idempotency-Key", key).send(body);
  expect(retry.status).toBe(201);
  expect(retry.headers["idempotent-replayed"]).toBe("true");
  expect(await t.ds.getRepository(Order).countBy({ accountId: user.accountId!, deliveryDate: "2026-06-11" })).toBe(1);
});

it("a write that rolls back stores no answer: the retry places the order", async () => {
  const body = { deliveryDate: "2026-06-12", lines: [{ productId: product.id, quantity: 1 }] };
  const key = "rolled-back-1";
  await expect(withIdempotency(t.ctx, user.id, key, body, async (save) => {
    await createOrder(t.ctx, toSessionUser(user), body, { inTransaction: async (m, dto) => { await save!(m, 201, { order: dto }); throw new Error("deadlock"); } });
    return { status: 201, body: {} };
  })).rejects.toThrow("deadlock");
  expect(await t.ds.getRepository(IdempotencyRecord).countBy({ idemKey: key })).toBe(0);
  const retry = await t.http().post("/api/orders").set(auth(buyer)).set("Idempotency-Key", key).send(body);
  expect(retry.status).toBe(201);
  expect(retry.headers["idempotent-replayed"]).toBeUndefined();
});
