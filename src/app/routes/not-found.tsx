import { Link } from "react-router-dom";

export function NotFoundRoute() {
  return (
    <section className="mx-auto max-w-lg py-16 text-center" data-testid="not-found">
      <p className="text-sm font-semibold text-brand-700">404</p>
      <h1 className="mt-2 text-2xl font-semibold">This page does not exist</h1>
      <p className="mt-2 text-slate-600">
        The address may be mistyped, or the item may have been deleted or moved to a project you are not in.
      </p>
      <Link
        to="/"
        className="mt-6 inline-block rounded-md bg-brand-700 px-4 py-2 text-sm font-medium text-white hover:bg-brand-800"
      >
        Back to the overview
      </Link>
    </section>
  );
}
