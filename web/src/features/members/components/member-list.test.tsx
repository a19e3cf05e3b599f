import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { MemberList } from './member-list';

describe('MemberList', () => {
  it('shows only the contact details the api sends, phone as a tap-to-call link', () => {
    render(
      <MemberList
        canEditRoles={false}
        onEditRoles={() => undefined}
        members={[
          { membershipId: 1, name: 'Ottoline Marsh', roles: [], phone: '+1 (555) 014-2000', town: 'Wrenfield' },
          { membershipId: 2, name: 'Bea Thistle', roles: ['treasurer'] },
        ]}
      />,
    );
    const [first, second] = screen.getAllByTestId('member-card');
    expect(within(first).getByRole('link', { name: '+1 (555) 014-2000' })).toHaveAttribute('href', 'tel:+15550142000');
    expect(first).toHaveTextContent('Town: Wrenfield');
    expect(within(second).queryByRole('link')).toBeNull();
    expect(second).not.toHaveTextContent('Town');
  });
});
