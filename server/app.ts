import express, { type Express } from "express";
import helmet from "helmet";
import compression from "compression";
import { pinoHttp } from "pino-http";
import type { SerializedRequest, SerializedResponse } from "pino";
import { randomUUID } from "node:crypto";
import type { AppContext } from "./lib/context.ts";
import { loadSession } from "./middleware/authenticate.ts";
import { originCheck } from "./middleware/origin-check.ts";
import { noStoreWhenSignedIn } from "./middleware/no-store.ts";
import { warnOfUntrustedProxy } from "./middleware/rate-limit.ts";
import { dealershipDay } from "./middleware/route.ts";
import { getDealership, todayFor } from "./modules/dealerships/dealerships.service.ts";
import { apiNotFound, errorHandler } from "./middleware/error-handler.ts";
import { healthRoutes } from "./modules/health/health.routes.ts";
import { authRoutes } from "./modules/auth/auth.routes.ts";
import { usersRoutes } from "./modules/users/users.routes.ts";
import { dealershipRoutes, publicDealershipRoutes } from "./modules/dealerships/dealerships.routes.ts";
import { vehiclesRoutes } from "./modules/vehicles/vehicles.routes.ts";
import { photosRoutes } from "./modules/photos/photos.routes.ts";
import { walkaroundRoutes } from "./modules/walkaround/walkaround.routes.ts";
import { checksRoutes } from "./modules/checks/checks.routes.ts";
import { publishingRoutes, publicVehiclesRoutes, vehicleDetailRoutes } from "./modules/publishing/publishing.routes.ts";
import { conditionRoutes } from "./modules/condition/condition.routes.ts";
import { enquiryRoutes, leadsRoutes, shareRoutes } from "./modules/leads/leads.routes.ts";
import { mailRoutes } from "./modules/mail/mail.routes.ts";
import { feedsRoutes } from "./modules/feeds/feeds.routes.ts";
import { feedsPublicRoutes } from "./modules/feeds/feeds.public.routes.ts";
import { pagesRoutes } from "./modules/publishing/pages.routes.ts";
import { mediaRoutes } from "./modules/photos/media.routes.ts";
import { clientRoutes } from "./modules/client/client.routes.ts";
import { financeRoutes } from "./modules/finance/finance.routes.ts";

/** Builds the whole HTTP application without listening, so tests drive it directly. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", ctx.config.TRUST_PROXY ? 1 : false);
  app.use(warnOfUntrustedProxy(ctx.logger, ctx.config.TRUST_PROXY));

  app.use(
    pinoHttp({
      logger: ctx.logger,
      genReqId: (req, res) => {
        const id = randomUUID();
        res.setHeader("X-Request-Id", id);
        return id;
      },
      // Request logs name the route and outcome only: bodies and cookies carry customers' details.
      serializers: {
        req: (req: SerializedRequest) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res: SerializedResponse) => ({ statusCode: res.statusCode }),
      },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? "error" : res.statusCode >= 400 ? "warn" : "info"),
      autoLogging: { ignore: (req) => req.url === "/api/health" },
    }),
  );

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          "default-src": ["'self'"],
          "script-src": ["'self'"],
          "style-src": ["'self'"],
          "img-src": ["'self'", "data:", "blob:"],
          "font-src": ["'self'"],
          "connect-src": ["'self'"],
          "frame-ancestors": ["'none'"],
          "form-action": ["'self'"],
          "object-src": ["'none'"],
          "base-uri": ["'self'"],
          "upgrade-insecure-requests": ctx.config.publicUrl.startsWith("https:") ? [] : null,
        },
      },
      strictTransportSecurity: ctx.config.publicUrl.startsWith("https:"),
      crossOriginEmbedderPolicy: false,
      referrerPolicy: { policy: "strict-origin-when-cross-origin" },
    }),
  );

  // Text (HTML, JSON, JS, CSS, XML, SVG) is compressed; images are already compressed and are left alone.
  // Feeds stream and carry their own ETags, so compression is fine there too (it flushes as rows arrive).
  app.use(compression({ threshold: 1024 }));

  const api = express.Router();
  api.use(express.json({ limit: "512kb" }));
  api.use(loadSession(ctx.auth));
  api.use(noStoreWhenSignedIn);
  api.use(originCheck({ origins: ctx.config.allowedOrigins }));
  api.use(dealershipDay(async (user) => {
    const dealership = await getDealership(ctx.database.db, user.dealershipId);
    return { dealership, today: todayFor(ctx, dealership) };
  }));
  api.use("/health", healthRoutes(ctx));
  api.use("/auth", authRoutes(ctx));
  api.use("/users", usersRoutes(ctx));
  api.use("/dealership", dealershipRoutes(ctx));
  api.use("/vehicles/:id/photos", photosRoutes(ctx));
  api.use("/vehicles/:id", walkaroundRoutes(ctx), checksRoutes(ctx), conditionRoutes(ctx), publishingRoutes(ctx), shareRoutes(ctx));
  api.use("/vehicles", vehiclesRoutes(ctx));
  // After /vehicles: mounted before it, its GET / would take /vehicles/suggestions for a vehicle's id.
  api.use("/vehicles/:id", vehicleDetailRoutes(ctx));
  api.use("/public/dealership", publicDealershipRoutes(ctx));
  api.use("/public/vehicles", publicVehiclesRoutes(ctx), enquiryRoutes(ctx));
  api.use("/public/finance-estimate", financeRoutes());
  api.use("/leads", leadsRoutes(ctx));
  api.use("/mail", mailRoutes(ctx));
  api.use("/feeds", feedsRoutes(ctx));
  api.use(apiNotFound);
  app.use("/api", api);

  app.use(mediaRoutes(ctx));
  app.use(pagesRoutes(ctx));
  app.use(feedsPublicRoutes(ctx));
  app.use(clientRoutes(ctx));
  app.use(errorHandler);
  return app;
}
