import { useEffect, useRef, useState, type ReactNode } from 'react';
import Container from 'react-bootstrap/Container';
import Nav from 'react-bootstrap/Nav';
import NavDropdown from 'react-bootstrap/NavDropdown';
import Navbar from 'react-bootstrap/Navbar';
import { Link, NavLink, useLocation } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Logo } from '@/components/ui/logo';

export type ShellLink = { to: string; label: string; end?: boolean };
/** A guild's pages under its name, for a member of several guilds (one menu each keeps the bar short). */
export type ShellMenu = { label: string; links: ShellLink[] };

type AppShellProps = {
  signedIn: boolean;
  /** Links between Dashboard and Profile, e.g. one per guild directory. */
  guildLinks?: ShellLink[];
  /** Menus after the links, e.g. one per guild when she belongs to several. */
  guildMenus?: ShellMenu[];
  showInbox?: boolean;
  onSignOut?: () => void;
  signingOut?: boolean;
  children: ReactNode;
};

export function AppShell({ signedIn, guildLinks = [], guildMenus = [], showInbox = false, onSignOut, signingOut, children }: AppShellProps) {
  const [expanded, setExpanded] = useState(false);
  const location = useLocation();
  const mainRef = useRef<HTMLElement>(null);
  const firstRender = useRef(true);

  // After client-side navigation, start screen readers and keyboard users at the new content.
  useEffect(() => {
    setExpanded(false);
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    mainRef.current?.focus();
  }, [location.pathname]);

  return (
    <div className="d-flex flex-column min-vh-100">
      <a href="#main-content" className="skip-link visually-hidden-focusable">
        Skip to main content
      </a>
      <header>
        <Navbar expand="xl" className="app-navbar" expanded={expanded} onToggle={setExpanded}>
          <Container>
            <Navbar.Brand as={Link} to={paths.home.getHref()} className="py-1">
              <Logo title="Selvage, go to dashboard" height={36} />
            </Navbar.Brand>
            <Navbar.Toggle aria-controls="main-navigation" label="Menu" />
            <Navbar.Collapse id="main-navigation">
              <Nav as="nav" aria-label="Main" className="ms-auto align-items-xl-center">
                {signedIn ? (
                  <>
                    <Nav.Link as={NavLink} to={paths.home.getHref()} end>
                      Dashboard
                    </Nav.Link>
                    {guildMenus.map((menu) => (
                      <NavDropdown
                        key={menu.label}
                        title={menu.label}
                        id={`menu-${menu.label.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`}
                        active={menu.links.some((l) => location.pathname.startsWith(l.to))}
                      >
                        {menu.links.map((link) => (
                          <NavDropdown.Item key={link.to} as={NavLink} to={link.to} end={link.end}>
                            {link.label}
                          </NavDropdown.Item>
                        ))}
                      </NavDropdown>
                    ))}
                    {guildLinks.map((link) => (
                      <Nav.Link key={link.to} as={NavLink} to={link.to} end={link.end}>
                        {link.label}
                      </Nav.Link>
                    ))}
                    <Nav.Link as={NavLink} to={paths.profile.getHref()}>
                      Profile
                    </Nav.Link>
                    {showInbox && (
                      <Nav.Link as={NavLink} to={paths.devInbox.getHref()}>
                        Inbox (dev)
                      </Nav.Link>
                    )}
                    <Nav.Link as="button" type="button" onClick={onSignOut} disabled={signingOut} className="text-start">
                      Sign out
                    </Nav.Link>
                  </>
                ) : (
                  <>
                    {showInbox && (
                      <Nav.Link as={NavLink} to={paths.devInbox.getHref()}>
                        Inbox (dev)
                      </Nav.Link>
                    )}
                    <Nav.Link as={NavLink} to={paths.signIn.getHref()}>
                      Sign in
                    </Nav.Link>
                  </>
                )}
              </Nav>
            </Navbar.Collapse>
          </Container>
        </Navbar>
      </header>
      <main id="main-content" ref={mainRef} tabIndex={-1} className="flex-grow-1 py-4">
        <Container>{children}</Container>
      </main>
      <footer className="border-top py-3 mt-4">
        <Container className="text-body-secondary">Selvage · for quilt guilds and their bees</Container>
      </footer>
    </div>
  );
}
