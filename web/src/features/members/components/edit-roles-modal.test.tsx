import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { EditRolesModal } from './edit-roles-modal';

describe('EditRolesModal', () => {
  it('sends the day access ends with the roles, or nothing when left empty', async () => {
    const user = userEvent.setup();
    const onSave = vi.fn(async () => undefined);
    const member = { membershipId: 5, name: 'June Pettigrew', roles: [] };
    const { unmount } = render(<EditRolesModal member={member} onHide={() => undefined} onSave={onSave} />);
    await user.click(await screen.findByLabelText('Treasurer'));
    await user.type(screen.getByLabelText(/Access ends on/), '2027-06-30');
    await user.click(screen.getByRole('button', { name: 'Save roles' }));
    expect(onSave).toHaveBeenCalledWith(member, ['treasurer'], '2027-06-30');

    unmount();
    render(<EditRolesModal member={{ ...member, roles: ['treasurer'] }} onHide={() => undefined} onSave={onSave} />);
    await user.click(await screen.findByLabelText('Show chair'));
    await user.click(screen.getByRole('button', { name: 'Save roles' }));
    expect(onSave).toHaveBeenLastCalledWith(expect.objectContaining({ name: 'June Pettigrew' }), ['treasurer', 'show_chair'], '');
  });
});
