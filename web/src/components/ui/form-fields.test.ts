import { describe, expect, it } from 'vitest';
import { ownError } from './form-fields';

describe('a field’s own error', () => {
  it('reads nested and listed fields', () => {
    expect(ownError({ name: 'Give it a name.' }, 'name')).toBe('Give it a name.');
    expect(ownError({ makers: [undefined, 'A maker’s name cannot be empty.'] }, 'makers.1')).toBe('A maker’s name cannot be empty.');
    expect(ownError({ sizeRule: { minIn: 'Too small.' } }, 'sizeRule.minIn')).toBe('Too small.');
  });

  it('leaves a list-wide message to the list instead of spelling its first letter under a box', () => {
    expect(ownError({ makers: 'Group quilts is for quilts made by 3 or more people.' }, 'makers.0')).toBeUndefined();
    expect(ownError({}, 'makers.0')).toBeUndefined();
  });
});
