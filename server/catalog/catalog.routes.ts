import { Router } from "express";
import type { AppContext } from "../http/context";
import { badRequest, notFound, parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { singleFileUpload } from "../http/upload";
import { isStoredId, photoStore } from "../files/file-store";
import { sendStoredFile } from "../files/serve";
import { idParamSchema } from "../../shared/schemas/common";
import { ROLES } from "../../shared/roles";
import * as catalog from "./catalog.service";

export function catalogRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ROLES), async (req, res) => {
    res.json({ products: await catalog.listProducts(ctx, currentUser(req), req.query.all === "1") });
  });
  r.get("/:id", allow(...ROLES), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ product: await catalog.getProduct(ctx, currentUser(req), id) });
  });
  r.post("/", allow("owner"), async (req, res) => {
    res.status(201).json({ product: await catalog.createProduct(ctx, req.body) });
  });
  r.patch("/:id", allow("owner"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ product: await catalog.updateProduct(ctx, id, req.body) });
  });
  /** Archive: the product stays on past orders but can no longer be ordered. */
  r.post("/:id/archive", allow("owner"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ product: await catalog.updateProduct(ctx, id, { active: false }) });
  });
  r.put("/:id/photo", allow("owner"), singleFileUpload(catalog.PHOTO_UPLOAD), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    if (!req.file) throw badRequest("Choose a photo to upload.", { photo: "Choose a photo to upload." });
    res.json({ product: await catalog.setProductPhoto(ctx, id, req.file.buffer) });
  });
  return r;
}

export function priceListRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow("owner"));
  r.get("/", async (_req, res) => {
    res.json({ priceLists: await catalog.listPriceLists(ctx) });
  });
  r.post("/", async (req, res) => {
    res.status(201).json({ priceList: await catalog.savePriceList(ctx, null, req.body) });
  });
  r.put("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ priceList: await catalog.savePriceList(ctx, id, req.body) });
  });
  r.delete("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    await catalog.deletePriceList(ctx, id);
    res.status(204).end();
  });
  return r;
}

/**
 * Product photos by stored id (the content hash), from the configured data directory, with their type, nosniff
 * and a year's immutable cache (server/files/serve.ts). Public: an <img> cannot send the sign-in token.
 */
export function uploadsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/:file", async (req, res) => {
    const file = String(req.params.file);
    if (!isStoredId(file) || file.endsWith(".pdf")) throw notFound("That file");
    await sendStoredFile(req, res, photoStore(ctx.config), file, { kind: "public-immutable" });
  });
  return r;
}
