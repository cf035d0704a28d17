import { describe, expect, it } from 'vitest';
import { nextRevision } from '../../shared/domain/revision-letters';

describe('next revision identifier', () => {
  it.each([
    ['A', 'B'],
    ['C', 'D'],
    ['Z', 'AA'],
    ['AZ', 'BA'],
    ['ZZ', 'AAA'],
    ['b', 'c'],
    ['1', '2'],
    ['9', '10'],
    ['2.1', '2.2'],
    ['rev-a', 'rev-a-1'],
  ])('when the last revision is %s, then the next is %s', (current, next) => {
    expect(nextRevision(current)).toBe(next);
  });

  it('when the next identifier is already used, then it is skipped', () => {
    expect(nextRevision('A', new Set(['B', 'C']))).toBe('D');
  });
});
