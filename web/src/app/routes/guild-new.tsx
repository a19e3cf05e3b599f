import Card from 'react-bootstrap/Card';
import { useNavigate } from 'react-router-dom';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useCreateGuild } from '@/features/guilds/api/create-guild';
import { NewGuildWizard } from '@/features/guilds/components/new-guild-wizard';

export default function GuildNewRoute() {
  usePageTitle('Start a new guild');
  const navigate = useNavigate();
  const create = useCreateGuild();
  return (
    <>
      <div className="page-header">
        <h1>Start a new guild</h1>
        <p className="lead mb-0">Three short steps. Everything can be changed later.</p>
      </div>
      <Card className="narrow-card">
        <Card.Body>
          <NewGuildWizard
            onCreate={(input) => create.mutateAsync(input)}
            onCreated={(guild) => navigate(paths.members.getHref(guild.id), { state: { notice: `${guild.name} is ready. Invite your members here.` } })}
          />
        </Card.Body>
      </Card>
    </>
  );
}
