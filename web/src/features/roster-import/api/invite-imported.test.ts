import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch } from '@/testing/test-utils';
import { inviteImported } from './invite-imported';

describe('sending invitations after an import', () => {
  it('sends them 100 to a request and adds up what was sent and skipped', async () => {
    const fetchMock = mockFetch({
      'POST /api/guilds/5/roster-import/invitations': (_url, init) => {
        const { membershipIds } = JSON.parse(String(init?.body)) as { membershipIds: number[] };
        return jsonResponse(200, {
          sent: membershipIds.slice(1).map((id) => ({ membershipId: id, name: `Member ${id}`, email: `m${id}@example.org` })),
          skipped: [{ membershipId: membershipIds[0], name: null, reason: 'She already signs in.' }],
        });
      },
    });
    const ids = Array.from({ length: 150 }, (_, i) => i + 1);
    const result = await inviteImported('5', ids);
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(result.sent).toHaveLength(148);
    expect(result.skipped.map((s) => s.membershipId)).toEqual([1, 101]);
  });
});
