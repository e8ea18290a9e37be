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

export interface AppDeps {
  db: Knex;
  log: Logger;
  config: Config;
  /** Folder of the built client; when absent or missing on disk, only the API is served. */
  clientDir?: string;
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
  api.use("/health", healthRouter(deps));
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
