import Button from 'react-bootstrap/Button';

/** Self-contained (no router, no queries) so it can render when everything else has failed. */
export function ErrorFallback() {
  return (
    <div className="centred-layout">
      <main id="main-content" className="centred-card">
        <h1>Something went wrong</h1>
        <p>
          Sorry, this page ran into a problem. Your work that was already saved is safe. Reloading the page usually
          fixes it.
        </p>
        <div className="d-flex flex-wrap gap-2">
          <Button variant="primary" onClick={() => window.location.reload()}>
            Reload the page
          </Button>
          <Button variant="outline-primary" href="/">
            Go to the dashboard
          </Button>
        </div>
      </main>
    </div>
  );
}
