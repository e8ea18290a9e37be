// createApp builds the Express app from its dependencies and returns it; it never listens (main.ts and tests do).
import express, { type Express } from "express";
import helmet from "helmet";
import type { Knex } from "knex";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { Logger } from "pino";
import type { Config } from "./config";
import { authenticate } from "./http/auth";
import { errorHandler, notFound } from "./http/errors";
import { originCheck } from "./http/origin-check";
import { defaultSignInLimits, defaultSignUpLimits, type SignInLimits, type SignUpLimits } from "./http/rate-limits";
import { requestLog } from "./http/request-log";
import { attachRouteRegistry, RouteRegistry } from "./http/route-registry";
import { lazyRunQueue, type RunQueue } from "./jobs/run-queue";
import { loadRunSettings } from "./jobs/run-settings";
import { createMailer, type Mailer } from "./mail/mailer";
import { auditRoutes } from "./routes/audit";
import { authRoutes } from "./routes/auth";
import { automataRoutes } from "./routes/automata";
import { expectationsRoutes } from "./routes/expectations";
import { healthRoutes } from "./routes/health";
import { invitationsRoutes, projectInvitationsRoutes } from "./routes/invitations";
import { mailboxRoutes } from "./routes/mailbox";
import { membersRoutes } from "./routes/members";
import { modelHierarchyRoutes } from "./routes/model-hierarchy";
import { modelsRoutes } from "./routes/models";
import { notificationsRoutes } from "./routes/notifications";
import { openApiRoutes } from "./routes/openapi";
import { projectsRoutes } from "./routes/projects";
import { reductionsRoutes } from "./routes/reductions";
import { runsRoutes } from "./routes/runs";
import { usersRoutes } from "./routes/users";

export interface AppDeps {
  db: Knex;
  log: Logger;
  config: Config;
  /** Folder of the built client; when absent or missing on disk, only the API is served. */
  clientDir?: string;
  /** Outgoing mail; by default SMTP_URL or the local fake, which opens its socket only when the first mail goes out. */
  mailer?: Mailer;
  /** Sign-in throttling; tests lower it to exercise the limit. */
  signInLimits?: SignInLimits;
  /** Sign-up requests per address; tests raise it, since they create many accounts. */
  signUpLimits?: SignUpLimits;
  /** Where run jobs are sent; by default a pg-boss sender on DATABASE_URL, started on the first run. */
  runQueue?: RunQueue;
}

const defaultClientDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../dist");

export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", deps.config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Sigma draws with WebGL and the raster views with canvas; both need blob:/data: images only.
          "img-src": ["'self'", "data:", "blob:"],
          "worker-src": ["'self'", "blob:"],
          "upgrade-insecure-requests": null,
        },
      },
    }),
  );
  app.use(requestLog(deps.log));

  const api = express.Router();
  api.use(express.json({ limit: "5mb" }));
  api.use(originCheck(deps.config.publicUrl));
  api.use(authenticate(deps.db, deps.config.sessionSecret));
  const mailer = deps.mailer ?? createMailer(deps.config, deps.db, deps.log);
  const accounts = {
    db: deps.db,
    log: deps.log,
    mailer,
    sessionSecret: deps.config.sessionSecret,
    publicUrl: deps.config.PUBLIC_URL,
  };
  const runs = {
    db: deps.db,
    queue: deps.runQueue ?? lazyRunQueue(deps.config.DATABASE_URL, deps.log),
    queueCap: loadRunSettings().queueCap,
  };
  // Every API route is declared in a route group and mounted through the registry, which keeps their records.
  const registry = new RouteRegistry("/api");
  for (const group of [
    healthRoutes(deps),
    authRoutes({
      ...accounts,
      signInLimits: deps.signInLimits ?? defaultSignInLimits,
      signUpLimits: deps.signUpLimits ?? defaultSignUpLimits,
    }),
    usersRoutes(accounts),
    mailboxRoutes(accounts),
    invitationsRoutes(accounts),
    projectsRoutes(accounts),
    membersRoutes(accounts),
    projectInvitationsRoutes(accounts),
    auditRoutes(accounts),
    modelsRoutes({ ...deps, runs }),
    runsRoutes(runs),
    notificationsRoutes(deps),
    reductionsRoutes({ ...runs, notify: { db: deps.db, log: deps.log, mailer, publicUrl: deps.config.publicUrl } }),
    modelHierarchyRoutes(deps),
    automataRoutes(deps),
    openApiRoutes(deps),
    expectationsRoutes(runs),
  ])
    registry.mount(api, group);
  api.use(notFound);
  app.use("/api", api);

  const clientDir = deps.clientDir ?? defaultClientDir;
  if (fs.existsSync(path.join(clientDir, "index.html"))) {
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    // The client routes in the browser; every other GET gets the app shell.
    app.get(/.*/, (_req, res) => res.sendFile(path.join(clientDir, "index.html")));
  }
  app.use(notFound);
  app.use(errorHandler(deps.log));
  attachRouteRegistry(app, registry);
  return app;
}
