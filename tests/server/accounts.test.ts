import { startTestApp, makeAccount, makeBakery, makeUser, tokenFor, type TestApp } from "./helpers/app";

let t: TestApp;
let owner: string;
let books: string;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds);
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  books = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
});
afterAll(() => t.close());

const valid = {
  businessName: "Copperline Kitchen",
  deliveryAddress: "9 Foundry Lane",
  contactName: "Ada Finch",
  contactPhone: "+1 (555) 010-1234",
  billingEmail: "Billing@Copperline.test",
  notes: "Deliver before 8",
};

describe("customer accounts", () => {
  it("creates, reads, edits and closes an account", async () => {
    const created = await t.http().post("/api/accounts").set("Authorization", `Bearer ${owner}`).send(valid);
    expect(created.status).toBe(201);
    expect(created.body.account).toMatchObject({ ...valid, billingEmail: "billing@copperline.test", status: "active", buyerCount: 0, paymentTerms: "card", creditHold: false });
    const id = created.body.account.id;

    const edited = await t.http().patch(`/api/accounts/${id}`).set("Authorization", `Bearer ${owner}`).send({ contactName: "Ada F.", status: "on_hold" });
    expect(edited.status).toBe(200);
    expect(edited.body.account).toMatchObject({ contactName: "Ada F.", status: "on_hold", businessName: valid.businessName });

    const closed = await t.http().patch(`/api/accounts/${id}`).set("Authorization", `Bearer ${owner}`).send({ status: "closed" });
    expect(closed.body.account.status).toBe("closed");

    const read = await t.http().get(`/api/accounts/${id}`).set("Authorization", `Bearer ${books}`);
    expect(read.status).toBe(200);
    expect(read.body.account.status).toBe("closed");
  });

  it("lists with search and status filter for owner and bookkeeper", async () => {
    await makeAccount(t.ds, { businessName: "Saffron Yard", status: "active" });
    await makeAccount(t.ds, { businessName: "Saffron Annex", status: "on_hold" });
    const search = await t.http().get("/api/accounts?q=saffron").set("Authorization", `Bearer ${books}`);
    expect(search.status).toBe(200);
    expect(search.body.accounts.map((a: { businessName: string }) => a.businessName)).toEqual(["Saffron Annex", "Saffron Yard"]);
    const held = await t.http().get("/api/accounts?q=saffron&status=on_hold").set("Authorization", `Bearer ${owner}`);
    expect(held.body.accounts.map((a: { businessName: string }) => a.businessName)).toEqual(["Saffron Annex"]);
    const wildcard = await t.http().get("/api/accounts?q=%25").set("Authorization", `Bearer ${owner}`);
    expect(wildcard.body.accounts).toEqual([]);
    const badStatus = await t.http().get("/api/accounts?status=sleeping").set("Authorization", `Bearer ${owner}`);
    expect(badStatus.status).toBe(400);
  });

  it("gives per-field messages for bad input and keeps nothing", async () => {
    const res = await t.http().post("/api/accounts").set("Authorization", `Bearer ${owner}`).send({ businessName: "", billingEmail: "x", contactPhone: "call me" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      businessName: "Enter the business name.",
      deliveryAddress: expect.any(String),
      billingEmail: expect.stringMatching(/valid e-mail/),
      contactPhone: expect.stringMatching(/digits/),
    });
    const list = await t.http().get("/api/accounts?q=call").set("Authorization", `Bearer ${owner}`);
    expect(list.body.accounts).toEqual([]);
  });

  it("lets a buyer read only their own account: another account is 404", async () => {
    const mine = await makeAccount(t.ds, { businessName: "Mine" });
    const theirs = await makeAccount(t.ds, { businessName: "Theirs" });
    const buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: mine.id }));
    const own = await t.http().get(`/api/accounts/${mine.id}`).set("Authorization", `Bearer ${buyer}`);
    expect(own.status).toBe(200);
    expect(own.body.account.buyerCount).toBe(1);
    const other = await t.http().get(`/api/accounts/${theirs.id}`).set("Authorization", `Bearer ${buyer}`);
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe("not_found");
    expect((await t.http().get("/api/accounts").set("Authorization", `Bearer ${buyer}`)).status).toBe(403);
    expect((await t.http().get("/api/users").set("Authorization", `Bearer ${buyer}`)).status).toBe(403);
  });

  it("404 for an unknown account", async () => {
    expect((await t.http().patch("/api/accounts/987654").set("Authorization", `Bearer ${owner}`).send({ notes: "x" })).status).toBe(404);
  });
});

describe("an account's buyers and price list by name (issue 12)", () => {
  it("lists the account's buyers by name for the office, turned-off ones last; a price list names its accounts", async () => {
    const a = await makeAccount(t.ds, { businessName: "Named Buyers Café" });
    await makeUser(t.ds, "buyer", { accountId: a.id, name: "Zoe Active" });
    await makeUser(t.ds, "buyer", { accountId: a.id, name: "Abe Gone", disabled: true });
    const buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: a.id, name: "Mia Middle" }));
    const res = await t.http().get(`/api/accounts/${a.id}/buyers`).set("Authorization", `Bearer ${books}`);
    expect(res.status).toBe(200);
    expect(res.body.buyers.map((b: { name: string; disabled: boolean }) => [b.name, b.disabled])).toEqual([["Mia Middle", false], ["Zoe Active", false], ["Abe Gone", true]]);
    expect((await t.http().get(`/api/accounts/${a.id}/buyers`).set("Authorization", `Bearer ${buyer}`)).status).toBe(403);
    expect((await t.http().get("/api/accounts/999999/buyers").set("Authorization", `Bearer ${owner}`)).status).toBe(404);

    const list = await t.http().post("/api/price-lists").set("Authorization", `Bearer ${owner}`).send({ name: "Named partners", kind: "percent", percentOff: 5, items: [] });
    expect(list.status).toBe(201);
    await t.ds.query("UPDATE customer_account SET priceListId = ? WHERE id = ?", [list.body.priceList.id, a.id]);
    const lists = (await t.http().get("/api/price-lists").set("Authorization", `Bearer ${owner}`)).body.priceLists as { id: number; accountCount: number; accounts: { businessName: string }[] }[];
    expect(lists.find((l) => l.id === list.body.priceList.id)).toMatchObject({ accountCount: 1, accounts: [{ id: a.id, businessName: "Named Buyers Café" }] });
  });
});
