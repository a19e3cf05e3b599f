import { describe, expect, it } from 'vitest';
import type { SizeRule } from '../api/types';
import { cleanMakers, makersProblem, mmToInchText, readSize, sizeProblem } from './size-rule';

const mm = (inches: number) => inches * 25.4;
const medium: SizeRule = { kind: 'perimeter', minMm: mm(160), minInclusive: true, maxMm: mm(240), maxInclusive: true };
const large: SizeRule = { kind: 'perimeter', minMm: mm(240), minInclusive: false, maxMm: mm(320), maxInclusive: true };

describe('readSize', () => {
  it('reads fractions, decimals and vulgar fractions, and adds up the perimeter', () => {
    expect(readSize('60 1/2', '60½')).toEqual({ widthIn: 60.5, heightIn: 60.5, perimeterIn: 242 });
    expect(readSize('60.5', '59.5')?.perimeterIn).toBe(240);
  });

  it('waits until both sides can be read', () => {
    expect(readSize('60', '')).toBeNull();
    expect(readSize('sixty', '40')).toBeNull();
    expect(readSize('0', '40')).toBeNull();
  });

  it('reads only what the api reads: no decimal comma, no fraction of 1 or more', () => {
    expect(readSize('60,5', '40')).toBeNull();
    expect(readSize('60 3/2', '40')).toBeNull();
  });
});

describe('sizeProblem', () => {
  it('says nothing about a quilt that fits, or a category with no rule', () => {
    expect(sizeProblem(medium, readSize('60', '60'))?.message ?? null).toBeNull();
    expect(sizeProblem({ kind: 'none' }, readSize('200', '200'))?.message ?? null).toBeNull();
    expect(sizeProblem(medium, null)?.message ?? null).toBeNull();
  });

  it('says which limit a quilt breaks and by how much', () => {
    expect(sizeProblem(medium, readSize('60 1/2', '60 1/2'))?.message ?? null).toBe(
      'This category takes quilts at most 240 in around (perimeter); yours is 242 in around, 2 in over.',
    );
    expect(sizeProblem(large, readSize('40', '40'))?.message ?? null).toBe('This category takes quilts more than 240 in around (perimeter); yours is 160 in around, 80 in short.');
  });

  it('puts exactly 240 in Medium and not in Large', () => {
    expect(sizeProblem(medium, readSize('60', '60'))?.message ?? null).toBeNull();
    expect(sizeProblem(large, readSize('60', '60'))?.message ?? null).toBe('This category takes quilts more than 240 in around (perimeter); yours is 240 in around, exactly on the limit.');
    expect(sizeProblem(large, readSize('60 1/8', '60'))?.message ?? null).toBeNull();
  });

  it('checks width against width and height against height', () => {
    const rule: SizeRule = { kind: 'dimensions', maxWidthMm: mm(24), maxHeightMm: mm(36), minWidthMm: null, minHeightMm: null };
    expect(sizeProblem(rule, readSize('24', '36'))?.message ?? null).toBeNull();
    expect(sizeProblem(rule, readSize('36', '24'))).toEqual({ field: 'widthIn', message: 'This category takes quilts at most 24 in wide; yours is 36 in, 12 in too wide.' });
    expect(sizeProblem(rule, readSize('20', '40 1/2'))).toEqual({
      field: 'heightIn',
      message: 'This category takes quilts at most 36 in high; yours is 40 1/2 in, 4 1/2 in too long.',
    });
  });

  it('writes millimetres back as inches', () => {
    expect(mmToInchText(mm(60.5))).toBe('60 1/2');
    expect(mmToInchText(4064)).toBe('160');
  });
});

describe('makers', () => {
  it('counts makers as the api does, once each whatever the case or spacing', () => {
    expect(cleanMakers(['Ann Lee', ' ann  lee ', '', 'Bea'])).toEqual(['Ann Lee', 'Bea']);
  });

  it('refuses too few makers for a group category in the api’s words', () => {
    const group = { name: 'Group quilts', minMakers: 3 };
    expect(makersProblem(group, 2)).toBe('Group quilts is for quilts made by 3 or more people; this one names 2.');
    expect(makersProblem(group, 3)).toBeNull();
    expect(makersProblem({ name: 'Small', minMakers: null }, 1)).toBeNull();
  });
});
