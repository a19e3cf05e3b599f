import { fireEvent, render, screen, within } from '@testing-library/react';
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

  it('offers officers "Record that she left" for a member without office, and admins the erase for one who has gone', () => {
    const departed: unknown[] = [];
    const erased: unknown[] = [];
    render(
      <MemberList
        canEditRoles
        onEditRoles={() => undefined}
        onRecordDeparture={(m) => departed.push(m.membershipId)}
        onErase={(m) => erased.push(m.membershipId)}
        members={[
          { membershipId: 1, name: 'Ottoline Marsh', roles: [], status: 'active' },
          { membershipId: 2, name: 'Bea Thistle', roles: ['treasurer'], status: 'active' },
          { membershipId: 3, name: 'Pim Alder', roles: [], status: 'left', leftAt: '2026-11-20T10:00:00.000Z', eraseRequestedAt: '2026-11-20T10:00:00.000Z' },
          { membershipId: 4, name: 'Former member 4', roles: [], status: 'left', erased: true },
        ]}
      />,
    );
    const [ottoline, bea, pim, former] = screen.getAllByTestId('member-card');
    fireEvent.click(within(ottoline).getByRole('button', { name: /^Record that she left.*Ottoline Marsh/ }));
    expect(departed).toEqual([1]);
    // An officer in office hands it on first.
    expect(within(bea).queryByRole('button', { name: /Record that she left/ })).toBeNull();
    expect(within(pim).getByTestId('departure-note')).toHaveTextContent('She asked for her details to be erased.');
    expect(within(pim).queryByRole('button', { name: /Change roles/ })).toBeNull();
    fireEvent.click(within(pim).getByRole('button', { name: /^Erase her personal data.*Pim Alder/ }));
    expect(erased).toEqual([3]);
    expect(within(former).getByTestId('departure-note')).toHaveTextContent('Left; her personal data was erased.');
    expect(within(former).queryByRole('button')).toBeNull();
  });
});
