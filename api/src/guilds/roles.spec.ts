import { hasAnyRole, leavesGuildWithoutAdmin, normaliseRoles } from './roles';

describe('roles', () => {
  it('keeps known roles in a fixed order and drops duplicates', () => {
    expect(normaliseRoles(['show_chair', 'admin', 'show_chair'])).toEqual(['admin', 'show_chair']);
  });

  it('lets an admin through every role check, and plain members through none', () => {
    expect(hasAnyRole(['admin'], ['treasurer'])).toBe(true);
    expect(hasAnyRole(['show_chair'], ['treasurer'])).toBe(false);
    expect(hasAnyRole(['treasurer'], ['treasurer', 'admin'])).toBe(true);
    expect(hasAnyRole([], ['treasurer'])).toBe(false);
    expect(hasAnyRole([], [])).toBe(true);
  });

  it('refuses to remove the last active admin', () => {
    const ms = [
      { id: 1, roles: ['admin'], active: true },
      { id: 2, roles: ['treasurer'], active: true },
      { id: 3, roles: ['admin'], active: false },
    ];
    expect(leavesGuildWithoutAdmin(ms, 1, ['treasurer'])).toBe(true);
    expect(leavesGuildWithoutAdmin(ms, 2, ['admin'])).toBe(false);
    expect(leavesGuildWithoutAdmin([...ms, { id: 4, roles: ['admin'], active: true }], 1, [])).toBe(false);
  });
});
