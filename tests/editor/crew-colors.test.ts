// Crew colours: two people on a sheet never share a colour while there are colours enough, and every browser
// (whatever order its awareness lists people in) gives each person the same one.
import { describe, expect, it } from 'vitest';
import { CREW_COLORS, crewColor, distinctColors } from '../../editor/presence/crew';

const member = (userId: string) => ({ userId, color: crewColor(userId) });

/** Two user ids whose own colours collide (by pigeonhole there are some among any seven). */
function collidingPair(): [string, string] {
  const seen = new Map<string, string>();
  for (let i = 0; ; i++) {
    const id = `user-${i}`;
    const c = crewColor(id);
    if (seen.has(c)) return [seen.get(c)!, id];
    seen.set(c, id);
  }
}

describe('crew colours', () => {
  it('gives two people whose own colours collide different colours', () => {
    const [a, b] = collidingPair();
    expect(crewColor(a)).toBe(crewColor(b));
    const out = distinctColors([member(a), member(b)]);
    expect(out[0].color).not.toBe(out[1].color);
    expect(out.every((m) => CREW_COLORS.includes(m.color))).toBe(true);
  });

  it('gives each person the same colour whatever order the list comes in', () => {
    const [a, b] = collidingPair();
    const ids = [a, b, 'user-x', 'user-y'];
    const one = new Map(distinctColors(ids.map(member)).map((m) => [m.userId, m.color]));
    const other = new Map(distinctColors([...ids].reverse().map(member)).map((m) => [m.userId, m.color]));
    expect(other).toEqual(one);
    expect(new Set(one.values()).size).toBe(ids.length);
  });

  it('leaves a person alone on the sheet with their own colour, and one person in two tabs with one colour', () => {
    expect(distinctColors([member('solo')])[0].color).toBe(crewColor('solo'));
    const twice = distinctColors([member('same'), member('same')]);
    expect(twice[0].color).toBe(twice[1].color);
  });
});
