// The permission matrix of BRIEF §1, in one place. Pure: used by the server to decide and by pages
// to hide controls a user may not use (hiding is a courtesy; the server decides).
import type { Role } from '@/lib/domain/vocabulary';

export const PERMISSIONS = {
  // reading, scoped to the user's sites
  'site.read': { roles: ['admin', 'analyst', 'technician', 'viewer'], writes: false },
  'register.read': { roles: ['admin', 'analyst', 'technician', 'viewer'], writes: false },
  'survey.read': { roles: ['admin', 'analyst', 'technician', 'viewer'], writes: false },
  'audit.read': { roles: ['admin', 'analyst'], writes: false },
  // the register and surveys
  'site.manage': { roles: ['admin'], writes: true },
  'area.write': { roles: ['admin', 'analyst'], writes: true },
  'trap.write': { roles: ['admin', 'analyst'], writes: true },
  'register.import': { roles: ['admin', 'analyst'], writes: true },
  'survey.write': { roles: ['admin', 'analyst'], writes: true },
  // files and their mapping
  'upload.create': { roles: ['admin', 'analyst', 'technician'], writes: true },
  'upload.read': { roles: ['admin', 'analyst', 'technician'], writes: false },
  'mapping.apply': { roles: ['admin', 'analyst'], writes: true },
  'profile.write': { roles: ['admin', 'analyst'], writes: true },
  // review and outcomes
  'verdict.confirm': { roles: ['admin', 'analyst'], writes: true },
  'fieldnote.write': { roles: ['admin', 'analyst', 'technician'], writes: true },
  'workorder.plan': { roles: ['admin', 'analyst'], writes: true },
  'workorder.record': { roles: ['admin', 'analyst', 'technician'], writes: true },
  'report.publish': { roles: ['admin', 'analyst'], writes: true },
  'settings.cost': { roles: ['admin'], writes: true },
  // the account
  'user.manage': { roles: ['admin'], writes: true },
  'token.manage': { roles: ['admin'], writes: true },
  'mailbox.read': { roles: ['admin'], writes: false },
} as const satisfies Record<string, { roles: readonly Role[]; writes: boolean }>;

export type Permission = keyof typeof PERMISSIONS;

export function roleMay(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission].roles as readonly Role[]).includes(role);
}

export function isWrite(permission: Permission): boolean {
  return PERMISSIONS[permission].writes;
}
