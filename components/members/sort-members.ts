// The members table's sort: by name, by role (owners first) or by last activity (the most recent first;
// never active last). Ties fall back to the name so the order is stable.
import type { MemberSummary } from '@/shared/api';
import type { Role } from '@/shared/roles';

export type MemberSortKey = 'name' | 'role' | 'lastActive';
export interface MemberSort {
  key: MemberSortKey;
  descending: boolean;
}

const ROLE_ORDER: Record<Role, number> = { owner: 0, editor: 1, viewer: 2 };

function compare(a: MemberSummary, b: MemberSummary, key: MemberSortKey): number {
  if (key === 'role') return ROLE_ORDER[a.role] - ROLE_ORDER[b.role];
  if (key === 'lastActive') {
    const at = (m: MemberSummary) => (m.lastActiveAt ? Date.parse(m.lastActiveAt) : -Infinity);
    return at(b) - at(a);
  }
  return a.name.localeCompare(b.name, undefined, { sensitivity: 'base' });
}

export function sortMembers(members: readonly MemberSummary[], sort: MemberSort): MemberSummary[] {
  return [...members].sort((a, b) => {
    const primary = compare(a, b, sort.key);
    const ordered = sort.descending ? -primary : primary;
    return ordered !== 0 ? ordered : a.name.localeCompare(b.name, undefined, { sensitivity: 'base' });
  });
}

/** Pressing the column that is already sorted turns it round; another column starts in its natural order. */
export function nextSort(current: MemberSort, key: MemberSortKey): MemberSort {
  return current.key === key ? { key, descending: !current.descending } : { key, descending: false };
}
