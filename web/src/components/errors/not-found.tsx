import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { usePageTitle } from '@/components/ui/page-title';

export function NotFound() {
  usePageTitle('Page not found');
  return (
    <section aria-labelledby="not-found-title">
      <h1 id="not-found-title">Page not found</h1>
      <p>We could not find the page you asked for. The link may be mistyped, or the page may have moved.</p>
      <Link to={paths.home.getHref()} className="btn btn-primary">
        Go to the dashboard
      </Link>
    </section>
  );
}
