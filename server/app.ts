import compression from "compression";
import express, { type Express, type RequestHandler } from "express";
import type session from "express-session";
import type pg from "pg";
import { createRateLimiters } from "./auth/rate-limits";
import { sessionMiddleware } from "./auth/session";
import type { AppConfig } from "./config";
import type { Db } from "./db/client";
import { clientRouter } from "./http/client";
import { stopWorkWhenClientLeaves } from "./http/client-gone";
import { MVT_TYPE } from "./tiles/respond";
import { apiNotFound, errorHandler } from "./http/errors";
import { requireJsonOrUpload } from "./http/multipart-routes";
import { acceptedBodyEncoding, rejectUnstorableText } from "./http/request-checks";
import { sameOriginOnly, securityHeaders } from "./http/security";
import type { JobQueue } from "./jobs/queue";
import type { Mailer } from "./mail/mailer";
import { accountRouter } from "./routes/account";
import { authRouter } from "./routes/auth";
import { catalogRouter } from "./routes/catalog";
import { computeRouter } from "./routes/compute";
import { configRouter } from "./routes/config";
import type { RouteDeps } from "./routes/deps";
import { designRulesRouter } from "./routes/design-rules";
import { invitationLinkRouter, teamInvitationsRouter } from "./routes/invitations";
import { layerMappingRouter } from "./routes/layer-mapping";
import { layersRouter } from "./routes/layers";
import { membersRouter } from "./routes/members";
import { openapiRouter } from "./routes/openapi";
import { outboxRouter } from "./routes/outbox";
import { projectsRouter } from "./routes/projects";
import { rainfallRouter } from "./routes/rainfall";
import { rainfallUploadRouter } from "./routes/rainfall-upload";
import { subcatchmentFilesRouter } from "./routes/subcatchment-files";
import { subcatchmentsRouter } from "./routes/subcatchments";
import { teamsRouter } from "./routes/teams";
import { tilesRouter } from "./routes/tiles";
import type { ObjectStore } from "./storage";

export interface AppDeps {
  db: Db;
  /** The pool behind `db`: the rate-limit counters use it directly. */
  pool: pg.Pool;
  sessionStore: session.Store;
  mailer: Mailer;
  store: ObjectStore;
  jobs: JobQueue;
}

export const JSON_BODY_LIMIT = "256kb";

// API answers are per-user and change often: never cache them.
const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader("Cache-Control", "no-store");
  next();
};

/** The whole HTTP app: security middleware, the JSON API under /api, then the built client. */
export function createApp(config: AppConfig, deps: AppDeps): Express {
  const app = express();
  app.disable("x-powered-by");
  if (config.trustProxy) app.set("trust proxy", 1);

  const routeDeps: RouteDeps = {
    db: deps.db,
    config,
    mailer: deps.mailer,
    limiters: createRateLimiters(deps.pool, config),
    store: deps.store,
    jobs: deps.jobs,
  };

  const api = express.Router();
  api.use(noStore);
  api.use(sameOriginOnly(config.publicBaseUrl));
  api.use(requireJsonOrUpload);
  api.use(acceptedBodyEncoding);
  api.use(
    express.json({ limit: JSON_BODY_LIMIT, type: ["application/json", "application/*+json"] }),
  );
  api.use(rejectUnstorableText);
  api.use(sessionMiddleware(config, deps.sessionStore));
  api.use(stopWorkWhenClientLeaves);
  // One line per resource; geodata routers join this list.
  const routers: ((deps: RouteDeps) => express.Router)[] = [
    configRouter,
    authRouter,
    accountRouter,
    invitationLinkRouter,
    teamsRouter,
    membersRouter,
    teamInvitationsRouter,
    projectsRouter,
    outboxRouter,
    catalogRouter,
    designRulesRouter,
    rainfallRouter,
    layersRouter,
    layerMappingRouter,
    subcatchmentsRouter,
    computeRouter,
    rainfallUploadRouter,
    subcatchmentFilesRouter,
    openapiRouter,
    tilesRouter,
  ];
  for (const router of routers) api.use(router(routeDeps));
  api.use(apiNotFound);

  // An admin's own basemap style (BASEMAP_STYLE_URL) is fetched by the browser from its host.
  const mapOrigins = config.basemap.kind === "style" ? [new URL(config.basemap.url).origin] : [];
  app.use(securityHeaders(config.publicBaseUrl, mapOrigins));
  // gzip: the client's JavaScript shrinks to about a third, JSON answers and vector tiles
  // (protobuf with repeated keys) compress well; the default filter skips the tile type.
  app.use(
    compression({
      filter: (req, res) =>
        String(res.getHeader("Content-Type") ?? "").startsWith(MVT_TYPE) ||
        compression.filter(req, res),
    }),
  );
  app.use("/api", api);
  app.use(clientRouter(config.clientDist));
  app.use(errorHandler);
  return app;
}
