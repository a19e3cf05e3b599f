import Alert from 'react-bootstrap/Alert';
import { useState } from 'react';
import Card from 'react-bootstrap/Card';
import Form from 'react-bootstrap/Form';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link, useParams, useLocation } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { OFFICER_INVITE_ROLES, type Role } from '@/config/roles';
import { dashboardQueryOptions } from '@/features/dashboard/api/get-dashboard';
import { useGuild } from '@/features/members/api/get-guild';
import { useMembers, type Member } from '@/features/members/api/get-members';
import { useUpdateMemberRoles } from '@/features/members/api/update-member-roles';
import { EditRolesModal } from '@/features/members/components/edit-roles-modal';
import { InviteMemberForm } from '@/features/members/components/invite-member-form';
import { MemberList } from '@/features/members/components/member-list';
import { PendingInvitations } from '@/features/members/components/pending-invitations';
import { rosterPdfHref, useUpdateMemberDetails } from '@/features/members/api/paper-members';
import { AddPaperMemberForm } from '@/features/members/components/add-paper-member-form';
import { MemberDetailsModal } from '@/features/members/components/member-details-modal';
import { officePaths } from '@/features/offices/lib/paths';
import { EraseMemberDialog } from '@/features/departures/components/erase-member-dialog';
import { RecordDepartureDialog } from '@/features/departures/components/record-departure-dialog';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';

export default function MembersRoute() {
  const notice = (useLocation().state as { notice?: string } | null)?.notice;
  const { guildId = '' } = useParams();
  const guild = useGuild(guildId);
  const members = useMembers(guildId);
  const updateRoles = useUpdateMemberRoles(guildId, [dashboardQueryOptions().queryKey]);
  const [editing, setEditing] = useState<Member | null>(null);
  const updateDetails = useUpdateMemberDetails(guildId);
  const [detailsFor, setDetailsFor] = useState<Member | null>(null);
  const [departing, setDeparting] = useState<Member | null>(null);
  const [erasing, setErasing] = useState<Member | null>(null);
  const [search, setSearch] = useState('');
  usePageTitle(guild.data ? `${guild.data.name} members` : 'Members');

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return (
      <>
        <h1>Member directory</h1>
        <ErrorAlert error={guild.error} />
      </>
    );
  }

  const myRoles = guild.data.myRoles ?? [];
  const isAdmin = myRoles.includes('admin');
  const canInvite = myRoles.some((r) => OFFICER_INVITE_ROLES.includes(r as Role));
  // Officers also see those who have left; they come after the current members.
  const count = members.data?.filter((m) => m.status !== 'left').length;
  const needle = search.trim().toLowerCase();
  const shown = members.data
    ?.filter((m) => !needle || m.name.toLowerCase().includes(needle) || m.email?.toLowerCase().includes(needle))
    .sort((a, b) => Number(a.status === 'left') - Number(b.status === 'left'));

  return (
    <>
      <div className="page-header">
        <h1>{guild.data.name} members</h1>
        <p className="lead mb-0">{guild.data.town}</p>
        {notice && (
          <Alert variant="success" role="status" className="fs-5 mt-3 mb-0">
            {notice}
          </Alert>
        )}
        {canInvite && (
          <a href="#invite-member" className="btn btn-outline-primary mt-3">
            Jump to the invitation form
          </a>
        )}
        <Link to={officePaths.officers.getHref(guildId)} className="btn btn-outline-primary mt-3 ms-sm-2">
          Officers and their terms
        </Link>
        {canInvite && (
          <Link to={paths.rosterImport.getHref(guildId)} className="btn btn-outline-primary mt-3 ms-sm-2">
            Import a roster from a spreadsheet
          </Link>
        )}
        <a href={rosterPdfHref(guildId)} className="btn btn-outline-primary mt-3 ms-sm-2" target="_blank" rel="noopener">
          Print the roster (PDF)
        </a>
      </div>
      <Row className="g-4">
        <Col lg={canInvite ? 7 : 12}>
          <section aria-labelledby="members-heading">
            <h2 id="members-heading" className="mb-3">
              Members{count !== undefined && <span className="text-body-secondary fw-normal"> ({count})</span>}
            </h2>
            {members.isPending && <PageSpinner label="Loading members" />}
            {members.isError && <ErrorAlert error={members.error} />}
            {members.data && members.data.length > 6 && (
              <Form.Group controlId="member-search" className="mb-3" role="search" aria-label="Find a member">
                <Form.Label>Find a member</Form.Label>
                <Form.Control
                  type="search"
                  value={search}
                  onChange={(e) => setSearch(e.currentTarget.value)}
                  aria-describedby="member-search-count"
                  autoComplete="off"
                />
                <Form.Text id="member-search-count" role="status" className="d-block">
                  {needle ? `${shown?.length ?? 0} of ${members.data.length} match.` : 'Type part of a name or e-mail address.'}
                </Form.Text>
              </Form.Group>
            )}
            {shown && <MemberList
                members={shown}
                canEditRoles={isAdmin}
                onEditRoles={setEditing}
                onEditDetails={canInvite ? setDetailsFor : undefined}
                onRecordDeparture={canInvite ? setDeparting : undefined}
                onErase={isAdmin ? setErasing : undefined}
                emptyText={needle ? 'No members match your search.' : undefined}
              />}
          </section>
        </Col>
        {canInvite && (
          <Col lg={5}>
            <Card as="section" id="invite-member" tabIndex={-1} aria-labelledby="invite-heading" className="mb-4">
              <Card.Body>
                <h2 id="invite-heading" className="h3 mb-3">
                  Invite a member
                </h2>
                <InviteMemberForm guildId={guildId} guildName={guild.data.name} />
              </Card.Body>
            </Card>
            <Card as="section" id="add-paper-member" aria-labelledby="paper-heading" className="mb-4">
              <Card.Body>
                <h2 id="paper-heading" className="h3 mb-3">
                  Add a member who has no e-mail
                </h2>
                <AddPaperMemberForm guildId={guildId} />
              </Card.Body>
            </Card>
            <Card as="section" aria-labelledby="pending-heading">
              <Card.Body>
                <h2 id="pending-heading" className="h3 mb-3">
                  Pending invitations
                </h2>
                <PendingInvitations guildId={guildId} />
              </Card.Body>
            </Card>
          </Col>
        )}
      </Row>
      {canInvite && (
        <MemberDetailsModal
          member={detailsFor}
          onHide={() => setDetailsFor(null)}
          onSave={(member, values) => updateDetails.mutateAsync({ membershipId: member.membershipId, values })}
        />
      )}
      {canInvite && (
        <RecordDepartureDialog
          guildId={guildId}
          member={departing && { membershipId: Number(departing.membershipId), name: departing.name }}
          onHide={() => setDeparting(null)}
        />
      )}
      {isAdmin && (
        <EraseMemberDialog guildId={guildId} member={erasing && { membershipId: Number(erasing.membershipId), name: erasing.name }} onHide={() => setErasing(null)} />
      )}
      {isAdmin && (
        <EditRolesModal
          member={editing}
          onHide={() => setEditing(null)}
          onSave={(member, roles, endsOn) => updateRoles.mutateAsync({ membershipId: member.membershipId, roles, endsOn })}
        />
      )}
    </>
  );
}
