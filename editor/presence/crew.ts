// The crew on a sheet, from awareness: who is here (the server stamps each state's user from the session, so a
// name cannot be claimed), each one's cursor, selection and drag preview, and a colour of their own.
import type { Point } from '../../shared/symbols';

/** What this client publishes about itself (the server adds `user`). */
export interface LocalPresence {
  cursor: Point | null;
  selection: string[];
  drag: { ids: string[]; dx: number; dy: number } | null;
}

export interface CrewMember {
  clientId: number;
  userId: string;
  name: string;
  readOnly: boolean;
  color: string;
  cursor: Point | null;
  selection: string[];
  drag: LocalPresence['drag'];
  /** This browser tab. */
  self: boolean;
}

/** Crew colours: distinct hues kept away from the status tints (green, amber, red) and the phase colours. */
export const CREW_COLORS = ['#7A4FBF', '#C2477F', '#1E8A8A', '#C0601A', '#3558C0', '#6B7F1F'];

function colorIndex(userId: string): number {
  let h = 2166136261;
  for (let i = 0; i < userId.length; i++) h = Math.imul(h ^ userId.charCodeAt(i), 16777619);
  return (h >>> 0) % CREW_COLORS.length;
}

export function crewColor(userId: string): string {
  return CREW_COLORS[colorIndex(userId)];
}

/**
 * Gives the people on the sheet different colours while there are colours enough: each keeps its own colour
 * unless someone earlier (by user id) has it, then takes the next free one. It depends only on who is present,
 * which every browser on the sheet sees alike, so a person has the same colour on every screen.
 */
export function distinctColors<T extends { userId: string; color: string }>(members: T[]): T[] {
  const ids = [...new Set(members.map((m) => m.userId))].sort();
  if (ids.length > CREW_COLORS.length) return members;
  const taken = new Set<number>();
  const chosen = new Map<string, string>();
  for (const id of ids) {
    let i = colorIndex(id);
    while (taken.has(i)) i = (i + 1) % CREW_COLORS.length;
    taken.add(i);
    chosen.set(id, CREW_COLORS[i]);
  }
  return members.map((m) => (m.color === chosen.get(m.userId) ? m : { ...m, color: chosen.get(m.userId)! }));
}

const isPoint = (v: unknown): v is Point =>
  typeof v === 'object' && v !== null && Number.isFinite((v as Point).x) && Number.isFinite((v as Point).y);

/** Reads one awareness state defensively (another client may send anything). */
export function crewMember(clientId: number, state: Record<string, unknown>, selfId: number): CrewMember | null {
  const user = state.user as { id?: unknown; name?: unknown; readOnly?: unknown } | undefined;
  if (!user || typeof user.id !== 'string') return null;
  const drag = state.drag as LocalPresence['drag'];
  const validDrag =
    drag && Array.isArray(drag.ids) && Number.isFinite(drag.dx) && Number.isFinite(drag.dy)
      ? { ids: drag.ids.filter((x): x is string => typeof x === 'string'), dx: drag.dx, dy: drag.dy }
      : null;
  return {
    clientId,
    userId: user.id,
    name: typeof user.name === 'string' && user.name ? user.name : 'Someone',
    readOnly: user.readOnly === true,
    color: crewColor(user.id),
    cursor: isPoint(state.cursor) ? state.cursor : null,
    selection: Array.isArray(state.selection) ? state.selection.filter((x): x is string => typeof x === 'string') : [],
    drag: validDrag,
    self: clientId === selfId,
  };
}

/** Every tab on the sheet (each has its own cursor and selection), this tab first, then by name. */
export function crewList(states: Map<number, Record<string, unknown>>, selfId: number): CrewMember[] {
  const all: CrewMember[] = [];
  for (const [id, state] of states) {
    const m = crewMember(id, state, selfId);
    if (m) all.push(m);
  }
  return all.sort((a, b) => Number(b.self) - Number(a.self) || a.name.localeCompare(b.name));
}

/** A person on the sheet, however many tabs they have it open in. */
export interface CrewPerson extends CrewMember {
  tabs: number;
}

/**
 * One entry per person (by user id; the server stamps it, and gives each unsigned visitor of a viewer link an id
 * of their own) in the order of `tabs`: this tab's entry when the person is the one here, and editing when any of
 * their tabs may edit.
 */
export function crewPeople(tabs: CrewMember[]): CrewPerson[] {
  const byUser = new Map<string, CrewPerson>();
  for (const t of tabs) {
    const seen = byUser.get(t.userId);
    if (!seen) {
      byUser.set(t.userId, { ...t, tabs: 1 });
      continue;
    }
    const kept = t.self && !seen.self ? t : seen;
    byUser.set(t.userId, { ...kept, tabs: seen.tabs + 1, readOnly: seen.readOnly && t.readOnly });
  }
  return [...byUser.values()];
}
