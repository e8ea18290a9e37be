// Every route the API serves, as declared by its route group: the app mounts groups through the registry, so the
// registry cannot miss one. Read it with routeRegistry(app).routes, e.g. to generate an OpenAPI document: each entry
// has its full path (Express and OpenAPI syntax), method, tag, access rule, zod schemas and success statuses.
import type { Express, Router } from "express";
import type { RouteGroup, RouteRecord } from "./route-group";

export interface ApiRoute extends RouteRecord {
  /** Full path from the server root in Express syntax: /api/projects/:projectId/models/:modelId. */
  fullPath: string;
  /** The same path in OpenAPI syntax: /api/projects/{projectId}/models/{modelId}. */
  openApiPath: string;
  /** The group's tag (its resource name). */
  tag: string;
}

/** Express's "/" inside a group is the group's own path: /projects and /projects/ are one route. */
function joinPath(...parts: string[]): string {
  const joined = parts.join("").replace(/\/+/g, "/");
  return joined.length > 1 ? joined.replace(/\/$/, "") : joined;
}

export class RouteRegistry {
  private readonly groups: { prefix: string; group: RouteGroup }[] = [];

  /** `prefix` is where `parent` itself is mounted (the API root, /api). */
  constructor(private readonly prefix: string) {}

  mount(parent: Router, group: RouteGroup): void {
    parent.use(group.mountPath, group.router);
    this.groups.push({ prefix: this.prefix, group });
  }

  get routes(): ApiRoute[] {
    return this.groups.flatMap(({ prefix, group }) =>
      group.routes.map((r) => {
        const fullPath = joinPath(prefix, group.mountPath, r.path);
        return { ...r, fullPath, openApiPath: fullPath.replace(/:([A-Za-z0-9_]+)/g, "{$1}"), tag: group.tag };
      }),
    );
  }
}

const registries = new WeakMap<Express, RouteRegistry>();

export function attachRouteRegistry(app: Express, registry: RouteRegistry): void {
  registries.set(app, registry);
}

/** The registry of an app built by createApp(). */
export function routeRegistry(app: Express): RouteRegistry {
  const registry = registries.get(app);
  if (!registry) throw new Error("routeRegistry(app): this app was not built by createApp()");
  return registry;
}
