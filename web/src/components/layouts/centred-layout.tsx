import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Logo } from '@/components/ui/logo';

export function CentredLayout({ children }: { children: ReactNode }) {
  return (
    <div className="centred-layout">
      <a href="#main-content" className="skip-link visually-hidden-focusable">
        Skip to main content
      </a>
      <header className="mb-4">
        <Link to={paths.home.getHref()} className="tap-link">
          <Logo title="Selvage, go to the start page" height={44} />
        </Link>
      </header>
      <main id="main-content" tabIndex={-1} className="centred-card">
        {children}
      </main>
      <footer className="mt-4 text-body-secondary text-center">Selvage · for quilt guilds and their bees</footer>
    </div>
  );
}
