import { TestBed } from '@angular/core/testing';
import { DEFAULT_KEY_MAP, actionFor, keyName } from './grade-keys';
import { KeyMapStore } from './key-map-store';

describe('KeyMapStore and key names', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => localStorage.clear());

  it('names keys as the map stores them', () => {
    const k = (key: string, mods: Partial<KeyboardEvent> = {}) => keyName({ key, shiftKey: false, ctrlKey: false, altKey: false, metaKey: false, ...mods });
    expect(k('P', { shiftKey: true })).toBe('p');
    expect(k('+', { shiftKey: true })).toBe('+');
    expect(k('Enter', { shiftKey: true })).toBe('Shift+Enter');
    expect(k(' ')).toBe('Space');
    expect(k('s', { ctrlKey: true })).toBeNull();
    expect(actionFor(DEFAULT_KEY_MAP, 'Shift+Enter')).toBe('rowPlus');
  });

  it('moves a key to the action it is given, keeps it in storage, and resets', () => {
    const store = TestBed.inject(KeyMapStore);
    const outcome = store.assign('rowPlus', 'r');
    expect(outcome).toEqual({ ok: true, movedFrom: 'right' });
    expect(store.map().rowPlus).toEqual(['p', 'Shift+Enter', 'r']);
    expect(store.map().right).toEqual([]);
    expect(JSON.parse(localStorage.getItem('trenchwork.gradeKeyMap.v1') ?? '{}').rowPlus).toContain('r');

    TestBed.resetTestingModule();
    expect(TestBed.inject(KeyMapStore).map().rowPlus).toContain('r');
    TestBed.inject(KeyMapStore).reset();
    expect(TestBed.inject(KeyMapStore).map()).toEqual(DEFAULT_KEY_MAP);
    expect(localStorage.getItem('trenchwork.gradeKeyMap.v1')).toBeNull();
  });

  it('refuses the keys the grid keeps for moving and digits', () => {
    const store = TestBed.inject(KeyMapStore);
    expect(store.assign('plus', 'ArrowDown').ok).toBe(false);
    expect(store.assign('plus', '5').ok).toBe(false);
    expect(store.map()).toEqual(DEFAULT_KEY_MAP);
  });
});
