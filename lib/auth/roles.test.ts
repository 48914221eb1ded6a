import { describe, expect, it } from 'vitest';
import { ROLES, canSuspend, hasRole, type Role } from './roles';

const person = (id: string, role: Role) => ({ id, role });

// Our own moderation rule (written once in roles.ts): every pair of roles, and oneself.
describe('who may suspend whom', () => {
  const expected: Record<Role, Record<Role, boolean>> = {
    member: { member: false, moderator: false, admin: false },
    moderator: { member: true, moderator: false, admin: false },
    admin: { member: true, moderator: true, admin: false },
  };
  for (const actor of ROLES) {
    for (const target of ROLES) {
      it(`${actor} → ${target}: ${expected[actor][target] ? 'may' : 'may not'}`, () => {
        expect(canSuspend(person('a', actor), person('b', target))).toBe(expected[actor][target]);
      });
    }
  }

  it('nobody suspends themselves', () => {
    for (const role of ROLES) expect(canSuspend(person('same', role), person('same', role))).toBe(false);
  });

  it('ranks roles so an admin may do what a moderator may', () => {
    expect(hasRole({ role: 'admin' }, 'moderator')).toBe(true);
    expect(hasRole({ role: 'moderator' }, 'admin')).toBe(false);
  });
});
