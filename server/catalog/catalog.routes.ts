import path from "node:path";
import fs from "node:fs";
import { Router, type RequestHandler } from "express";
import multer from "multer";
import { z } from "zod";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, notFound, parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { idSchema } from "../../shared/schemas/common";
import { ROLES } from "../../shared/roles";
import * as catalog from "./catalog.service";

const idParam = z.object({ id: idSchema });

/** multer keeps the upload in memory (5 MB cap) so its bytes can be checked before anything is stored. */
function photoUpload(): RequestHandler {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: catalog.PHOTO_MAX_BYTES, files: 1 } }).single("photo");
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError && err.code === "LIMIT_FILE_SIZE") {
        return next(new HttpError(413, "payload_too_large", "The photo is larger than 5 MB. Use a smaller one.", { photo: "At most 5 MB." }));
      }
      if (err) return next(badRequest("The upload could not be read: send one image in the field \"photo\".", { photo: "Send one file in the field \"photo\"." }));
      next();
    });
}

export function catalogRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ROLES), async (req, res) => {
    res.json({ products: await catalog.listProducts(ctx, currentUser(req), req.query.all === "1") });
  });
  r.get("/:id", allow(...ROLES), async (req, res) => {
    const { id } = parse(idParam, req.params);
    res.json({ product: await catalog.getProduct(ctx, currentUser(req), id) });
  });
  r.post("/", allow("owner"), async (req, res) => {
    res.status(201).json({ product: await catalog.createProduct(ctx, req.body) });
  });
  r.patch("/:id", allow("owner"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    res.json({ product: await catalog.updateProduct(ctx, id, req.body) });
  });
  /** Archive: the product stays on past orders but can no longer be ordered. */
  r.post("/:id/archive", allow("owner"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    res.json({ product: await catalog.updateProduct(ctx, id, { active: false }) });
  });
  r.put("/:id/photo", allow("owner"), photoUpload(), async (req, res) => {
    const { id } = parse(idParam, req.params);
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
    const { id } = parse(idParam, req.params);
    res.json({ priceList: await catalog.savePriceList(ctx, id, req.body) });
  });
  r.delete("/:id", async (req, res) => {
    const { id } = parse(idParam, req.params);
    await catalog.deletePriceList(ctx, id);
    res.status(204).end();
  });
  return r;
}

/** Product photos, from .data/uploads (outside the web root), cached for a year: names never repeat. */
export function uploadsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/:file", (req, res, next) => {
    const file = String(req.params.file);
    if (!/^[a-f0-9]{32}\.(jpg|png|webp)$/.test(file)) return next(notFound("That file"));
    const full = path.join(ctx.config.uploadsDir, file);
    if (!fs.existsSync(full)) return next(notFound("That file"));
    res.sendFile(full, { maxAge: "365d", immutable: true, headers: { "X-Content-Type-Options": "nosniff" } });
  });
  return r;
}
