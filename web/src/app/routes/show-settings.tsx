import Alert from 'react-bootstrap/Alert';
import Card from 'react-bootstrap/Card';
import { useLocation, useParams } from 'react-router-dom';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { useAddCategories, useDeleteCategory, useSaveCategory } from '@/features/shows/api/save-category';
import type { Show } from '@/features/shows/api/types';
import { useUpdateShow } from '@/features/shows/api/update-show';
import { CategoriesEditor } from '@/features/shows/components/categories-editor';
import { ShowForm } from '@/features/shows/components/show-form';
import { ChairPageHeader, ShowGate } from '@/features/shows/components/show-gate';

function SettingsPage({ guild, show }: { guild: Guild; show: Show }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const location = useLocation();
  const notice = (location.state as { notice?: string } | null)?.notice;
  const update = useUpdateShow(guildId, showId);
  const save = useSaveCategory(guildId, showId);
  const remove = useDeleteCategory(guildId, showId);
  const addMany = useAddCategories(guildId, showId);
  usePageTitle(`Settings, ${show.name}`);

  return (
    <>
      <ChairPageHeader guildId={guildId} show={show} title="Show settings" />
      {notice && (
        <Alert variant="success" role="status">
          {notice}
        </Alert>
      )}
      <section aria-labelledby="categories-heading" className="mb-5">
        <h2 id="categories-heading" className="mb-3">
          Categories
        </h2>
        <CategoriesEditor
          categories={show.categories}
          onSave={(categoryId, input) => save.mutateAsync({ categoryId, input })}
          onDelete={(category) => remove.mutateAsync(category.id)}
          deleting={remove.isPending}
          deleteError={remove.error}
          onAddMany={(inputs) => addMany.mutateAsync(inputs)}
        />
      </section>
      <section aria-labelledby="settings-heading">
        <h2 id="settings-heading" className="mb-3">
          Dates, entries, sleeve and voting
        </h2>
        <Card className="narrow-card">
          <Card.Body>
            <ShowForm
              key={show.id}
              show={show}
              currency={show.currency}
              timeZone={guild.timeZone}
              onSave={(input) => update.mutateAsync(input)}
            />
          </Card.Body>
        </Card>
      </section>
    </>
  );
}

export default function ShowSettingsRoute() {
  const { guildId = '', showId = '' } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Show settings" chairOnly>
      {({ guild, show }) => <SettingsPage guild={guild} show={show} />}
    </ShowGate>
  );
}
