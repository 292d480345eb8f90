import { Router } from "express";
import { forecastCsv } from "./forecast-csv";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { idParamSchema } from "../../shared/schemas/common";
import { bakeDayInputSchema, forecastQuerySchema, formulaVersionQuerySchema, planPdfQuerySchema, planQuerySchema, productionSettingsSchema, progressInputSchema } from "../../shared/schemas/production";
import { dateQuerySchema } from "../../shared/schemas/calendar";
import { getBakery } from "../bakery/bakery.service";
import * as formulas from "./formulas.service";
import * as plans from "./plan.service";
import * as productionSettings from "./settings.service";
import { renderPlanPdf } from "./plan.pdf";

const KITCHEN = ["owner", "baker"] as const;

export function ingredientRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow(...KITCHEN));
  r.get("/", async (_req, res) => {
    res.json({ ingredients: await formulas.listIngredients(ctx) });
  });
  r.post("/", async (req, res) => {
    res.status(201).json({ ingredient: await formulas.saveIngredient(ctx, null, req.body) });
  });
  r.put("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ ingredient: await formulas.saveIngredient(ctx, id, req.body) });
  });
  return r;
}

export function formulaRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow(...KITCHEN));
  r.get("/", async (_req, res) => {
    res.json({ formulas: await formulas.listFormulas(ctx) });
  });
  r.get("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const { version } = parse(formulaVersionQuerySchema, req.query);
    res.json({ formula: await formulas.getFormula(ctx, id, version) });
  });
  r.get("/:id/history", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ versions: await formulas.formulaHistory(ctx, id) });
  });
  r.post("/", async (req, res) => {
    res.status(201).json({ formula: await formulas.saveFormula(ctx, currentUser(req).id, null, req.body) });
  });
  r.put("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ formula: await formulas.saveFormula(ctx, currentUser(req).id, id, req.body) });
  });
  return r;
}

export function productionRoutes(ctx: AppContext): Router {
  const r = Router();
  // Mixers, ovens, crew, packing, shift start, dispatch and overnight retard: the bakehouse the schedule plans for.
  r.get("/settings", allow(...KITCHEN), async (_req, res) => {
    res.json({ settings: await productionSettings.loadProductionSettings(ctx) });
  });
  r.put("/settings", allow("owner"), async (req, res) => {
    const input = parse(productionSettingsSchema, req.body);
    res.json({ settings: await productionSettings.saveProductionSettings(ctx, input) });
  });
  r.get("/next-day", allow(...KITCHEN), async (_req, res) => {
    res.json({ date: await plans.nextBakeDay(ctx) });
  });
  r.get("/plan", allow(...KITCHEN), async (req, res) => {
    const { date } = parse(planQuerySchema, req.query);
    res.json({ plan: await plans.getPlan(ctx, date) });
  });
  r.get("/plan.pdf", allow(...KITCHEN), async (req, res) => {
    const { date, units } = parse(planPdfQuerySchema, req.query);
    const bakery = await getBakery(ctx);
    const plan = await plans.getPlan(ctx, date);
    const pdf = await renderPlanPdf({ ...plan, bakeryName: bakery.name, timeZone: bakery.timeZone, locale: bakery.locale }, units);
    res.type("application/pdf").set("Content-Disposition", `inline; filename="production-${date}.pdf"`).send(pdf);
  });
  r.post("/plan/recalculate", allow(...KITCHEN), async (req, res) => {
    const { date } = parse(planQuerySchema, req.query);
    res.json({ plan: await plans.freeze(ctx, date) });
  });
  r.put("/bake-days/:date", allow(...KITCHEN), async (req, res) => {
    const { date } = parse(dateQuerySchema, req.params);
    const input = parse(bakeDayInputSchema, req.body);
    res.json({ plan: await plans.saveBakeDay(ctx, date, { ...input, roomC: Number(input.roomC), flourC: Number(input.flourC), pasteC: Number(input.pasteC) }) });
  });
  r.post("/bake-days/:date/progress", allow(...KITCHEN), async (req, res) => {
    const { date } = parse(dateQuerySchema, req.params);
    const input = parse(progressInputSchema, req.body);
    res.json({ progress: await plans.setProgress(ctx, date, input) });
  });
  r.get("/forecast", allow(...KITCHEN), async (req, res) => {
    const { from } = parse(forecastQuerySchema, req.query);
    res.json({ forecast: await plans.forecast(ctx, from) });
  });
  r.get("/forecast.csv", allow(...KITCHEN), async (req, res) => {
    const { from } = parse(forecastQuerySchema, req.query);
    const f = await plans.forecast(ctx, from);
    const bakery = await getBakery(ctx);
    res.type("text/csv; charset=utf-8").attachment(`purchasing-${f.from}-to-${f.to}.csv`).send(forecastCsv(f, bakery.currency));
  });
  return r;
}
