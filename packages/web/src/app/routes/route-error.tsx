import { Button } from '@blueprintjs/core';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';

import { Brand } from '../../components/brand';
import { paths } from '../../config/paths';

/** Shown when a page itself fails to load (a lost connection while loading a route, a bad link). */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  return (
    <main className="wb-route-error" id="main">
      <Brand />
      <h1 className="wb-page-title">
        {notFound ? 'This page is not here' : 'This page did not load'}
      </h1>
      <p>
        {notFound
          ? 'The link may be old or mistyped.'
          : 'Check your connection, then reload the page. Nothing you saved is lost.'}
      </p>
      <p className="wb-route-error-actions">
        {notFound ? null : <Button onClick={() => window.location.reload()}>Reload</Button>}
        <Link to={paths.app.students.getHref()}>Go to your students</Link>
      </p>
    </main>
  );
}
