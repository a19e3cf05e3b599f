import Card from 'react-bootstrap/Card';
import { env } from '@/config/env';
import { DirectoryForm } from '@/features/profile/components/directory-form';
import { LeaveGuildSection } from '@/features/departures/components/leave-guild-section';
import { MailPreferencesForm } from '@/features/mail-preferences/components/mail-preferences-form';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useProfile } from '@/features/profile/api/get-profile';
import { ChangeEmailForm, ChangePasswordForm, NameForm } from '@/features/profile/components/profile-forms';
import { useUser } from '@/lib/auth';

export default function ProfileRoute() {
  usePageTitle('Profile');
  const profile = useProfile();
  const { data: user } = useUser();

  return (
    <>
      <div className="page-header">
        <h1>Profile</h1>
        <p className="lead mb-0">Your name, e-mail address and password.</p>
      </div>
      <Row xs={1} lg={2} className="g-4">
        <Col>
          <Card as="section" aria-labelledby="name-heading" className="mb-4">
            <Card.Body>
              <h2 id="name-heading" className="h3 mb-3">
                Your name
              </h2>
              {profile.isPending && <PageSpinner />}
              {profile.isError && <ErrorAlert error={profile.error} />}
              {profile.data && <NameForm name={profile.data.name} />}
            </Card.Body>
          </Card>
          <Card as="section" aria-labelledby="email-heading">
            <Card.Body>
              <h2 id="email-heading" className="h3 mb-3">
                E-mail address
              </h2>
              <ChangeEmailForm currentEmail={profile.data?.email ?? user?.email} />
            </Card.Body>
          </Card>
        </Col>
        <Col>
          <Card as="section" aria-labelledby="password-heading">
            <Card.Body>
              <h2 id="password-heading" className="h3 mb-3">
                Password
              </h2>
              <ChangePasswordForm />
            </Card.Body>
          </Card>
          <Card as="section" aria-labelledby="directory-heading" className="mt-4">
            <Card.Body>
              <h2 id="directory-heading" className="h3 mb-3">
                What other members see
              </h2>
              <DirectoryForm />
            </Card.Body>
          </Card>
          <Card as="section" aria-labelledby="data-heading" className="mt-4">
            <Card.Body>
              <h2 id="data-heading" className="h3 mb-3">
                Your data
              </h2>
              <p>Download everything Selvage holds about you: your account, guilds, bees and blocks, dues and fees, and show entries.</p>
              <div className="d-flex flex-wrap gap-3">
                <a href={`${env.apiBaseUrl}/profile/export.pdf`} className="tap-link" download>
                  My data as a readable PDF
                </a>
                <a href={`${env.apiBaseUrl}/profile/export.json`} className="tap-link" download>
                  My data as JSON (for computers)
                </a>
              </div>
            </Card.Body>
          </Card>
          <Card as="section" aria-labelledby="leave-heading" className="mt-4">
            <Card.Body>
              <h2 id="leave-heading" className="h3 mb-3">
                Leaving a guild
              </h2>
              <LeaveGuildSection />
            </Card.Body>
          </Card>
          <Card as="section" aria-labelledby="mail-heading" className="mt-4">
            <Card.Body>
              <h2 id="mail-heading" className="h3 mb-3">
                E-mails
              </h2>
              <MailPreferencesForm />
            </Card.Body>
          </Card>
        </Col>
      </Row>
    </>
  );
}
