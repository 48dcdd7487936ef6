import { isRouteErrorResponse, Link, useRouteError } from "react-router-dom";
import { buttonClass } from "../components/Button";
import { FullPageStatus } from "./RootLayout";

/** Last-resort page for a route that failed to load or render. */
export function RouteError() {
  const error = useRouteError();
  const missing = isRouteErrorResponse(error) && error.status === 404;
  return (
    <FullPageStatus>
      <h1 className="text-xl font-semibold text-ink-950">
        {missing ? "There is no page here" : "This page could not be shown"}
      </h1>
      <p className="max-w-sm text-sm text-ink-600">
        {missing
          ? "The address may be mistyped, or the page has moved."
          : "Reloading usually fixes this, for example after Rillmark was updated."}
      </p>
      <div className="flex gap-2">
        <button
          type="button"
          className={buttonClass("secondary")}
          onClick={() => window.location.reload()}
        >
          Reload
        </button>
        <Link to="/" className={buttonClass()}>
          Go to your projects
        </Link>
      </div>
    </FullPageStatus>
  );
}

export function NotFound() {
  return (
    <FullPageStatus>
      <h1 className="text-xl font-semibold text-ink-950">There is no page here</h1>
      <p className="max-w-sm text-sm text-ink-600">
        The address may be mistyped, or the page has moved.
      </p>
      <Link to="/" className={buttonClass()}>
        Go to your projects
      </Link>
    </FullPageStatus>
  );
}
