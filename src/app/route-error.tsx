import { Link, useRouteError } from "react-router-dom";
import { errorMessage } from "../lib/api-client.ts";
import { NoOrganisationError } from "../lib/signed-in.tsx";

export function RouteError({ notFound = false }: { notFound?: boolean }) {
  const error = useRouteError();
  const noOrganisation = error instanceof NoOrganisationError;
  return (
    <main className="mx-auto max-w-xl px-6 py-16">
      <h1 className="text-2xl font-bold text-ink-900">
        {notFound ? "Page not found" : noOrganisation ? "No organisation" : "Something went wrong"}
      </h1>
      <p className="mt-2 text-ink-500">{notFound ? "There is no page at this address." : errorMessage(error)}</p>
      <Link to="/" className="mt-6 inline-block font-semibold text-must-700 underline">
        Back to the overview
      </Link>
    </main>
  );
}
