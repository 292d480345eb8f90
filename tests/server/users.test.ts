import { startTestApp, makeAccount, makeBakery, makeUser, tokenFor, type TestApp } from "./helpers/app";
import { User } from "../../server/users/user.entity";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds);
});
afterAll(() => t.close());

const as = (token: string) => ({ get: (u: string) => t.http().get(u).set("Authorization", `Bearer ${token}`), patch: (u: string) => t.http().patch(u).set("Authorization", `Bearer ${token}`) });

describe("people (owner)", () => {
  it("lists users with their account names and searches them", async () => {
    const owner = await makeUser(t.ds, "owner");
    const acct = await makeAccount(t.ds, { businessName: "Brindle Bistro" });
    await makeUser(t.ds, "buyer", { accountId: acct.id, name: "Bea Brindle" });
    const token = await tokenFor(t, owner);
    const all = await as(token).get("/api/users");
    expect(all.status).toBe(200);
    const bea = all.body.users.find((u: { name: string }) => u.name === "Bea Brindle");
    expect(bea).toMatchObject({ role: "buyer", accountName: "Brindle Bistro", disabled: false });
    expect(bea).not.toHaveProperty("passwordHash");
    const found = await as(token).get("/api/users?q=brindle");
    expect(found.body.users.map((u: { name: string }) => u.name)).toEqual(["Bea Brindle"]);
  });

  it("never disables or demotes the last active owner", async () => {
    // Start from a state with exactly one active owner.
    await t.ds.getRepository(User).update({ role: "owner" }, { disabled: true });
    const owner = await makeUser(t.ds, "owner");
    const token = await tokenFor(t, owner);
    const demote = await as(token).patch(`/api/users/${owner.id}`).send({ role: "baker" });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe("last_owner");
    const disable = await as(token).patch(`/api/users/${owner.id}`).send({ disabled: true });
    expect(disable.status).toBe(409);

    const second = await makeUser(t.ds, "owner");
    const ok = await as(token).patch(`/api/users/${second.id}`).send({ role: "bookkeeper" });
    expect(ok.status).toBe(200);
    expect(ok.body.user.role).toBe("bookkeeper");
  });

  it("disables and re-enables a user, and changes roles with the account rule", async () => {
    const owner = await makeUser(t.ds, "owner");
    const token = await tokenFor(t, owner);
    const baker = await makeUser(t.ds, "baker");
    expect((await as(token).patch(`/api/users/${baker.id}`).send({ disabled: true })).body.user.disabled).toBe(true);
    expect((await as(token).patch(`/api/users/${baker.id}`).send({ disabled: false })).body.user.disabled).toBe(false);

    const toBuyerNoAccount = await as(token).patch(`/api/users/${baker.id}`).send({ role: "buyer" });
    expect(toBuyerNoAccount.status).toBe(400);
    expect(toBuyerNoAccount.body.error.fields.accountId).toBeDefined();
    const acct = await makeAccount(t.ds);
    const toBuyer = await as(token).patch(`/api/users/${baker.id}`).send({ role: "buyer", accountId: acct.id });
    expect(toBuyer.body.user).toMatchObject({ role: "buyer", accountId: acct.id });
    const back = await as(token).patch(`/api/users/${baker.id}`).send({ role: "baker" });
    expect(back.body.user).toMatchObject({ role: "baker", accountId: null });
  });

  it("a role change takes effect on the next request: the old session ends, a new one has the new role", async () => {
    const owner = await makeUser(t.ds, "owner");
    const ownerToken = await tokenFor(t, owner);
    const books = await makeUser(t.ds, "bookkeeper");
    const booksToken = await tokenFor(t, books);
    expect((await as(booksToken).get("/api/accounts")).status).toBe(200);
    await as(ownerToken).patch(`/api/users/${books.id}`).send({ role: "baker" });
    expect((await as(booksToken).get("/api/accounts")).status).toBe(401);
    expect((await as(await tokenFor(t, books)).get("/api/accounts")).status).toBe(403);
  });

  it("moving a buyer to another account ends their sessions", async () => {
    const owner = await makeUser(t.ds, "owner");
    const ownerToken = await tokenFor(t, owner);
    const buyer = await makeUser(t.ds, "buyer");
    const buyerToken = await tokenFor(t, buyer);
    expect((await as(buyerToken).get(`/api/accounts/${buyer.accountId}`)).status).toBe(200);
    const other = await makeAccount(t.ds);
    expect((await as(ownerToken).patch(`/api/users/${buyer.id}`).send({ accountId: other.id })).status).toBe(200);
    expect((await as(buyerToken).get(`/api/accounts/${other.id}`)).status).toBe(401);
  });

  it("validates patches and ids", async () => {
    const token = await tokenFor(t, await makeUser(t.ds, "owner"));
    expect((await as(token).patch("/api/users/abc").send({ disabled: true })).status).toBe(400);
    expect((await as(token).patch("/api/users/999999").send({ disabled: true })).status).toBe(404);
    const empty = await as(token).patch("/api/users/1").send({});
    expect(empty.status).toBe(400);
    const badRole = await as(token).patch("/api/users/1").send({ role: "king" });
    expect(badRole.body.error.fields.role).toBeDefined();
  });
});
