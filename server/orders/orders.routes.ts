import { Router } from "express";
import type { AppContext } from "../http/context";
import { badRequest, parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { accountIdQuerySchema, idParamSchema } from "../../shared/schemas/common";
import { dateQuerySchema } from "../../shared/schemas/calendar";
import { NOTHING_TO_CHANGE, orderCancelQuerySchema, orderCreateSchema, orderListQuerySchema, orderUpdateSchema, standingOrderSchema } from "../../shared/schemas/orders";
import { resolveAccount } from "../calendar/calendar.service";
import { getBakery } from "../bakery/bakery.service";
import * as orders from "./orders.service";
import * as standing from "./standing.service";
import * as feed from "./feed.service";
import { board, boardCsv } from "./board.service";

const ORDERING = ["buyer", "owner", "bookkeeper"] as const;

export function ordersRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get("/board", allow("owner", "bookkeeper", "baker"), async (req, res) => {
    const { date } = parse(dateQuerySchema, req.query);
    res.json({ board: await board(ctx, date) });
  });
  r.get("/board.csv", allow("owner", "bookkeeper", "baker"), async (req, res) => {
    const { date } = parse(dateQuerySchema, req.query);
    const bakery = await getBakery(ctx);
    res.type("text/csv; charset=utf-8").attachment(`orders-${date}.csv`).send(boardCsv(await board(ctx, date), bakery.currency));
  });

  r.get("/", allow(...ORDERING, "baker"), async (req, res) => {
    res.json({ orders: await orders.listOrders(ctx, currentUser(req), parse(orderListQuerySchema, req.query)) });
  });
  r.get("/:id", allow(...ORDERING, "baker"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ order: await orders.getOrder(ctx, currentUser(req), id) });
  });
  r.post("/", allow(...ORDERING), async (req, res) => {
    const user = currentUser(req);
    const result = await orders.withIdempotency(ctx, user.id, req.get("idempotency-key") || undefined, req.body, async (save) => {
      const input = parse(orderCreateSchema, req.body);
      // The stored answer is written in the order's own transaction: both are saved, or neither.
      const order = await orders.createOrder(ctx, user, input, { inTransaction: save && ((m, dto) => save(m, 201, { order: dto })) });
      return { status: 201, body: { order } };
    });
    if (result.replayed) res.set("Idempotent-Replayed", "true");
    res.status(result.status).json(result.body);
  });
  r.patch("/:id", allow(...ORDERING), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    // express.json only parses application/json; anything else leaves no body, which would change nothing.
    if (!req.is("application/json") || typeof req.body !== "object" || req.body === null || Array.isArray(req.body)) throw badRequest(`${NOTHING_TO_CHANGE} Send them as a JSON object.`);
    const input = parse(orderUpdateSchema, req.body);
    res.json({ order: await orders.updateOrder(ctx, currentUser(req), id, input) });
  });
  r.delete("/:id", allow(...ORDERING), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const { overrideReason } = parse(orderCancelQuerySchema, req.query);
    res.json({ order: await orders.cancelOrder(ctx, currentUser(req), id, overrideReason) });
  });
  return r;
}

export function standingOrderRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ORDERING), async (req, res) => {
    const { accountId } = parse(accountIdQuerySchema, req.query);
    res.json({ standingOrder: await standing.getStandingOrder(ctx, currentUser(req), accountId) });
  });
  r.put("/", allow("buyer", "owner"), async (req, res) => {
    const input = parse(standingOrderSchema, req.body);
    res.json({ standingOrder: await standing.putStandingOrder(ctx, currentUser(req), input) });
  });
  /** The owner's "make the orders now" button; the same job also runs on a schedule. */
  r.post("/materialise", allow("owner"), async (_req, res) => {
    res.json({ result: await standing.materialiseAll(ctx) });
  });
  return r;
}

export function feedRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow("buyer", "owner"), async (req, res) => {
    const account = await resolveAccount(ctx, currentUser(req), parse(accountIdQuerySchema, req.query).accountId);
    res.json(await feed.getFeed(ctx, account.id));
  });
  r.post("/", allow("buyer", "owner"), async (req, res) => {
    const account = await resolveAccount(ctx, currentUser(req), parse(accountIdQuerySchema, req.query).accountId);
    res.status(201).json(await feed.rotateFeed(ctx, account.id));
  });
  r.delete("/", allow("buyer", "owner"), async (req, res) => {
    const account = await resolveAccount(ctx, currentUser(req), parse(accountIdQuerySchema, req.query).accountId);
    await feed.revokeFeed(ctx, account.id);
    res.status(204).end();
  });
  return r;
}

/** The public feed itself: the unguessable token is the only key. */
export function publicFeedRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/:file", async (req, res) => {
    const token = String(req.params.file).replace(/\.ics$/, "");
    const body = await feed.renderFeed(ctx, token);
    // Deliveries, addresses and totals: not to be stored by any cache (the /api no-store header stays).
    res.type("text/calendar; charset=utf-8").send(body);
  });
  return r;
}
