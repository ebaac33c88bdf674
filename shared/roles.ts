// Per-project roles. Owners manage members, links and deletion; editors change sheets; viewers look and comment.

export const ROLES = ['owner', 'editor', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

const RANK: Record<Role, number> = { viewer: 0, editor: 1, owner: 2 };

/** True when `role` carries at least the rights of `needed`. */
export function roleAtLeast(role: Role, needed: Role): boolean {
  return RANK[role] >= RANK[needed];
}

export const can = {
  readProject: (role: Role) => roleAtLeast(role, 'viewer'),
  editProject: (role: Role) => roleAtLeast(role, 'owner'),
  deleteProject: (role: Role) => roleAtLeast(role, 'owner'),
  manageMembers: (role: Role) => roleAtLeast(role, 'owner'),
  createSheet: (role: Role) => roleAtLeast(role, 'editor'),
  editSheet: (role: Role) => roleAtLeast(role, 'editor'),
  deleteSheet: (role: Role) => roleAtLeast(role, 'editor'),
};
