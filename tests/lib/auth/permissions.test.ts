// The permission matrix of BRIEF §1, cell by cell: every permission × every role.
import { describe, expect, it } from 'vitest';
import { isWrite, PERMISSIONS, roleMay, type Permission } from '@/lib/auth/permissions';
import { ROLES, type Role } from '@/lib/domain/vocabulary';

// Written out independently of lib/auth/permissions.ts from the brief's role table:
// A = admin, N = analyst, T = technician, V = viewer.
const EXPECTED: Record<Permission, string> = {
  'site.read': 'ANTV', 'register.read': 'ANTV', 'survey.read': 'ANTV', 'audit.read': 'AN',
  'site.manage': 'A', 'area.write': 'AN', 'trap.write': 'AN', 'register.import': 'AN', 'survey.write': 'AN',
  'upload.create': 'ANT', 'upload.read': 'ANT', 'mapping.apply': 'AN', 'profile.write': 'AN',
  'verdict.confirm': 'AN', 'fieldnote.write': 'ANT', 'workorder.plan': 'AN', 'workorder.record': 'ANT',
  'report.publish': 'AN', 'settings.cost': 'A', 'user.manage': 'A', 'token.manage': 'A', 'mailbox.read': 'A',
};
const LETTER: Record<Role, string> = { admin: 'A', analyst: 'N', technician: 'T', viewer: 'V' };

describe('permission matrix', () => {
  it('covers exactly the permissions the module defines', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual(Object.keys(PERMISSIONS).sort());
  });

  const cells = (Object.keys(EXPECTED) as Permission[]).flatMap((p) => ROLES.map((r) => [p, r] as const));
  it.each(cells)('%s for %s', (permission, role) => {
    expect(roleMay(role, permission)).toBe(EXPECTED[permission].includes(LETTER[role]));
  });

  it('gives the viewer no write at all', () => {
    const viewerWrites = (Object.keys(PERMISSIONS) as Permission[]).filter((p) => isWrite(p) && roleMay('viewer', p));
    expect(viewerWrites).toEqual([]);
  });
});
