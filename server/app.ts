// createApp builds the Express app from its dependencies and returns it; it never listens (main.ts and tests do).
import express, { type Express } from "express";
import helmet from "helmet";
import type { Knex } from "knex";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { Logger } from "pino";
import type { Config } from "./config";
import { errorHandler, notFound } from "./http/errors";
import { requestLog } from "./http/request-log";
import { healthRouter } from "./routes/health";
import { automataRouter } from "./routes/automata";
import { authenticate } from "./http/auth";
import { originCheck } from "./http/origin-check";
import { defaultSignInLimits, type SignInLimits } from "./http/rate-limits";
import { createMailer, type Mailer } from "./mail/mailer";
import { auditRouter } from "./routes/audit";
import { authRouter } from "./routes/auth";
import { invitationsRouter, projectInvitationsRouter } from "./routes/invitations";
import { mailboxRouter } from "./routes/mailbox";
import { membersRouter } from "./routes/members";
import { projectsRouter } from "./routes/projects";
import { usersRouter } from "./routes/users";
import { modelsRouter } from "./routes/models";
import { lazyRunQueue, type RunQueue } from "./jobs/run-queue";
import { loadRunSettings } from "./jobs/run-settings";
import { notificationsRouter } from "./routes/notifications";
import { runsRouter } from "./routes/runs";
import { modelHierarchyRouter } from "./routes/model-hierarchy";
import { reductionsRouter } from "./routes/reductions";

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
  /** Where run jobs are sent; by default a pg-boss sender on DATABASE_URL, started on the first run. */
  runQueue?: RunQueue;
}

const defaultClientDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../dist");

export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", "loopback");
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
  api.use("/health", healthRouter(deps));
  const mailer = deps.mailer ?? createMailer(deps.config, deps.db, deps.log);
  const accounts = {
    db: deps.db,
    log: deps.log,
    mailer,
    sessionSecret: deps.config.sessionSecret,
    publicUrl: deps.config.PUBLIC_URL,
  };
  api.use("/auth", authRouter({ ...accounts, signInLimits: deps.signInLimits ?? defaultSignInLimits }));
  api.use("/users", usersRouter(accounts));
  api.use("/mailbox", mailboxRouter(accounts));
  api.use("/invitations", invitationsRouter(accounts));
  api.use("/projects", projectsRouter(accounts));
  api.use("/projects/:projectId/members", membersRouter(accounts));
  api.use("/projects/:projectId/invitations", projectInvitationsRouter(accounts));
  api.use("/projects/:projectId/audit", auditRouter(accounts));
  api.use("/projects/:projectId/models", modelsRouter(deps));
  const runQueue = deps.runQueue ?? lazyRunQueue(deps.config.DATABASE_URL, deps.log);
  api.use(
    "/projects/:projectId/runs",
    runsRouter({ db: deps.db, queue: runQueue, queueCap: loadRunSettings().queueCap }),
  );
  api.use("/notifications", notificationsRouter(deps));
  api.use(
    "/projects/:projectId/reductions",
    reductionsRouter({ db: deps.db, queue: runQueue, queueCap: loadRunSettings().queueCap }),
  );
  api.use("/projects/:projectId/model-hierarchy", modelHierarchyRouter(deps));
  api.use("/automata", automataRouter(deps));
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
  return app;
}
