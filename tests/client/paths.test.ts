import { describe, expect, it } from 'vitest';
import { safeNext, signInPath } from '../../client/src/config/paths';

describe('safeNext', () => {
  it.each([
    ['/jobs', '/jobs'],
    ['/users?tab=2#x', '/users?tab=2#x'],
    [null, '/'],
    ['', '/'],
    ['https://elsewhere.example/', '/'],
    ['//elsewhere.example/x', '/'],
    ['/\\elsewhere.example', '/'],
    ['javascript:alert(1)', '/'],
    ['/sign-in', '/'],
  ])('%s → %s', (input, expected) => {
    expect(safeNext(input)).toBe(expected);
  });

  it('carries the page into the sign-in link', () => {
    expect(signInPath('/users?x=1')).toBe('/sign-in?next=%2Fusers%3Fx%3D1');
    expect(signInPath('/')).toBe('/sign-in');
  });
});
