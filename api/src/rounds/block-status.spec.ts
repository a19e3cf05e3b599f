import { isLate } from './block-status';

describe('isLate', () => {
  it('is late only after the due date and only while the block is not on its way', () => {
    expect(isLate('not_started', '2027-03-15', '2027-03-15')).toBe(false); // due today is not late yet
    expect(isLate('not_started', '2027-03-15', '2027-03-16')).toBe(true);
    expect(isLate('made', '2027-03-15', '2027-04-01')).toBe(true);
    expect(isLate('mailed', '2027-03-15', '2027-04-01')).toBe(false);
    expect(isLate('handed_over', '2027-03-15', '2027-04-01')).toBe(false);
    expect(isLate('received', '2027-03-15', '2027-04-01')).toBe(false);
  });
});
