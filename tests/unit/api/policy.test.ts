import { describe, expect, it } from 'vitest';
import { POLICY, roleMay } from '@/lib/auth/policy';
import { navigationFor } from '@/lib/auth/navigation';
import { ROLES, roleRank } from '@/lib/auth/roles';

// The role table of product.md ("People and roles").
describe('policy table', () => {
  it('should let only admins manage members', () => {
    for (const action of ['members.read', 'members.invite', 'members.update', 'members.remove'] as const) {
      expect(ROLES.filter((r) => roleMay(r, action))).toEqual(['admin']);
    }
  });

  it('should let every role read the studio', () => {
    expect(ROLES.every((r) => roleMay(r, 'studio.read'))).toBe(true);
    expect(Object.keys(POLICY)).toContain('studio.read');
  });

  it('should rank admin above producer above advisor above operator', () => {
    expect(roleRank('admin')).toBeGreaterThan(roleRank('producer'));
    expect(roleRank('producer')).toBeGreaterThan(roleRank('advisor'));
    expect(roleRank('advisor')).toBeGreaterThan(roleRank('operator'));
  });

  it('should show operators only Shows and Deliveries, and Studio only to admins', () => {
    expect(navigationFor('operator').map((n) => n.label)).toEqual(['Shows', 'Deliveries']);
    expect(ROLES.filter((r) => navigationFor(r).some((n) => n.label === 'Studio'))).toEqual(['admin']);
  });
});
