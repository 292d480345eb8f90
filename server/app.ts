import fs from "node:fs";
import path from "node:path";
import express, { Router } from "express";
import helmet from "helmet";
import pinoHttp from "pino-http";
import type { AppContext } from "./http/context";
import { apiNotFound, errorHandler } from "./http/errors";
import { authenticate } from "./http/auth";
import { requestIdFor } from "./http/request-id";
import { rateLimits } from "./http/rate-limits";
import { authRoutes } from "./auth/auth.routes";
import { invitationsRoutes, usersRoutes } from "./users/users.routes";
import { accountsRoutes } from "./accounts/accounts.routes";
import { bakeryRoutes, officeRoutes } from "./bakery/bakery.routes";
import { catalogRoutes, priceListRoutes, uploadsRoutes } from "./catalog/catalog.routes";
import { accountDeliveryRoutes, calendarRoutes, settingsRoutes } from "./calendar/calendar.routes";
import { feedRoutes, ordersRoutes, publicFeedRoutes, standingOrderRoutes } from "./orders/orders.routes";
import { formulaRoutes, ingredientRoutes, productionRoutes } from "./production/production.routes";
import { outboxRoutes } from "./mail/outbox.routes";
import { deliveryRoutes, invoiceRoutes } from "./billing/invoices.routes";
import { invoicePaymentRoutes, stripeWebhookRoute } from "./billing/payments.routes";
import { payoutRoutes, reportRoutes } from "./billing/payouts.routes";
import { accountCertificateRoutes, certificateRoutes } from "./billing/certificates.routes";
import { accountTermsRoutes, billingSettingsRoutes } from "./billing/billing-settings.routes";

export const PERMISSIONS_POLICY = "camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), hid=(), bluetooth=(), midi=(), display-capture=(), browsing-topics=()";

export function redactUrl(url: string | undefined): string {
  return (url || "").replace(/(\/api\/auth\/invitations\/)[^/?]+/, "$1[redacted]").replace(/(\/api\/feeds\/)[^/?]+/, "$1[redacted]").replace(/([?&]token=)[^&]+/, "$1[redacted]");
}

/** The API alone: every route under it is mounted here, and nowhere else. */
export function apiRouter(ctx: AppContext): Router {
  const api = Router();
  api.use("/webhooks/stripe", stripeWebhookRoute(ctx)); // raw body: before the JSON parser
  api.use(express.json({ limit: "200kb" }));

  api.get("/health", async (_req, res) => {
    try {
      await ctx.dataSource.query("SELECT 1");
      res.json({ status: "ok", db: "up" });
    } catch {
      res.status(503).json({ status: "degraded", db: "down" });
    }
  });

  api.use(authenticate(ctx));
  api.use("/auth", authRoutes(ctx));
  api.use("/bakery", bakeryRoutes(ctx));
  api.use("/office", officeRoutes(ctx));
  api.use("/users", usersRoutes(ctx));
  api.use("/invitations", invitationsRoutes(ctx));
  api.use("/accounts", accountsRoutes(ctx));
  api.use("/accounts", accountDeliveryRoutes(ctx));
  api.use("/products", catalogRoutes(ctx));
  api.use("/price-lists", priceListRoutes(ctx));
  api.use("/uploads", uploadsRoutes(ctx));
  api.use("/settings", settingsRoutes(ctx));
  api.use("/calendar", calendarRoutes(ctx));
  api.use("/orders", ordersRoutes(ctx));
  api.use("/standing-orders", standingOrderRoutes(ctx));
  api.use("/calendar-feed", feedRoutes(ctx));
  api.use("/feeds", rateLimits(ctx).feed, publicFeedRoutes(ctx)); // per address and per feed token
  api.use("/ingredients", ingredientRoutes(ctx));
  api.use("/formulas", formulaRoutes(ctx));
  api.use("/production", productionRoutes(ctx));
  api.use("/outbox", outboxRoutes(ctx));
  api.use("/deliveries", deliveryRoutes(ctx));
  api.use("/invoices", invoiceRoutes(ctx));
  api.use("/invoices", invoicePaymentRoutes(ctx));
  api.use("/payouts", payoutRoutes(ctx));
  api.use("/reports", reportRoutes(ctx));
  api.use("/settings/billing", billingSettingsRoutes(ctx));
  api.use("/accounts", accountTermsRoutes(ctx));
  api.use("/accounts", accountCertificateRoutes(ctx));
  api.use("/certificates", certificateRoutes(ctx));
  api.use(apiNotFound);
  return api;
}

export function createApp(ctx: AppContext) {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", process.env.TRUST_PROXY ? Number(process.env.TRUST_PROXY) || process.env.TRUST_PROXY : false);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          "default-src": ["'self'"],
          // No inline scripts: the exported page loads its one bundle with <script src> (dist/index.html), and the
          // sign-in token sits in localStorage, where an injected inline script could read it (OWASP XSS Prevention
          // Cheat Sheet; CSP Level 3 §6.1.1 script-src). Styles stay inline: react-native-web writes style elements.
          "script-src": ["'self'"],
          "style-src": ["'self'", "'unsafe-inline'"],
          "img-src": ["'self'", "data:", "blob:"],
          "font-src": ["'self'", "data:"],
          "connect-src": ["'self'"],
          "form-action": ["'self'"],
          "upgrade-insecure-requests": null,
        },
      },
    }),
  );
  app.use(
    pinoHttp({
      logger: ctx.logger,
      genReqId: requestIdFor,
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? "error" : res.statusCode >= 400 ? "warn" : "info"),
      serializers: {
        // Link tokens travel in some paths (invitation check, calendar feed): never log them.
        req: (req) => ({ method: req.method, url: redactUrl(req.url), id: req.id }),
        res: (res) => ({ statusCode: res.statusCode }),
      },
      autoLogging: { ignore: (req) => !(req.url || "").startsWith("/api") },
    }),
  );

  // Cross-origin access only for the development web server (npm run dev sets CORS_ORIGIN).
  const corsOrigins = String(process.env.CORS_ORIGIN || "").split(",").map((o: string) => o.trim()).filter(Boolean);
  if (corsOrigins.length) {
    app.use("/api", (req, res, next) => {
      const origin = req.get("origin");
      if (origin && corsOrigins.includes(origin)) {
        res.set({ "Access-Control-Allow-Origin": origin, "Access-Control-Allow-Headers": "Authorization, Content-Type, Idempotency-Key", "Access-Control-Allow-Methods": "GET, POST, PUT, PATCH, DELETE, OPTIONS", Vary: "Origin" });
        if (req.method === "OPTIONS") return void res.status(204).end();
      }
      next();
    });
  }

  // Browser features the app never uses are switched off for every page (W3C Permissions Policy; MDN
  // "Permissions-Policy"). Photos and certificates come through a file input, which needs no camera permission;
  // card payments happen on Stripe's hosted page, so no Payment Request API here either.
  app.use((_req, res, next) => {
    res.setHeader("Permissions-Policy", PERMISSIONS_POLICY);
    next();
  });
  // Every API answer carries personal or money data (or a token): no browser or proxy may store it
  // (RFC 9111 §5.2.2.5 no-store; OWASP REST Security Cheat Sheet, "Security headers"). Handlers that serve
  // files may set their own, stricter or equal, header after this.
  app.use("/api", (_req, res, next) => {
    res.setHeader("Cache-Control", "no-store");
    next();
  });
  app.use("/api", apiRouter(ctx), errorHandler);

  // The exported web app, with the SPA fallback for client-side routes.
  const dist = ctx.config.webDist;
  const index = path.join(dist, "index.html");
  app.use(express.static(dist, { index: false, maxAge: "1h", setHeaders: (res, file) => {
    if (file.includes(`${path.sep}_expo${path.sep}`) || file.includes(`${path.sep}assets${path.sep}`)) res.setHeader("Cache-Control", "public, max-age=31536000, immutable");
  } }));
  app.get("/{*splat}", (_req, res) => {
    if (fs.existsSync(index)) {
      res.setHeader("Cache-Control", "no-cache");
      res.sendFile(index);
    } else {
      res.status(503).type("text/plain").send("The web app has not been built yet. Run `npm start` (it builds it) or `npm run build:web`.");
    }
  });
  app.use(errorHandler);
  return app;
}

/** Every API route as "METHOD /api/path", read off the router itself (for the route-by-role test). */
export function listApiRoutes(ctx: AppContext): string[] {
  const out: string[] = [];
  type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] }; rawPath?: string };
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const p = layer.route.path === "/" ? "" : layer.route.path;
        for (const method of Object.keys(layer.route.methods)) out.push(`${method.toUpperCase()} ${prefix}${p || "/"}`.replace(/(.)\/$/, "$1"));
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (layer.rawPath && layer.rawPath !== "/" ? layer.rawPath : ""));
      }
    }
  };
  walk((apiRouter(ctx) as unknown as { stack: Layer[] }).stack, "/api");
  return out;
}
