import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { InviteStep } from './invite-step';

const members = [
  { membershipId: 11, name: 'Basil Pinwheel', email: 'basil@example.org', invited: false },
  { membershipId: 12, name: 'Dot Wimble', email: 'dot@example.org', invited: false },
  { membershipId: 13, name: 'Lettice Bodkin', email: 'lettice@example.org', invited: true },
];

describe('inviting imported members', () => {
  it('ticks everyone not yet invited and sends to those still ticked', async () => {
    const onInvite = vi.fn().mockResolvedValue(undefined);
    render(<InviteStep members={members} result={null} onInvite={onInvite} />);
    expect(screen.getByText('1 member already has an invitation waiting.')).toBeInTheDocument();
    expect(screen.getByLabelText('Basil Pinwheel (basil@example.org)')).toBeChecked();
    expect(screen.queryByLabelText(/Lettice/)).not.toBeInTheDocument();
    fireEvent.click(screen.getByLabelText('Dot Wimble (dot@example.org)'));
    fireEvent.click(await screen.findByRole('button', { name: 'Send 1 invitation' }));
    await waitFor(() => expect(onInvite).toHaveBeenCalledWith([11]));
  });

  it('reports what was sent and who was skipped', () => {
    render(
      <InviteStep
        members={members}
        result={{ sent: [{ membershipId: 11, name: 'Basil Pinwheel', email: 'basil@example.org' }], skipped: [{ membershipId: 12, name: 'Dot Wimble', reason: 'She already signs in.' }] }}
        onInvite={vi.fn()}
      />,
    );
    expect(screen.getByRole('status')).toHaveTextContent('1 invitation was sent.');
    expect(screen.getByText('Dot Wimble: She already signs in.')).toBeInTheDocument();
  });
});
