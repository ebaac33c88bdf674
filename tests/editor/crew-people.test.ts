// The crew list names each person once, however many tabs they have the sheet open in; the cursors stay per tab.
import { describe, expect, it } from 'vitest';
import { crewList, crewPeople } from '../../editor/presence/crew';

const state = (id: string, name: string, readOnly = false, cursor: { x: number; y: number } | null = null) => ({ user: { id, name, readOnly }, cursor, selection: [] });

describe('the crew, one entry per person', () => {
  it('lists a colleague with two tabs once, with both tabs counted and both cursors kept', () => {
    const states = new Map<number, Record<string, unknown>>([
      [1, state('me', 'Ann Self')],
      [2, state('rosa', 'Rosa Almeida', false, { x: 10, y: 10 })],
      [3, state('rosa', 'Rosa Almeida', false, { x: 50, y: 50 })],
      [4, state('dev', 'Dev Okafor')],
    ]);
    const tabs = crewList(states, 1);
    expect(tabs.filter((t) => !t.self).map((t) => t.cursor)).toEqual([null, { x: 10, y: 10 }, { x: 50, y: 50 }]);
    const people = crewPeople(tabs);
    expect(people.map((p) => [p.userId, p.tabs, p.self])).toEqual([
      ['me', 1, true],
      ['dev', 1, false],
      ['rosa', 2, false],
    ]);
  });

  it('keeps this tab’s own entry for the person here, with their other tab counted', () => {
    const tabs = crewList(
      new Map([
        [7, state('me', 'Ann Self')],
        [8, state('me', 'Ann Self')],
      ]),
      8,
    );
    expect(crewPeople(tabs)).toMatchObject([{ userId: 'me', clientId: 8, self: true, tabs: 2 }]);
  });

  it('shows a person as editing when any of their tabs edits (one editor tab, one through a viewer link)', () => {
    const people = crewPeople(crewList(new Map([[1, state('rosa', 'Rosa', true)], [2, state('rosa', 'Rosa', false)]]), 99));
    expect(people).toHaveLength(1);
    expect(people[0].readOnly).toBe(false);
    expect(crewPeople(crewList(new Map([[1, state('ines', 'Ines', true)], [2, state('ines', 'Ines', true)]]), 99))[0].readOnly).toBe(true);
  });

  it('counts unsigned visitors of a viewer link separately (the server gives each its own id)', () => {
    const people = crewPeople(
      crewList(
        new Map([
          [1, state('visitor-1f0c', 'Visitor', true)],
          [2, state('visitor-9ab2', 'Visitor', true)],
        ]),
        99,
      ),
    );
    expect(people.map((p) => p.userId)).toEqual(['visitor-1f0c', 'visitor-9ab2']);
  });
});
