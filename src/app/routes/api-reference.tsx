import { Alert } from "@/components/ui/alert";
import { useOpenApi } from "@/features/system/api/get-openapi";
import { ApiReference } from "@/features/system/components/api-reference";

export function ApiReferenceRoute() {
  const { data, error, isPending } = useOpenApi();
  if (isPending) return <p className="text-sm text-slate-500">Loading…</p>;
  if (error) return <Alert>{error.message}</Alert>;
  return (
    <section className="max-w-5xl space-y-4">
      <div>
        <h1 className="text-2xl font-semibold">API reference</h1>
        <p className="text-sm text-slate-600">
          {data.info.description} Scripts authenticate with a personal access token from{" "}
          <a className="underline" href="/profile">
            your profile
          </a>{" "}
          as <code>Authorization: Bearer …</code>. The machine-readable document is{" "}
          <a className="underline" href="/api/openapi.json" download>
            openapi.json
          </a>{" "}
          (OpenAPI {data.openapi}).
        </p>
      </div>
      <ApiReference document={data} />
    </section>
  );
}
